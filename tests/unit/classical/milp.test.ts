import { exactSolver } from '../../../shared/engine/solvers/exact';
import { milpSolver } from '../../../shared/engine/solvers/milp';
import { isBalanced, respectsPins } from '../../../shared/engine/problem/evaluate';
import { ctx, pinsOf, problemOf, randomGraph } from './helpers';

// HiGHS (the `highs` package, an independent MILP solver) must agree with enumeration.
// Each solve spawns one worker thread (~1 s with the TypeScript loader), so cases are few.
describe('milp (HiGHS) optimum = exact enumeration on the same graphs', () => {
  test('max-cut: ±1 and real weights, with and without pins', async () => {
    const cases = [
      { n: 12, edges: randomGraph(12, 0.5, 41, 'pm1'), spec: {} },
      { n: 13, edges: randomGraph(13, 0.4, 42, 'real'), spec: { pins: pinsOf({ 0: 1, 4: 1 }) } },
    ];
    for (const c of cases) {
      const problem = problemOf(c.n, c.edges, c.spec);
      const opt = await exactSolver.solve(problem, exactSolver.parseSettings({ threads: 1 }), ctx(30));
      const r = await milpSolver.solve(problem, milpSolver.parseSettings({}), ctx(30));
      expect(r.provenOptimal).toBe(true);
      expect(r.value).toBeCloseTo(opt.value, 6);
      expect(r.bound!).toBeGreaterThanOrEqual(r.value - 1e-6);
      expect(r.gap!).toBeLessThan(1e-6);
      expect(respectsPins(problem, r.assignment)).toBe(true);
    }
  }, 60000);

  test('bisection (weighted depots, tolerance) and k-way regions', async () => {
    const weights = Array.from({ length: 12 }, (_, i) => 1 + (i % 3));
    const bis = problemOf(12, randomGraph(12, 0.4, 43, 'real'), { kind: 'bisection', tolerance: 0.1, pins: pinsOf({ 3: 0 }) }, weights);
    const kway = problemOf(8, randomGraph(8, 0.6, 44, 'unit'), { kind: 'kway', k: 3 });
    for (const problem of [bis, kway]) {
      const opt = await exactSolver.solve(problem, exactSolver.parseSettings({ threads: 1 }), ctx(30));
      const r = await milpSolver.solve(problem, milpSolver.parseSettings({}), ctx(30));
      expect(r.provenOptimal).toBe(true);
      expect(r.value).toBeCloseTo(opt.value, 6);
      expect(isBalanced(problem, r.assignment)).toBe(true);
      expect(respectsPins(problem, r.assignment)).toBe(true);
    }
  }, 60000);

  test('a time limit that ends first still gives an answer with a valid dual bound', async () => {
    const problem = problemOf(60, randomGraph(60, 0.5, 45, 'unit'));
    const r = await milpSolver.solve(problem, milpSolver.parseSettings({}), ctx(1.5));
    expect(r.provenOptimal).toBe(false);
    expect(r.bound).not.toBeNull();
    expect(r.bound!).toBeGreaterThanOrEqual(r.value);
    expect(r.gap!).toBeGreaterThan(0);
    expect(r.notes?.join(' ')).toMatch(/time-limit/);
  }, 60000);
});
