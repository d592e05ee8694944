import { hostname } from 'node:os';
import type { Job } from 'bullmq';
import type { Redis } from 'ioredis';
import type { Deps } from '../deps';
import type { SolveProgress } from '../../shared/engine/solvers/types';
import type { ProblemSpec } from '../../shared/engine/problem/types';
import type { JobStatus } from '../../shared/schemas/runs';
import type { RunJobRow } from '../models/run-job';
import type { RunRow } from '../models/run';
import { getVersionDocument } from '../services/networks';
import { cancelKey, optimumKey, runChannel, type RunEvent, type SolveJobData } from '../services/queue';
import type { RunsConfig } from '../services/queue-config';
import { refreshRunStatus } from '../services/runs-status';
import type { RunResult } from '../../shared/engine/solvers/orchestrate';
import { runsInStages } from '../../shared/engine/solvers/orchestrate';
import { INTERNAL_ERROR, type StageRequest } from './solve-task';
import type { SlotOutcome, ThreadSlot } from './thread-slot';
import { answerColumnsOf } from '../services/runs/answer-columns';
import {
  processSpreadChild, spreadStage, track, waitOrCollect, SPREAD_CHILD,
  type ChildData, type ChildEnv, type ChildValue, type ParentData, type RunningJobs, type SpreadData,
} from './spread-job';

/**
 * The queue processor of a worker process: claim the job row (attempt + 1, guarded), run the
 * solver in one of this process's solve threads, publish progress, honour cancel requests, and
 * store the outcome only while the claim still holds (UPDATE … WHERE status = 'running' AND
 * attempt = mine) — so a job taken over after a worker died is stored exactly once.
 */
export interface ProcessorEnv {
  deps: Deps;
  config: RunsConfig;
  /** Free solve threads (one per concurrency slot). */
  slots: ThreadSlot[];
  /** Running solves of this process by job id, children of spread solves included (the cancel subscriber looks them up). */
  running: RunningJobs;
  workerName: string;
}

export type ProcessOutcome = 'stale' | 'finished-elsewhere' | 'claimed-elsewhere' | JobStatus | 'lost-claim';

/** Cancel grace: the solver gets this long to return its best answer before its thread is stopped. */
export const CANCEL_GRACE_MS = 800;
/**
 * A staged solve resumed after a cancel merges the answers its children already gave: that merge
 * IS its best answer, so it gets longer than the plain grace (a 320-depot merge took over 800 ms
 * on a busy machine, and the thread was stopped with no answer at all).
 */
export const RESUMED_CANCEL_GRACE_MS = 20_000;

export function workerName(): string {
  return `${hostname()}#${process.pid}`;
}

async function publish(redis: Redis, event: RunEvent): Promise<void> {
  try {
    await redis.publish(runChannel(event.runId), JSON.stringify(event));
  } catch {
    // live events are a convenience; the row is the truth
  }
}

/** Hard limit for one job: its time limit, the bound computation after it (≤ 10 s), a grace. */
export function hardLimitMs(timeLimitSeconds: number, graceSeconds: number): number {
  const bounds = Math.min(10, Math.max(0.5, timeLimitSeconds / 5));
  return Math.round((timeLimitSeconds + bounds + graceSeconds) * 1000);
}

export function createJobProcessor(env: ProcessorEnv) {
  const { deps, config } = env;
  const { RunJob, Run } = deps.models;

  const finishRow = async (jobId: number, attempt: number, fields: Partial<RunJobRow>): Promise<boolean> => {
    const [changed] = await RunJob.update({ ...fields, finishedAt: new Date() }, { where: { id: jobId, status: 'running', attempt } });
    return changed === 1;
  };

  const childEnv = (): ChildEnv => ({ deps, config, slots: env.slots, running: env.running, workerName: env.workerName, cancelGraceMs: CANCEL_GRACE_MS, hardLimitMs: hardLimitMs(3600, config.RUN_GRACE_SECONDS) });

  return async function processSolveJob(entry: Job<ParentData | ChildData>, token?: string): Promise<ProcessOutcome | ChildValue> {
    if (entry.name === SPREAD_CHILD) return processSpreadChild(childEnv(), entry as Job<ChildData>);
    const parent = entry as Job<ParentData>;
    const { jobId, generation } = parent.data;
    const found = await RunJob.findByPk(jobId);
    if (!found) return 'stale';
    const row = found.get({ plain: true }) as RunJobRow;
    if (row.generation !== generation) return 'stale';
    if (row.status !== 'queued' && row.status !== 'running') return 'finished-elsewhere';
    const run = (await Run.findByPk(row.runId))?.get({ plain: true }) as RunRow | undefined;
    // A spread solve coming back from its children: same claim, next stage (cancelled or not: it stores its best answer).
    const resumed = parent.data.spread && row.status === 'running' && row.attempt === parent.data.spread.attempt ? parent.data.spread : undefined;
    if (parent.data.spread && !resumed) return 'claimed-elsewhere';

    // Cancelled (or deleted) before this worker got to it: record that without running.
    if (!run || run.deletedAt || (!resumed && (await deps.redis.exists(cancelKey(config.RUN_QUEUE_NAME, jobId, generation))) === 1)) {
      const [changed] = await RunJob.update(
        { status: 'cancelled', finishedAt: new Date(), error: run && !run.deletedAt ? 'cancelled before it started' : 'the run was deleted' },
        { where: { id: jobId, generation, status: ['queued', 'running'] } },
      );
      if (run) await refreshRunStatus(deps, run.id);
      if (changed && run) await publish(deps.redis, { type: 'status', runId: run.id, jobId, status: 'cancelled' });
      return 'cancelled';
    }

    let attempt: number;
    if (resumed) {
      attempt = resumed.attempt;
      deps.logger.info({ jobId, attempt, stage: resumed.stage, entry: parent.id, worker: env.workerName }, 'spread solve resumed');
    } else {
      attempt = row.attempt + 1;
      const [claimed] = await RunJob.update(
        { status: 'running', attempt, startedAt: new Date(), worker: env.workerName, progress: 0, live: null, error: null },
        { where: { id: jobId, generation, attempt: row.attempt, status: ['queued', 'running'] } },
      );
      if (claimed !== 1) return 'claimed-elsewhere';
      deps.logger.info({ jobId, attempt, entry: parent.id, worker: env.workerName }, 'solve job claimed');
      await refreshRunStatus(deps, run.id);
      await publish(deps.redis, { type: 'status', runId: run.id, jobId, status: 'running' });
    }

    const slot = env.slots.pop();
    if (!slot) throw new Error('no free solve thread (concurrency and slots disagree)');
    try {
      const document = await getVersionDocument(deps, run.organisationId, run.versionId);
      let lastWrite = 0, lastPublish = 0;
      let pendingWrite: Promise<unknown> = Promise.resolve();
      const onProgress = (p: SolveProgress) => {
        const now = Date.now();
        const live = { fraction: p.fraction, iteration: p.iteration, bestValue: p.bestValue, energy: p.energy, stdError: p.stdError };
        if (now - lastPublish >= 200) {
          lastPublish = now;
          void publish(deps.redis, { type: 'progress', runId: run.id, jobId, progress: p.fraction, live });
        }
        if (now - lastWrite >= config.RUN_PROGRESS_WRITE_MS) {
          lastWrite = now;
          pendingWrite = RunJob.update({ progress: Math.min(1, Math.max(0, p.fraction)), live: JSON.stringify(live) }, { where: { id: jobId, status: 'running', attempt } }).catch(() => {});
        }
      };
      // Staged solvers run stage by stage; large stages are spread over the queue (spread-job.ts).
      const startedAt = resumed?.startedAt ?? Date.now();
      const minSpread = config.RUN_SPREAD_MIN_TASKS > 0 ? config.RUN_SPREAD_MIN_TASKS : Number.MAX_SAFE_INTEGER;
      let spread = resumed;
      let stage: StageRequest | undefined;
      if (resumed) {
        // Children still pending (this parent came back through the stalled check): wait again.
        const collected = await waitOrCollect(parent, token, resumed);
        spread = collected.spread;
        stage = { kind: 'resume', startedAt, minSpread, state: resumed.state, answers: collected.answers };
      }      else if (runsInStages(row.solver)) stage = { kind: 'start', startedAt, minSpread };
      const cancelKeySet = () => deps.redis.exists(cancelKey(config.RUN_QUEUE_NAME, jobId, generation)).then((n) => n === 1, () => false);
      const runInThread = async (): Promise<SlotOutcome> => {
        const grace = stage?.kind === 'resume' ? RESUMED_CANCEL_GRACE_MS : CANCEL_GRACE_MS;
        const started = slot.run(
          {
            stage,
            document,
            problem: JSON.parse(run.problem) as ProblemSpec,
            solver: row.solver,
            settings: JSON.parse(row.settings) as Record<string, unknown>,
            seed: run.seed,
            timeLimitSeconds: run.timeLimitSeconds,
          },
          { hardLimitMs: hardLimitMs(Math.max(0, run.timeLimitSeconds - (Date.now() - startedAt) / 1000), config.RUN_GRACE_SECONDS), onProgress },
        );
        // Every cancel of this thread (the flag poll here, the worker's cancel message) gets at least its grace.
        const handle: typeof started = { ...started, cancel: (ms) => started.cancel(Math.max(ms, grace)) };
        const untrack = track(env.running, jobId, handle);
        const cancelled = cancelKeySet;
        // A spread solve resumed after a cancel: stop at once (its remaining stages then run as no-ops).
        if (await cancelled()) handle.cancel(grace);
        // Another job of this run may have proven an optimum (now or while this one runs).
        const readOptimum = () => deps.redis.get(optimumKey(config.RUN_QUEUE_NAME, run.id)).then((v) => { if (v !== null && Number.isFinite(Number(v))) handle.setKnownOptimum(Number(v)); }, () => {});
        void readOptimum();
        // The pub/sub message normally arrives first; this poll covers a missed message.
        const poll = setInterval(() => {
          void cancelled().then((yes) => { if (yes) handle.cancel(grace); });
          void readOptimum();
        }, 500);
        return handle.outcome.finally(() => {
          clearInterval(poll);
          untrack();
        });
      };
      let outcome = await runInThread();
      while (outcome.kind === 'spread') {
        if (await cancelKeySet()) {
          // Cancelled meanwhile: no more children; the stage resumes without answers (its blocks keep their sides).
          stage = { kind: 'resume', startedAt, minSpread, state: outcome.state, answers: [] };
        } else {
          // Leaves this worker (WaitingChildrenError) until the children are done, unless they already are.
          const next = await spreadStage({ deps, config }, parent, token, {
            attempt, startedAt, state: outcome.state, tasks: outcome.tasks, progress: outcome.progress, solver: row.solver, timeLimitSeconds: run.timeLimitSeconds,
          }, spread);
          spread = next.spread;
          stage = { kind: 'resume', startedAt, minSpread, state: outcome.state, answers: next.answers };
        }
        outcome = await runInThread();
      }
      await pendingWrite;

      if ((outcome.kind === 'error' || outcome.kind === 'killed') && outcome.detail) {
        deps.logger.error({ jobId, attempt, solver: row.solver, detail: outcome.detail }, 'solve job failed inside the solver');
      }
      let status: JobStatus;
      let fields: Partial<RunJobRow>;
      if (outcome.kind === 'done' && outcome.result.provenOptimal && !outcome.result.infeasible) {
        // The run's other solvers (heuristics) stop once they reach this value.
        await deps.redis.set(optimumKey(config.RUN_QUEUE_NAME, run.id), String(outcome.result.value), 'EX', 86_400).catch(() => {});
      }
      if (outcome.kind === 'done') {
        status = outcome.cancelled ? 'cancelled' : 'succeeded';
        const result = spread ? withSpreadReport(outcome.result, spread) : outcome.result;
        fields = { status, result: JSON.stringify(result), ...answerColumnsOf(result), progress: 1, error: outcome.cancelled ? 'cancelled; the best answer found until then is kept' : null };
      } else if (outcome.kind === 'error') {
        status = 'failed';
        fields = { status, error: outcome.message };
      } else if (outcome.kind === 'killed') {
        status = outcome.reason === 'cancel' ? 'cancelled' : 'failed';
        fields = { status, error: outcome.message };
      } else {
        status = 'failed';
        fields = { status, error: INTERNAL_ERROR };
      }
      const stored = await finishRow(jobId, attempt, fields);
      await refreshRunStatus(deps, run.id);
      await publish(deps.redis, { type: 'status', runId: run.id, jobId, status });
      return stored ? status : 'lost-claim';
    } finally {
      env.slots.push(slot);
    }
  };
}

/** Which workers answered a spread solve's block tasks (stored with the result; the run view shows the note). */
function withSpreadReport(result: RunResult, spread: SpreadData): RunResult & { spread: { stages: number; batches: number; workers: Record<string, number> } } {
  const names = Object.keys(spread.workers);
  const note = `block solves spread over ${names.length} worker process(es) in ${spread.stage + 1} stage(s), ${spread.created} batch(es): ${names.map((w) => `${w} answered ${spread.workers[w]}`).join(', ')}`;
  return { ...result, notes: [...result.notes, note], spread: { stages: spread.stage + 1, batches: spread.created, workers: spread.workers } };
}

/**
 * A queue entry that failed for good at queue level (stalled too often, database unreachable
 * on every attempt): record it on the row unless the row already moved on.
 */
export async function markEntryFailed(deps: Deps, data: SolveJobData, reason: string): Promise<void> {
  const [changed] = await deps.models.RunJob.update(
    { status: 'failed', finishedAt: new Date(), error: reason },
    { where: { id: data.jobId, generation: data.generation, status: ['queued', 'running'] } },
  );
  if (changed) {
    await refreshRunStatus(deps, data.runId);
    await publish(deps.redis, { type: 'status', runId: data.runId, jobId: data.jobId, status: 'failed' });
  }
}
