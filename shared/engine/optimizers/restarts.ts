import type { MinimizeResult } from './types';

/**
 * Run a minimizer from several starting points and keep the best result; evaluations,
 * iterations and traces are concatenated (trace iterations keep counting across restarts).
 * `run(start, index)` gets each start; `shouldStop` ends the series early between runs.
 */
export function minimizeWithRestarts(
  starts: Float64Array[],
  run: (start: Float64Array, index: number) => MinimizeResult,
  shouldStop?: () => boolean,
): MinimizeResult & { restarts: number; bestRestart: number } {
  let best: MinimizeResult | null = null;
  let bestRestart = 0, evaluations = 0, iterations = 0, done = 0;
  const trace: MinimizeResult['trace'] = [];
  for (let r = 0; r < starts.length; r++) {
    if (r > 0 && shouldStop?.()) break;
    const result = run(starts[r], r);
    for (const p of result.trace) trace.push({ ...p, iteration: p.iteration + iterations, evaluations: p.evaluations + evaluations });
    evaluations += result.evaluations;
    iterations += result.iterations;
    done++;
    if (!best || result.fx < best.fx) { best = result; bestRestart = r; }
  }
  if (!best) throw new Error('minimizeWithRestarts needs at least one start');
  return { ...best, evaluations, iterations, trace, restarts: done, bestRestart };
}
