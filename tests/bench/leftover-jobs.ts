/**
 * Jobs an interrupted benchmark left `queued` or `running` in its database. Every worker, when it
 * starts, re-enqueues each such row whose queue entry is missing (server/services/queue.ts
 * reconcileQueue) — and each benchmark run has a queue of its own, so all of them are missing —
 * so the next benchmark's workers would solve the leftovers beside the measured runs. The
 * benchmarks that start workers end them as cancelled first (the runs' status follows by the
 * service's own rule), and print what they ended.
 */
import type { Deps } from '../../server/deps';
import { refreshRunStatus } from '../../server/services/runs-status';

export interface LeftoverJob { id: number; runId: number; solver: string; status: string; startedAt: Date | null }

export const LEFTOVER_ERROR = 'left queued or running by an interrupted benchmark; ended before the next one started its workers';

/** Ends every queued or running job of the benchmark's database as cancelled; call it before any worker starts. */
export async function endLeftoverJobs(deps: Deps): Promise<LeftoverJob[]> {
  const { RunJob } = deps.models;
  const rows = (await RunJob.findAll({ where: { status: ['queued', 'running'] }, attributes: ['id', 'runId', 'solver', 'status', 'startedAt'], order: [['id', 'ASC']] }))
    .map((r) => r.get({ plain: true }) as LeftoverJob);
  if (rows.length === 0) return [];
  await RunJob.update({ status: 'cancelled', finishedAt: new Date(), error: LEFTOVER_ERROR }, { where: { id: rows.map((r) => r.id), status: ['queued', 'running'] } });
  for (const runId of new Set(rows.map((r) => r.runId))) await refreshRunStatus(deps, runId);
  return rows;
}

/** One line for the benchmark's output. */
export function describeLeftovers(database: string, jobs: LeftoverJob[]): string {
  if (jobs.length === 0) return `${database}: no jobs left queued or running by an earlier run`;
  const list = jobs.map((j) => `job ${j.id} (run ${j.runId}, ${j.solver}, ${j.status}${j.startedAt ? ` since ${j.startedAt.toISOString()}` : ''})`).join('; ');
  return `${database}: ended ${jobs.length} job(s) an interrupted earlier run left queued or running, as cancelled: ${list}`;
}
