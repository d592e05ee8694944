import { bestSolver } from '../../../shared/engine/solvers/best';
import { exactSolver } from '../../../shared/engine/solvers/exact';
import { isBalanced, respectsPins } from '../../../shared/engine/problem/evaluate';
import { ctx, pinsOf, problemOf, randomGraph } from './helpers';

describe('best: portfolio answer with bound and gap', () => {
  test('small max-cut: exact proves the optimum', async () => {
    const problem = problemOf(18, randomGraph(18, 0.4, 61, 'pm1'));
    const r = await bestSolver.solve(problem, bestSolver.parseSettings({ threads: 1 }), ctx(5));
    const opt = await exactSolver.solve(problem, exactSolver.parseSettings({ threads: 1 }), ctx(5));
    expect(r.value).toBe(opt.value);
    expect(r.provenOptimal).toBe(true);
    expect(r.gap).toBe(0);
  });
  test('medium max-cut (n = 80): tabu + MILP; bound ≥ value, gap as defined, pins kept', async () => {
    const problem = problemOf(80, randomGraph(80, 0.05, 62, 'unit'), { pins: pinsOf({ 0: 1 }) });
    const r = await bestSolver.solve(problem, bestSolver.parseSettings({}), ctx(2));
    expect(r.bound).not.toBeNull();
    expect(r.bound!).toBeGreaterThanOrEqual(r.value);
    expect(r.gap).toBeCloseTo((r.bound! - r.value) / r.bound!, 9); // SolveResult: (bound − value)/bound for max
    expect(respectsPins(problem, r.assignment)).toBe(true);
    expect(r.notes?.join(' ')).toMatch(/milp \+ tabu/);
  }, 30000);
  test('bisection: balanced answer with a lower bound ≤ value', async () => {
    const problem = problemOf(200, randomGraph(200, 0.03, 63, 'real'), { kind: 'bisection' });
    const r = await bestSolver.solve(problem, bestSolver.parseSettings({}), ctx(2));
    expect(isBalanced(problem, r.assignment)).toBe(true);
    expect(r.bound!).toBeLessThanOrEqual(r.value + 1e-9);
    expect(r.gap).toBeCloseTo((r.value - r.bound!) / r.value, 9); // SolveResult: (value − bound)/value for min
  }, 30000);
});
