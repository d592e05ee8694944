/**
 * Large staged solves (qaoa-blocks) shared over every running worker. The run's job entry is the
 * parent; each stage's independent tasks go on the same queue as child entries (BullMQ parent /
 * child jobs), the parent waits in `waiting-children` without holding a worker, and any worker
 * resumes it once the children are done (their answers are the children's return values).
 *
 *  - A worker killed during a child: BullMQ's stalled check puts the child back; it reruns.
 *  - A child that fails for good fails the run's job (failParentOnFailure; worker.ts records it).
 *  - Cancel: the API removes children not started (queue.ts removeWaitingChildren); running ones
 *    see the job's cancel flag and return at once; the parent resumes and stores the best answer.
 *
 * The parent entry's data carries the stage (`spread`), so a parent whose worker died resumes
 * the same stage from the same children's answers.
 */
import { WaitingChildrenError, type Job } from 'bullmq';
import type { Deps } from '../deps';
import { cancelKey, runChannel, solveQueue, type SolveJobData } from '../services/queue';
import type { RunsConfig } from '../services/queue-config';
import type { SlotRun, ThreadSlot } from './thread-slot';

/** Queue entry name of a child (a batch of one stage's tasks). */
export const SPREAD_CHILD = 'spread-tasks';

/** The stage a parent waits on (entry.data.spread). */
export interface SpreadData {
  stage: number;
  /** The job row's claim (attempt) the stages belong to. */
  attempt: number;
  /** Epoch ms the solve began: every stage and child counts the time limit from it. */
  startedAt: number;
  state: unknown;
  progress: { from: number; to: number };
  batches: number;
  /** Child batches put on the queue over all stages so far (the answered ones are in `workers`). */
  created: number;
  /** Child batches answered per worker, over all stages so far. */
  workers: Record<string, number>;
}

export type ParentData = SolveJobData & { spread?: SpreadData };

export interface ChildData {
  parent: SolveJobData;
  attempt: number;
  solver: string;
  stage: number;
  index: number;
  batches: number;
  tasks: unknown[];
  deadline: number;
  progress: { from: number; to: number };
}

export interface ChildValue {
  attempt: number;
  stage: number;
  index: number;
  answers: unknown[];
  worker: string;
}

/** Child entry id: one per parent, stage and batch (adding it again is a no-op while it exists). */
export const childEntryId = (parentId: string, attempt: number, stage: number, index: number): string => `${parentId}-a${attempt}-s${stage}-b${index}`;

/** Tasks per child so a stage makes at most `children` batches (fewer, larger ones cost less queue traffic). */
export function batchesOf<T>(tasks: T[], children: number): T[][] {
  const size = Math.max(1, Math.ceil(tasks.length / Math.max(1, children)));
  const out: T[][] = [];
  for (let i = 0; i < tasks.length; i += size) out.push(tasks.slice(i, i + size));
  return out;
}

/** The answers this stage's children returned (each batch once, in batch order) and who answered them. */
export async function stageAnswers(entry: Job<ParentData>, spread: SpreadData): Promise<{ answers: unknown[]; workers: Record<string, number> }> {
  const values = Object.values(await entry.getChildrenValues<ChildValue>()).filter((v) => v && v.attempt === spread.attempt && v.stage === spread.stage);
  const seen = new Set<number>();
  const answers: unknown[] = [];
  const workers = { ...spread.workers };
  for (const v of values.sort((a, b) => a.index - b.index)) {
    if (seen.has(v.index)) continue;
    seen.add(v.index);
    answers.push(...v.answers);
    workers[v.worker] = (workers[v.worker] ?? 0) + 1;
  }
  return { answers, workers };
}

export interface SpreadEnv {
  deps: Deps;
  config: RunsConfig;
}

/** Put a stage's batches on the queue as children of `entry` (one transaction: addBulk). */
async function addChildren(env: SpreadEnv, entry: Job<ParentData>, spread: SpreadData, solver: string, tasks: unknown[][], deadline: number): Promise<void> {
  const { queue } = solveQueue(env.deps);
  const parent = { jobId: entry.data.jobId, runId: entry.data.runId, organisationId: entry.data.organisationId, generation: entry.data.generation };
  await queue.addBulk(tasks.map((batch, index) => ({
    name: SPREAD_CHILD,
    data: { parent, attempt: spread.attempt, solver, stage: spread.stage, index, batches: tasks.length, tasks: batch, deadline, progress: spread.progress } satisfies ChildData,
    opts: {
      jobId: childEntryId(entry.id!, spread.attempt, spread.stage, index),
      parent: { id: entry.id!, queue: entry.queueQualifiedName },
      failParentOnFailure: true,
      priority: entry.opts.priority,
      attempts: 3,
      backoff: { type: 'exponential', delay: 1000 },
      removeOnComplete: true,
      removeOnFail: true,
    },
  })));
}

/**
 * Hand a stage to the queue: add one child per batch, then record the stage on the parent (in
 * that order: a parent whose worker dies in between redoes the previous step, which gives the
 * same stage again), and leave the worker (WaitingChildrenError) until the children are done —
 * unless they already are, then their answers.
 */
export async function spreadStage(
  env: SpreadEnv, entry: Job<ParentData>, token: string | undefined,
  stage: { attempt: number; startedAt: number; state: unknown; tasks: unknown[]; progress: { from: number; to: number }; solver: string; timeLimitSeconds: number },
  /** The stage before, as collected (its answers counted per worker), if any. */
  previous: SpreadData | undefined,
): Promise<{ answers: unknown[]; spread: SpreadData }> {
  const batches = batchesOf(stage.tasks, env.config.RUN_SPREAD_CHILDREN);
  const spread: SpreadData = {
    stage: (previous?.stage ?? -1) + 1, attempt: stage.attempt, startedAt: stage.startedAt, state: stage.state,
    progress: stage.progress, batches: batches.length, created: (previous?.created ?? 0) + batches.length, workers: previous?.workers ?? {},
  };
  await addChildren(env, entry, spread, stage.solver, batches, stage.startedAt + stage.timeLimitSeconds * 1000);
  await entry.updateData({ ...entry.data, spread });
  return waitOrCollect(entry, token, spread);
}

/**
 * Wait for this stage's children (leaving the worker), or collect their answers when all are in.
 * Batches without an answer (removed by a cancel) are left out: their blocks keep their starting sides.
 */
export async function waitOrCollect(entry: Job<ParentData>, token: string | undefined, spread: SpreadData): Promise<{ answers: unknown[]; spread: SpreadData }> {
  if (token && (await entry.moveToWaitingChildren(token))) throw new WaitingChildrenError();
  const { answers, workers } = await stageAnswers(entry, spread);
  return { answers, spread: { ...spread, workers } };
}

/** Running slot handles per job id (children of one job may run side by side in one process). */
export type RunningJobs = Map<number, Set<SlotRun>>;

export function track(running: RunningJobs, jobId: number, handle: SlotRun): () => void {
  let set = running.get(jobId);
  if (!set) running.set(jobId, (set = new Set()));
  set.add(handle);
  return () => {
    set!.delete(handle);
    if (set!.size === 0 && running.get(jobId) === set) running.delete(jobId);
  };
}

export interface ChildEnv extends SpreadEnv {
  slots: ThreadSlot[];
  running: RunningJobs;
  workerName: string;
  cancelGraceMs: number;
  hardLimitMs: number;
}

/**
 * One child: its batch of tasks in a solve thread (tasks carry their own sub-problems, so no
 * database read). A cancelled job's child answers at once (its tasks see the stop flag).
 */
export async function processSpreadChild(env: ChildEnv, entry: Job<ChildData>): Promise<ChildValue> {
  const { parent, tasks, deadline, solver } = entry.data;
  const flag = cancelKey(env.config.RUN_QUEUE_NAME, parent.jobId, parent.generation);
  const slot = env.slots.pop();
  if (!slot) throw new Error('no free solve thread (concurrency and slots disagree)');
  try {
    const handle = slot.run(
      { stage: { kind: 'tasks', tasks, deadline }, solver, document: null as never, problem: null as never, settings: {}, seed: 0, timeLimitSeconds: Math.max(0, (deadline - Date.now()) / 1000) },
      { hardLimitMs: env.hardLimitMs, onProgress: () => {} },
    );
    const untrack = track(env.running, parent.jobId, handle);
    if ((await env.deps.redis.exists(flag)) === 1) handle.cancel(env.cancelGraceMs);
    const poll = setInterval(() => {
      env.deps.redis.exists(flag).then((n) => { if (n === 1) handle.cancel(env.cancelGraceMs); }, () => {});
    }, 500);
    const outcome = await handle.outcome.finally(() => {
      clearInterval(poll);
      untrack();
    });
    if (outcome.kind !== 'answers') {
      const why = outcome.kind === 'error' || outcome.kind === 'killed' ? outcome.message : outcome.kind;
      throw new Error(`spread tasks of job ${parent.jobId} failed: ${why}`);
    }
    await reportChildDone(env, entry.data);
    return { attempt: entry.data.attempt, stage: entry.data.stage, index: entry.data.index, answers: outcome.answers, worker: env.workerName };
  } finally {
    env.slots.push(slot);
  }
}

/** The job row's progress while its children run: the stage's share times the batches done. */
async function reportChildDone(env: SpreadEnv, data: ChildData): Promise<void> {
  try {
    const key = `spinyard:spread:${env.config.RUN_QUEUE_NAME}:${data.parent.jobId}:g${data.parent.generation}:a${data.attempt}:s${data.stage}`;
    const done = await env.deps.redis.incr(key);
    await env.deps.redis.expire(key, 86_400);
    const progress = data.progress.from + ((data.progress.to - data.progress.from) * Math.min(done, data.batches)) / data.batches;
    await env.deps.models.RunJob.update({ progress }, { where: { id: data.parent.jobId, status: 'running', attempt: data.attempt } });
    await env.deps.redis.publish(runChannel(data.parent.runId), JSON.stringify({ type: 'progress', runId: data.parent.runId, jobId: data.parent.jobId, progress }));
  } catch {
    // progress is a convenience; the answers are the truth
  }
}
