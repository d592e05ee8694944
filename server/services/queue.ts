import { Queue, type JobsOptions } from 'bullmq';
import type { Redis } from 'ioredis';
import type { Deps } from '../deps';
import { unavailable } from '../lib/http-error';
import { loadRunsConfig, type RunsConfig } from './queue-config';

/**
 * The solve queue (BullMQ on the Redis of config.REDIS_URL). The API only adds, removes and
 * inspects queue entries; worker processes (server/worker.ts) take them. All state that must
 * survive a restart lives in MariaDB (run_jobs) — the queue entry only says "job N, generation G
 * is waiting", so it can always be rebuilt from the table (reconcileQueue).
 */
export interface SolveJobData {
  jobId: number;
  runId: number;
  organisationId: number;
  generation: number;
}

/** Queue entry id: one per job row and generation (a retry is a new generation). */
export const queueEntryId = (jobId: number, generation: number): string => `job-${jobId}-g${generation}`;

/**
 * Redis key that asks the worker running job N (generation G) to stop; expires after a day. The
 * queue name and generation are part of it so a flag can never stop a retried job, or a job of a
 * reset database that reuses the id.
 */
export const cancelKey = (queue: string, jobId: number, generation: number): string => `spinyard:cancel:${queue}:${jobId}:g${generation}`;
/** A value a solver of the run proved optimal (set by the worker that proved it; read by the run's other jobs). */
export const optimumKey = (queue: string, runId: number): string => `spinyard:optimum:${queue}:${runId}`;
/** Pub/sub channel of a queue's cancel requests (message = job id), so workers react within milliseconds. */
export const cancelChannel = (queue: string): string => `spinyard:cancel:${queue}`;
/** Pub/sub channel of one run's live events (progress, status changes). */
export const runChannel = (runId: number): string => `spinyard:run:${runId}`;

export interface RunEvent {
  type: 'progress' | 'status';
  runId: number;
  jobId: number;
  status?: string;
  progress?: number;
  live?: Record<string, number | undefined>;
}

const queues = new WeakMap<object, { queue: Queue; config: RunsConfig }>();

/** The queue handle of this process (one per Deps, sharing deps.redis). */
export function solveQueue(deps: Pick<Deps, 'redis'>): { queue: Queue; config: RunsConfig } {
  let q = queues.get(deps.redis);
  if (!q) {
    const config = loadRunsConfig();
    q = { queue: new Queue(config.RUN_QUEUE_NAME, { connection: deps.redis }), config };
    q.queue.on('error', () => {}); // reported through queueAvailable / 503s, not as crashes
    queues.set(deps.redis, q);
  }
  return q;
}

export async function closeSolveQueue(deps: Pick<Deps, 'redis'>): Promise<void> {
  const q = queues.get(deps.redis);
  if (!q) return;
  queues.delete(deps.redis);
  await q.queue.close().catch(() => {});
}

function withTimeout<T>(p: Promise<T>, ms: number, what: string): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const t = setTimeout(() => reject(new Error(`${what} did not answer within ${ms} ms`)), ms);
    p.then((v) => { clearTimeout(t); resolve(v); }, (e) => { clearTimeout(t); reject(e); });
  });
}

/** True when Redis answers a PING within a second. */
export async function queueAvailable(redis: Redis): Promise<boolean> {
  try {
    if (redis.status === 'wait') await redis.connect().catch(() => {});
    return (await withTimeout(redis.ping(), 1000, 'Redis')) === 'PONG';
  } catch {
    return false;
  }
}

/** 503 with what to do, for endpoints that need the queue. */
export async function assertQueueUp(redis: Redis): Promise<void> {
  if (!(await queueAvailable(redis))) {
    throw unavailable('The solve queue (Redis) cannot be reached right now, so runs cannot be started, cancelled or followed live. Saved runs can still be read; try again in a minute.');
  }
}

const entryOptions = (data: SolveJobData, priority: number): JobsOptions => ({
  jobId: queueEntryId(data.jobId, data.generation),
  priority: Math.max(1, Math.min(2_000_000, Math.round(priority))),
  // The processor records solver failures in the job row itself; queue-level attempts only
  // cover infrastructure trouble (database briefly unreachable).
  attempts: 3,
  backoff: { type: 'exponential', delay: 2000 },
  removeOnComplete: true,
  removeOnFail: true,
});

/** Put jobs on the queue (after their rows were committed). */
export async function enqueueJobs(deps: Pick<Deps, 'redis'>, jobs: SolveJobData[], priority: number): Promise<void> {
  if (jobs.length === 0) return;
  const { queue } = solveQueue(deps);
  await withTimeout(queue.addBulk(jobs.map((data) => ({ name: 'solve', data, opts: entryOptions(data, priority) }))), 5000, 'the solve queue');
}

/** Ask whoever runs these jobs to stop (flag + pub/sub); harmless for jobs not running. */
export async function requestCancel(deps: Pick<Deps, 'redis'>, jobs: { id: number; generation: number }[]): Promise<void> {
  if (jobs.length === 0) return;
  const { config } = solveQueue(deps);
  const multi = deps.redis.multi();
  for (const j of jobs) multi.set(cancelKey(config.RUN_QUEUE_NAME, j.id, j.generation), '1', 'EX', 86_400);
  await withTimeout(multi.exec(), 3000, 'Redis');
  for (const j of jobs) await withTimeout(deps.redis.publish(cancelChannel(config.RUN_QUEUE_NAME), String(j.id)), 3000, 'Redis');
}

/** Remove waiting queue entries (cancelled or deleted before they started); active ones stay. */
export async function removeEntries(deps: Pick<Deps, 'redis'>, entries: { jobId: number; generation: number }[]): Promise<void> {
  const { queue } = solveQueue(deps);
  for (const e of entries) {
    try {
      const job = await queue.getJob(queueEntryId(e.jobId, e.generation));
      if (job && (await job.getState()) !== 'active') await job.remove();
    } catch {
      // locked by a worker that is starting it: the worker sees the row's status and skips it
    }
  }
}

/**
 * Cancel the children of spread solves (server/workers/spread-job.ts): child entries not started
 * leave the queue (when the last one goes, BullMQ hands the parent back to the workers, which
 * store its best answer as cancelled); running children stop on the job's cancel flag.
 */
export async function removeWaitingChildren(deps: Pick<Deps, 'redis'>, entries: { jobId: number; generation: number }[]): Promise<void> {
  const { queue } = solveQueue(deps);
  for (const e of entries) {
    try {
      const job = await queue.getJob(queueEntryId(e.jobId, e.generation));
      if (job) await job.removeUnprocessedChildren();
    } catch {
      // a child being taken right now: it sees the cancel flag and answers at once
    }
  }
}

const LIVE_STATES = new Set(['waiting', 'active', 'delayed', 'prioritized', 'waiting-children']);

/**
 * Re-enqueue every queued or running job whose queue entry is missing (Redis restarted, an
 * enqueue after commit failed, an entry failed at queue level). Run by the API at start, and by
 * every worker at start and then every RUN_RECONCILE_MS (queue-reconciler.ts). Returns how many
 * entries were added.
 */
export async function reconcileQueue(deps: Pick<Deps, 'redis' | 'models' | 'logger'>): Promise<number> {
  if (!(await queueAvailable(deps.redis))) throw new Error('Redis is not reachable');
  const { queue } = solveQueue(deps);
  const { Run, RunJob } = deps.models;
  const rows = await RunJob.findAll({ where: { status: ['queued', 'running'] }, attributes: ['id', 'runId', 'organisationId', 'generation'], limit: 10_000 });
  if (rows.length === 0) return 0;
  const runIds = [...new Set(rows.map((r) => r.get('runId') as number))];
  const runs = await Run.findAll({ where: { id: runIds }, attributes: ['id', 'priority', 'held', 'deletedAt'] });
  const runById = new Map(runs.map((r) => [r.get('id') as number, r.get({ plain: true }) as { priority: number; held: boolean; deletedAt: Date | null }]));
  let added = 0;
  for (const row of rows) {
    const data: SolveJobData = { jobId: row.get('id') as number, runId: row.get('runId') as number, organisationId: row.get('organisationId') as number, generation: row.get('generation') as number };
    const run = runById.get(data.runId);
    if (!run || run.held || run.deletedAt) continue;
    const existing = await queue.getJob(queueEntryId(data.jobId, data.generation));
    const state = existing ? await existing.getState() : 'missing';
    if (LIVE_STATES.has(state)) continue;
    if (existing) await existing.remove().catch(() => {});
    await enqueueJobs(deps, [data], run.priority);
    added++;
  }
  if (added > 0) deps.logger.info({ added }, 'solve queue reconciled: re-enqueued jobs missing from Redis');
  return added;
}
