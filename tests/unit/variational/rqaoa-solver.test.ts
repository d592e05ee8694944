import { getSolver } from '../../../shared/engine/solvers/registry';
import type { SolveResult } from '../../../shared/engine/solvers/types';
import { crossingWeight, isBalanced } from '../../../shared/engine/problem/evaluate';
import { createRng } from '../../../shared/engine/random';
import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import { expectationOfDiagonal, isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import { bruteForceBest, problemOf, random3Regular, randomGraph } from '../encodings/fixtures';
import { gsetRow, readInstance } from '../../data/load';
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';

const ctx = { seed: 1, timeLimitSeconds: 60 };
const solve = async (problem: Parameters<ReturnType<typeof getSolver>['solve']>[0], settings: unknown): Promise<SolveResult> => {
  const d = getSolver('rqaoa');
  const s = d.parseSettings(settings);
  expect(d.refuses(problem, s)).toBeNull();
  return d.solve(problem, s, ctx);
};

describe('rqaoa solver', () => {
  test('max-cut with pins: a valid answer, the value recomputed, first-round params and expectation as qaoa reports them', async () => {
    const rng = createRng(21);
    const p = problemOf(12, randomGraph(rng, 12, 0.4, () => 1 + rng.int(4)), { kind: 'maxcut', pins: { '3': 1 } });
    const r = await solve(p, { refine: false });
    expect(r.assignment).toHaveLength(12);
    expect(r.assignment[2]).toBe(1);
    expect(r.value).toBe(crossingWeight(p, r.assignment));
    expect(r.refinement).toEqual({ applied: false, unrefinedValue: r.value, unrefinedInfeasible: false, moves: 0 });
    // Same convention as qaoa ([γ, β] of createQaoaAnsatz): the statevector at rqaoa's first-round
    // angles has the expected cut rqaoa reports.
    const enc = encodeMaxCut(p);
    const state = createQaoaAnsatz({ numQubits: enc.numQubits, layers: 1, energyDiagonal: isingDiagonal(enc.operator) }).prepare(r.params!);
    expect(r.params).toHaveLength(2);
    expect(expectationOfDiagonal(state, isingDiagonal(enc.valueOperator))).toBeCloseTo(r.expectation!, 10);
    expect(r.energy!).toBeCloseTo(-r.expectation!, 10);
  });

  test('bisection on the penalty encoding: balanced after refinement, unrefined value kept beside it', async () => {
    const rng = createRng(22);
    const p = problemOf(14, randomGraph(rng, 14, 0.35, () => 1 + rng.int(3)), { kind: 'bisection' });
    const r = await solve(p, {});
    expect(isBalanced(p, r.assignment)).toBe(true);
    expect(r.infeasible).toBeUndefined();
    expect(r.refinement!.applied).toBe(true);
    expect(r.value).toBeLessThanOrEqual(r.refinement!.unrefinedInfeasible ? Infinity : r.refinement!.unrefinedValue);
    expect(r.value).toBeGreaterThanOrEqual(bruteForceBest(p).value);
  });

  test('refuses k-way and bisections above its limit with a message naming what to use', () => {
    const d = getSolver('rqaoa');
    const s = d.parseSettings({});
    const rng = createRng(2);
    expect(d.refuses(problemOf(9, randomGraph(rng, 9, 0.5), { kind: 'kway', k: 3 }), s)).toMatch(/k regions/);
    expect(d.refuses(problemOf(120, randomGraph(rng, 120, 0.05), { kind: 'bisection' }), s)).toMatch(/up to 80 free depots.*qaoa-blocks/);
  });

  test('settings: bad values get one message per field', () => {
    const d = getSolver('rqaoa');
    expect(() => d.parseSettings({ stopAt: 40, batch: 2, refine: 'yes', tenur: 1 })).toThrow(/stopAt: must lie in 1…20.*batch: give 'auto'.*refine: must be true or false.*tenur: unknown setting/s);
  });

  test('records every elimination with its depot and round', async () => {
    const rng = createRng(23);
    const p = problemOf(30, randomGraph(rng, 30, 0.2), { kind: 'maxcut' });
    const r = await solve(p, { stopAt: 10 });
    expect(r.recursion!.rounds).toBe(20);
    expect(r.recursion!.eliminationsTotal).toBe(20);
    const ids = new Set(r.recursion!.eliminations.map((e) => e.depot));
    expect(ids.size).toBe(20);
  });
});

describe('rqaoa against published values', () => {
  test('G11 without refinement: within 3 % of the best known cut 564 (Benlic & Hao 2013, tests/data/gset/best-known.csv)', async () => {
    const { n, edges } = readInstance('gset', 'G11');
    expect(gsetRow('G11').best_known).toBe(564);
    const p = bindProblem(compactFromEdges(n, edges), { kind: 'maxcut' });
    const r = await solve(p, { refine: false });
    expect(r.refinement!.applied).toBe(false);
    expect(r.value).toBeGreaterThanOrEqual(0.97 * 564);
  });

  test.each([1, 2])('3-regular, 18 depots: the first round alone expects ≥ 0.6924 of the optimum (Farhi, Goldstone & Gutmann 2014) (seed %i)', async (seed) => {
    const p = problemOf(18, random3Regular(createRng(700 + seed), 18), { kind: 'maxcut' });
    const r = await solve(p, { refine: false });
    const optimum = -isingDiagonal(encodeMaxCut(p).operator).reduce((a, b) => Math.min(a, b), Infinity); // brute force over 2¹⁸ cuts
    expect(r.expectation! / optimum).toBeGreaterThanOrEqual(0.6924);
    expect(r.value).toBeGreaterThanOrEqual(r.expectation!); // the recursion's answer beats its starting state's mean
  });
});
