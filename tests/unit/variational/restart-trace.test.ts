/**
 * Trace points say which optimizer start they belong to, so the run screen can mark each restart
 * on the convergence chart (the energy jumps up where a new start begins).
 */
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import { createRng } from '../../../shared/engine/random';
import { runQaoa } from '../../../shared/engine/variational/qaoa-run';
import { problemOf, randomGraph } from '../encodings/fixtures';

test('QAOA with 3 starts: every trace point carries its start, in order, each start counted once', () => {
  const rng = createRng(5);
  const edges = randomGraph(rng, 6, 0.6, () => 1 + rng.next());
  const encoding = encodeMaxCut(problemOf(6, edges, { kind: 'maxcut' }));
  const out = runQaoa({ encoding, layers: 1, optimizer: 'nelder-mead', shots: 0, restarts: 3, maxIterations: 15, rng: createRng(9) });
  expect(out.restarts).toBe(3);
  const starts = out.trace.map((p) => p.start);
  expect(starts.every((s) => s === 0 || s === 1 || s === 2)).toBe(true);
  // Non-decreasing, and each of the three starts present.
  for (let i = 1; i < starts.length; i++) expect(starts[i]!).toBeGreaterThanOrEqual(starts[i - 1]!);
  expect(new Set(starts)).toEqual(new Set([0, 1, 2]));
  // Iterations keep counting across starts.
  for (let i = 1; i < out.trace.length; i++) expect(out.trace[i].iteration).toBeGreaterThan(out.trace[i - 1].iteration);
});
