import { deriveRunStatus, FINISHED_JOB_STATUSES, JOB_STATUSES, type JobProgress } from '../../shared/schemas/runs';
import type { JobStatus, RunDetail } from '../runs/types';

/**
 * The events of a run's progress stream (GET /api/runs/:id/events, server/routes/runs.ts) and
 * how each changes the cached run. Pure, so the rule is tested without a browser.
 *   snapshot — the whole run when the stream opens;
 *   progress — one job's fraction and latest live values (at most every 200 ms per job);
 *   status   — one job changed status (its result is not in the event);
 *   end      — the run finished: its final view; the server closes the stream after it.
 */
export type RunStreamEvent =
  | { type: 'snapshot'; run: RunDetail }
  | { type: 'progress'; jobId: number; progress?: number; live?: Record<string, number | undefined> }
  | { type: 'status'; jobId: number; status?: string }
  | { type: 'end'; run: RunDetail };

/** What the cache should do: the next run, and whether to fetch it once more (a finished job's result). */
export interface RunEventOutcome {
  run: RunDetail | undefined;
  refetch: boolean;
  done: boolean;
}

/** The event named `name` with JSON `data` as the stream sends it, or null when it is not one we read. */
export function parseRunEvent(name: string, data: string): RunStreamEvent | null {
  let body: unknown;
  try {
    body = JSON.parse(data);
  } catch {
    return null;
  }
  if (!body || typeof body !== 'object') return null;
  const b = body as Record<string, unknown>;
  if (name === 'snapshot') return { type: 'snapshot', run: body as RunDetail };
  if (name === 'end' && b.run && typeof b.run === 'object') return { type: 'end', run: b.run as RunDetail };
  if ((name === 'progress' || name === 'status') && typeof b.jobId === 'number') {
    return name === 'progress'
      ? { type: 'progress', jobId: b.jobId, progress: typeof b.progress === 'number' ? b.progress : undefined, live: (b.live ?? undefined) as Record<string, number | undefined> | undefined }
      : { type: 'status', jobId: b.jobId, status: typeof b.status === 'string' ? b.status : undefined };
  }
  return null;
}

/** The run with new jobs; its status by the one rule (deriveRunStatus), as the server derives it. */
function withJobs(run: RunDetail, jobs: RunDetail['jobs']): RunDetail {
  return { ...run, jobs, status: deriveRunStatus(jobs.map((j) => j.status), run.status === 'awaiting_payment') };
}

/** The cached run after one event. A job that finished needs its stored result: refetch the run once. */
export function applyRunEvent(run: RunDetail | undefined, event: RunStreamEvent): RunEventOutcome {
  if (event.type === 'snapshot') return { run: event.run, refetch: false, done: false };
  if (event.type === 'end') return { run: event.run, refetch: false, done: true };
  // A job we do not know (the cache is older than the stream): read the whole run again.
  if (!run || !run.jobs.some((j) => j.id === event.jobId)) return { run, refetch: !!run, done: false };
  if (event.type === 'progress') {
    const jobs = run.jobs.map((j) =>
      j.id !== event.jobId || FINISHED_JOB_STATUSES.includes(j.status)
        ? j
        : { ...j, status: 'running' as JobStatus, progress: event.progress ?? j.progress, live: (event.live as JobProgress | undefined) ?? j.live },
    );
    return { run: withJobs(run, jobs), refetch: false, done: false };
  }
  const status = event.status as JobStatus | undefined;
  if (!status || !JOB_STATUSES.includes(status)) return { run, refetch: true, done: false };
  const jobs = run.jobs.map((j) => (j.id === event.jobId ? { ...j, status } : j));
  return { run: withJobs(run, jobs), refetch: FINISHED_JOB_STATUSES.includes(status), done: false };
}
