import { runSeconds } from '../../shared/schemas/runs';
import type { RunDetail, RunJob } from './types';
import { formatSeconds, formatValue } from './format';

export const STATUS_TEXT: Record<string, string> = {
  queued: 'Waiting for a worker',
  running: 'Running',
  succeeded: 'Finished',
  partial: 'Finished (some solvers failed)',
  failed: 'Failed',
  cancelled: 'Cancelled',
  awaiting_payment: 'Waiting for payment',
};

// Browser and server clocks differ a little: never show a negative duration.
const seconds = (from: string | null | undefined, to: string | null | undefined, now: number) => (from ? Math.max(0, ((to ? Date.parse(to) : now) - Date.parse(from)) / 1000) : null);

/**
 * The status line under a solver's progress bar. While the run waits for payment its solvers wait
 * for it too (no worker has them, no clock runs); a finished solver reports its own solving time;
 * "± s" appears only when the energy is an estimate (an exact evaluation has no spread).
 */
export function jobStatusLine(job: RunJob, runStatus: RunDetail['status'], now: number): string {
  if (runStatus === 'awaiting_payment' && job.status === 'queued') return STATUS_TEXT.awaiting_payment;
  const best = job.result?.value ?? job.live?.bestValue;
  const done = job.status === 'succeeded' && !!job.result;
  const elapsed = done ? job.result!.seconds : job.status === 'queued' ? null : seconds(job.startedAt, job.finishedAt, now);
  const parts = [STATUS_TEXT[job.status] ?? job.status];
  if (elapsed !== null) parts.push(formatSeconds(elapsed));
  if (best !== undefined && best !== null) parts.push(`${done ? 'value' : 'best so far'} ${formatValue(best)}`);
  if (job.live?.energy !== undefined && job.status === 'running') {
    const se = job.live.stdError;
    parts.push(`energy ${formatValue(job.live.energy)}${se !== undefined && se > 0 ? ` ± ${formatValue(se)}` : ''}`);
  }
  return parts.join(' · ');
}

/**
 * The run's clock: "Elapsed" while solvers work, "Took" when done — never shorter than its
 * slowest solver (the run's stored times are whole seconds; the solvers' own are not) — and none
 * while the run waits for payment. Run time counts from the release to the queue (runSeconds).
 */
export function runClock(run: Pick<RunDetail, 'status' | 'createdAt' | 'releasedAt' | 'finishedAt' | 'jobs'>, live: boolean, now: number): string {
  if (run.status === 'awaiting_payment') return '';
  const wall = runSeconds(run, now);
  if (live) return wall !== null ? `Elapsed ${formatSeconds(wall)}` : '';
  const slowest = Math.max(0, ...run.jobs.map((j) => j.result?.seconds ?? 0));
  const took = Math.max(wall ?? 0, slowest);
  return wall === null && slowest === 0 ? '' : `Took ${formatSeconds(took)}`;
}
