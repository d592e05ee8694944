/**
 * Registry and orchestration checked with small solvers defined here (brute force, and solvers
 * that misreport on purpose), against textbook max-cut and bisection values.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import type { Problem, ProblemKind } from '../../../shared/engine/problem/types';
import type { SolveResult, SolverDefinition } from '../../../shared/engine/solvers/types';


import { defineSolver } from '../../../shared/engine/solvers/define';
import { intField, settingsObject } from '../../../shared/engine/solvers/settings';
import { createRegistry, UnknownSolverError } from '../../../shared/engine/solvers/registry';
import { createOrchestrator, SolverRefusedError, type BoundsProvider } from '../../../shared/engine/solvers/orchestrate';

const result = (assignment: number[], value: number, extra: Partial<SolveResult> = {}): SolveResult => ({
  value, assignment, bound: null, gap: null, provenOptimal: false, energy: null, expectation: null, params: null, seconds: 0, evaluations: 1, shots: 0, ...extra,
});

/** Exhaustive search over all assignments (k^n), respecting pins; test-only. */
function bruteForce(problem: Problem, feasibleOnly: boolean): { best: number[]; value: number } {
  const { n } = problem.network;
  const sense = problem.kind === 'maxcut' ? 1 : -1;
  let best: number[] = [], bestValue = -Infinity;
  const a = new Array(n).fill(0);
  const total = problem.k ** n;
  for (let code = 0; code < total; code++) {
    let c = code;
    for (let i = 0; i < n; i++) { a[i] = c % problem.k; c = Math.floor(c / problem.k); }
    if (problem.pins.some((p, i) => p >= 0 && a[i] !== p)) continue;
    if (feasibleOnly && problem.kind !== 'maxcut') {
      const counts = new Array(problem.k).fill(0);
      a.forEach((x: number) => counts[x] += problem.network.depotWeight[0]);
      const W = n, dmax = 1;
      if (Math.max(...counts) > ((1 + problem.tolerance) * W) / problem.k + (dmax * (problem.k - 1)) / problem.k + 1e-9) continue;
    }
    let v = 0;
    for (let e = 0; e < problem.network.m; e++) if (a[problem.network.laneFrom[e]] !== a[problem.network.laneTo[e]]) v += problem.network.laneWeight[e];
    if (sense * v > bestValue) { bestValue = sense * v; best = [...a]; }
  }
  return { best, value: sense * bestValue };
}

const solver = (name: string, kinds: ProblemKind[], solve: (p: Problem) => SolveResult, refuses: (p: Problem) => string | null = () => null): SolverDefinition<{ level: number }> => defineSolver({
  name, label: name, family: 'exact', kinds, guarantee: `test solver ${name}`,
  settings: settingsObject({ level: intField(1, 0, 10) }),
  refuses: (p) => refuses(p),
  solve: async (p) => solve(p),
});

const brute = solver('brute', ['maxcut', 'bisection', 'kway'], (p) => {
  const { best, value } = bruteForce(p, true);
  return result(best, value, { bound: value, provenOptimal: true });
}, (p) => (p.network.n > 12 ? `${p.network.n} depots is too many for exhaustive search (at most 12)` : null));
/** Finds the best cut but reports a larger value, a "bound" below that cut, and optimality. */
const boastful = solver('boastful', ['maxcut'], (p) => {
  const { best, value } = bruteForce(p, true);
  return result(best, 999, { bound: value - 1, provenOptimal: true });
});
/** Ignores pins and balance. */
const careless = solver('careless', ['bisection'], (p) => result(new Array(p.network.n).fill(1), 0));

/** A valid upper bound for max-cut: the sum of positive lane weights (common practice). */
const positiveWeightBound: BoundsProvider = (p) => {
  if (p.kind !== 'maxcut') return { bound: null, source: 'none' };
  let s = 0;
  for (const w of p.network.laneWeight) if (w > 0) s += w;
  return { bound: s, source: 'sum of positive weights' };
};

const registry = createRegistry([brute, boastful, careless]);
const orchestrator = createOrchestrator(registry.getSolver, positiveWeightBound);
const ctx = { seed: 1, timeLimitSeconds: 5 };

const complete = (n: number) => compactFromEdges(n, Array.from({ length: n }, (_, i) => Array.from({ length: n - i - 1 }, (_, j) => [i, i + j + 1, 1] as const)).flat());
const cycle = (n: number) => compactFromEdges(n, Array.from({ length: n }, (_, i) => [i, (i + 1) % n, 1] as const));
// Petersen graph: outer 5-cycle, inner pentagram, spokes.
const petersen = compactFromEdges(10, [
  ...[0, 1, 2, 3, 4].map((i) => [i, (i + 1) % 5, 1] as const),
  ...[0, 1, 2, 3, 4].map((i) => [5 + i, 5 + ((i + 2) % 5), 1] as const),
  ...[0, 1, 2, 3, 4].map((i) => [i, 5 + i, 1] as const),
]);

describe('solver registry', () => {
  test('lists name, label, family, kinds and guarantee; filters by kind', () => {
    expect(registry.listSolvers()).toEqual([
      { name: 'brute', label: 'brute', family: 'exact', kinds: ['maxcut', 'bisection', 'kway'], guarantee: 'test solver brute', defaults: { level: 1 } },
      expect.objectContaining({ name: 'boastful' }),
      expect.objectContaining({ name: 'careless' }),
    ]);
    expect(registry.listSolvers('bisection').map((s) => s.name)).toEqual(['brute', 'careless']);
  });

  test('an unknown name is an error listing the valid names', () => {
    expect(() => registry.getSolver('qoaa')).toThrow(UnknownSolverError);
    expect(() => registry.getSolver('qoaa')).toThrow('choose one of: brute, boastful, careless');
  });

  test('duplicate names are refused', () => {
    expect(() => createRegistry([brute, brute])).toThrow('registered as "brute"');
  });
});

describe('solveProblem checks every answer', () => {
  // Textbook max-cut values (common practice, docs/references.md): K_n = ⌊n²/4⌋,
  // C_n = n (even) or n − 1 (odd), Petersen graph = 12.
  test.each([
    ['K5', complete(5), 6], ['K6', complete(6), 9], ['C7', cycle(7), 6], ['C8', cycle(8), 8], ['Petersen', petersen, 12],
  ])('%s: brute force reaches the textbook max-cut, recomputed and proven', async (_name, network, expected) => {
    const r = await orchestrator.solveProblem(bindProblem(network, { kind: 'maxcut' }), 'brute', {}, ctx);
    expect(r.value).toBe(expected);
    expect(r.provenOptimal).toBe(true);
    expect(r.gap).toBe(0);
    expect(r.sense).toBe('max');
    expect(r.infeasible).toBe(false);
  });

  test('the bound kept is the tighter one: on an even cycle (bipartite) both equal the lane count', async () => {
    const r = await orchestrator.solveProblem(bindProblem(cycle(8), { kind: 'maxcut' }), 'brute', {}, ctx);
    expect(r.bound).toBe(8);
  });

  test('textbook minimum bisections (common practice): cycle 2, K6 = 9', async () => {
    const c = await orchestrator.solveProblem(bindProblem(cycle(10), { kind: 'bisection' }), 'brute', {}, ctx);
    expect(c.value).toBe(2);
    expect(c.sense).toBe('min');
    const k = await orchestrator.solveProblem(bindProblem(complete(6), { kind: 'bisection' }), 'brute', {}, ctx);
    expect(k.value).toBe(9);
    expect(k.provenOptimal).toBe(true);
  });

  test('a misreported value is recomputed, a bound below the found cut is discarded, optimality is not taken on trust', async () => {
    const r = await orchestrator.solveProblem(bindProblem(petersen, { kind: 'maxcut' }), 'boastful', {}, ctx);
    expect(r.value).toBe(12);
    expect(r.bound).toBe(15); // the solver's 11 cannot bound a cut of 12; the 15 lanes can
    expect(r.boundSource).toBe('sum of positive weights');
    expect(r.gap).toBeCloseTo(3 / 15, 12);
    expect(r.provenOptimal).toBe(false);
    expect(r.notes.join(' ')).toContain('bound 11 from solver contradicts');
    expect(r.notes.join(' ')).toContain('reported value 999');
    expect(r.notes.join(' ')).toContain('claimed optimality');
  });

  test('a failing bound provider leaves the answer intact, without a gap', async () => {
    const failing = createOrchestrator(registry.getSolver, () => { throw new Error('eigensolver did not converge'); });
    const r = await failing.solveProblem(bindProblem(petersen, { kind: 'maxcut' }), 'boastful', {}, ctx);
    expect(r.value).toBe(12);
    expect(r.bound).toBeNull();
    expect(r.gap).toBeNull();
    expect(r.notes).toContain('no classical bound: eigensolver did not converge');
  });

  test('pins and balance are checked: a one-sided bisection is infeasible, with no gap', async () => {
    const problem = bindProblem(cycle(6), { kind: 'bisection', pins: { '1': 0 } });
    const r = await orchestrator.solveProblem(problem, 'careless', {}, ctx);
    expect(r.infeasible).toBe(true);
    expect(r.gap).toBeNull();
    expect(r.provenOptimal).toBe(false);
    expect(r.notes).toEqual(expect.arrayContaining(['the assignment moves a pinned depot', 'the assignment breaks the balance rule']));
  });

  test('refusals, wrong kinds and bad settings stop before solving', async () => {
    const big = bindProblem(cycle(14), { kind: 'maxcut' });
    await expect(orchestrator.solveProblem(big, 'brute', {}, ctx)).rejects.toThrow(SolverRefusedError);
    await expect(orchestrator.solveProblem(big, 'brute', {}, ctx)).rejects.toThrow('too many for exhaustive search');
    await expect(orchestrator.solveProblem(bindProblem(cycle(6), { kind: 'kway', k: 3 }), 'careless', {}, ctx)).rejects.toThrow('handles balanced bisection, not k-way (k regions)');
    await expect(orchestrator.solveProblem(bindProblem(cycle(6), { kind: 'maxcut' }), 'brute', { level: 'x' }, ctx)).rejects.toThrow('level: must be a number');
  });
});
