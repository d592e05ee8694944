import { useRef } from 'react';
import type { ConvergencePoint } from '../charts/convergence';
import type { RunDetail } from './types';

/**
 * While a job runs the service sends only its latest energy (job.live); this keeps the points
 * seen across polls so the chart grows live. Finished jobs use their stored trace instead.
 */
export function useLiveTraces(run: RunDetail | undefined): Record<number, ConvergencePoint[]> {
  const seen = useRef<Record<number, ConvergencePoint[]>>({});
  if (!run) return seen.current;
  const out: Record<number, ConvergencePoint[]> = {};
  for (const job of run.jobs) {
    const stored = job.result?.trace;
    if (stored && stored.length) {
      out[job.id] = stored;
      continue;
    }
    const points = (seen.current[job.id] ??= []);
    const live = job.live;
    if (live && live.energy !== undefined && Number.isFinite(live.energy)) {
      const iteration = live.iteration ?? points.length;
      const last = points[points.length - 1];
      if (!last || last.iteration !== iteration) points.push({ iteration, energy: live.energy, stdError: live.stdError });
    }
    out[job.id] = points;
  }
  seen.current = { ...seen.current, ...out };
  return out;
}
