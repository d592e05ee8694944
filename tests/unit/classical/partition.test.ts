import { exactSolver } from '../../../shared/engine/solvers/exact';
import { fmSolver } from '../../../shared/engine/solvers/fm';
import { isBalanced, maxPartWeight, partWeights, respectsPins } from '../../../shared/engine/problem/evaluate';
import { ctx, cycle, grid, path as pathGraph, pinsOf, problemOf, randomGraph } from './helpers';
import { readInstance } from '../../data/load';

describe('fm: textbook minimum bisections (common practice)', () => {
  test('cycle C_40: 2; path P_41: 1; 8×8 grid: L = 8', async () => {
    const settings = fmSolver.parseSettings({});
    expect((await fmSolver.solve(problemOf(40, cycle(40), { kind: 'bisection' }), settings, ctx(0.5))).value).toBe(2);
    expect((await fmSolver.solve(problemOf(41, pathGraph(41), { kind: 'bisection' }), settings, ctx(0.5))).value).toBe(1);
    expect((await fmSolver.solve(problemOf(64, grid(8), { kind: 'bisection' }), settings, ctx(0.5))).value).toBe(8);
  });
  test('G50 (120×25 torus, all weights 1) bisects at 2 × the shorter side = 50 (references.md, torus argument)', async () => {
    const { n, edges } = readInstance('gset', 'G50');
    const r = await fmSolver.solve(problemOf(n, edges, { kind: 'bisection' }), fmSolver.parseSettings({}), ctx(4));
    expect(r.value).toBe(50);
  }, 20000);
});

describe('fm respects the balance rule (several tolerances, weighted depots) and pins', () => {
  const n = 300;
  const edges = randomGraph(n, 0.02, 51, 'real');
  const weights = Array.from({ length: n }, (_, i) => 1 + ((i * 13) % 9));
  test.each([0, 0.05, 0.2, 0.5])('bisection, tolerance %f', async (tolerance) => {
    const pins = { 0: 0, 1: 1, 2: 1, 150: 0 };
    const problem = problemOf(n, edges, { kind: 'bisection', tolerance, pins: pinsOf(pins) }, weights);
    const r = await fmSolver.solve(problem, fmSolver.parseSettings({}), ctx(0.4));
    expect(isBalanced(problem, r.assignment)).toBe(true);
    expect(respectsPins(problem, r.assignment)).toBe(true);
    const [w0, w1] = partWeights(problem, r.assignment);
    expect(Math.max(w0, w1)).toBeLessThanOrEqual(maxPartWeight(problem));
  });
  test('looser tolerance never gives a worse best cut on the same graph (same seed, more freedom)', async () => {
    const strict = problemOf(n, edges, { kind: 'bisection', tolerance: 0 }, weights);
    const loose = problemOf(n, edges, { kind: 'bisection', tolerance: 0.5 }, weights);
    const a = await fmSolver.solve(strict, fmSolver.parseSettings({}), ctx(0.5));
    const b = await fmSolver.solve(loose, fmSolver.parseSettings({}), ctx(0.5));
    // Not a theorem for a heuristic; a 50 % slack should help by a wide margin on this graph.
    expect(b.value).toBeLessThanOrEqual(a.value);
  });
  test.each([3, 4, 5, 8])('k-way, k = %i: every region within the rule, pins kept', async (k) => {
    const pins = { 0: k - 1, 5: 0, 9: 1 };
    const problem = problemOf(n, edges, { kind: 'kway', k, tolerance: 0.05, pins: pinsOf(pins) }, weights);
    const r = await fmSolver.solve(problem, fmSolver.parseSettings({}), ctx(0.4));
    expect(isBalanced(problem, r.assignment)).toBe(true);
    expect(respectsPins(problem, r.assignment)).toBe(true);
    expect(new Set(r.assignment).size).toBe(k);
    expect(Math.max(...partWeights(problem, r.assignment))).toBeLessThanOrEqual(maxPartWeight(problem));
  });
  test('k-way on small graphs: never below the exact optimum, usually at it', async () => {
    let hits = 0;
    for (const seed of [52, 53, 54]) {
      const problem = problemOf(9, randomGraph(9, 0.5, seed, 'real'), { kind: 'kway', k: 3 });
      const opt = (await exactSolver.solve(problem, exactSolver.parseSettings({}), ctx(10))).value;
      const r = await fmSolver.solve(problem, fmSolver.parseSettings({}), ctx(0.3));
      expect(r.value).toBeGreaterThanOrEqual(opt - 1e-9);
      if (Math.abs(r.value - opt) < 1e-9) hits++;
    }
    expect(hits).toBeGreaterThanOrEqual(2);
  });
});

