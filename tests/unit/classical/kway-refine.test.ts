/**
 * k regions: direct k-way FM refinement, iterated V-cycles and the `fm` solver up to k = 32.
 * Each answer's crossing weight is recomputed here from the assignment (problem/evaluate.ts),
 * never taken from the engine's own bookkeeping.
 */
import { DEMO_NETWORKS } from '../../../server/services/demo-networks';
import { kwayDefaults, kwayPartition } from '../../../shared/engine/classical/kway';
import { crossingOf, kwayFmRefine, regionLoads } from '../../../shared/engine/classical/kway-fm';
import { kwayVcycle } from '../../../shared/engine/classical/kway-multilevel';
import { buildCompactNetwork } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { crossingWeight, isBalanced, isFeasible, maxPartWeight, partWeights, respectsPins } from '../../../shared/engine/problem/evaluate';
import { createRng } from '../../../shared/engine/random';
import { partGraph } from '../../../shared/engine/solvers/classical-common';
import { fmSolver } from '../../../shared/engine/solvers/fm';
import { ctx, pinsOf, problemOf, randomGraph } from './helpers';

const n = 400;
const edges = randomGraph(n, 0.03, 71, 'real');
const weights = Array.from({ length: n }, (_, i) => 1 + ((i * 7) % 5));

describe('k-way FM refinement', () => {
  test.each([3, 8, 32])('k = %i: never raises the crossing weight, keeps regions within the limit and pins in place', (k) => {
    const pins = { 0: k - 1, 1: 0, 2: Math.floor(k / 2) };
    const problem = problemOf(n, edges, { kind: 'kway', k, tolerance: 0.03, pins: pinsOf(pins) }, weights);
    const g = partGraph(problem);
    const limit = maxPartWeight(problem);
    const rng = createRng(7);
    const part = kwayPartition(g, problem.pins, k, limit, rng, { ...kwayDefaults, refinePasses: 0 });
    expect(isFeasible(problem, Array.from(part))).toBe(true);
    const before = crossingWeight(problem, Array.from(part));
    const state = kwayFmRefine(g, part, k, limit, rng);
    const after = Array.from(part);
    expect(state.cut).toBeCloseTo(crossingWeight(problem, after), 9);
    expect(state.cut).toBeLessThanOrEqual(before + 1e-9);
    expect(Array.from(state.load)).toEqual(Array.from(partWeights(problem, after)));
    expect(isBalanced(problem, after)).toBe(true);
    expect(respectsPins(problem, after)).toBe(true);
  });

  test('repairs an overweight start: everything in region 0 ends within the limit', () => {
    const k = 6;
    const problem = problemOf(n, edges, { kind: 'kway', k, tolerance: 0.05 }, weights);
    const g = partGraph(problem);
    const part = new Int8Array(n);
    const state = kwayFmRefine(g, part, k, maxPartWeight(problem), createRng(3));
    expect(isBalanced(problem, Array.from(part))).toBe(true);
    expect(state.cut).toBeCloseTo(crossingOf(g, part), 9);
    expect(Math.max(...regionLoads(g, part, k))).toBeLessThanOrEqual(maxPartWeight(problem));
  });

  test('an iterated V-cycle is never worse than its start and keeps pins', () => {
    const big = randomGraph(1500, 0.006, 72, 'unit');
    const k = 8;
    const problem = problemOf(1500, big, { kind: 'kway', k, tolerance: 0.03, pins: pinsOf({ 10: 7, 20: 0 }) });
    const g = partGraph(problem);
    const limit = maxPartWeight(problem);
    const rng = createRng(11);
    const start = kwayPartition(g, problem.pins, k, limit, rng);
    const startCut = crossingWeight(problem, Array.from(start));
    for (let t = 0; t < 3; t++) {
      const next = kwayVcycle(g, k, limit, rng, start);
      expect(crossingWeight(problem, Array.from(next))).toBeLessThanOrEqual(startCut + 1e-9);
      expect(isFeasible(problem, Array.from(next))).toBe(true);
    }
  });
});

describe('fm solver, k regions', () => {
  test('k = 32 with pins on regions 0 and 31: every region within the rule, pins kept, value recomputed', async () => {
    const problem = problemOf(n, edges, { kind: 'kway', k: 32, tolerance: 0.03, pins: pinsOf({ 5: 31, 6: 0 }) }, weights);
    const r = await fmSolver.solve(problem, fmSolver.parseSettings({ cycles: 4 }), ctx(20));
    expect(isFeasible(problem, r.assignment)).toBe(true);
    expect(Math.max(...r.assignment)).toBeLessThan(32);
    expect(r.value).toBeCloseTo(crossingWeight(problem, r.assignment), 9);
    expect(r.assignment[5]).toBe(31);
  });

  // The answer before direct k-way refinement: recursive bisection + greedy moves (kway.ts, as the
  // solver ran it), best of the same number of tries with the same seed. The demo networks are the
  // product's test networks.
  const demos = DEMO_NETWORKS.map((d) => [d.key, d] as const);
  test.each(demos)('demo network %s: never worse than recursive bisection with greedy refinement', async (_key, demo) => {
    const net = buildCompactNetwork({ depots: demo.document.depots, lanes: demo.document.lanes });
    for (const k of [3, 4, 5, 8]) {
      if (net.n < 2 * k) continue;
      const problem = bindProblem(net, { kind: 'kway', k, tolerance: 0.05 });
      const rng = createRng(1);
      let before = Infinity;
      for (let c = 0; c < 6; c++) {
        const a = Array.from(kwayPartition(partGraph(problem), problem.pins, k, maxPartWeight(problem), rng, { ...kwayDefaults, initialTries: 8 }));
        if (isFeasible(problem, a)) before = Math.min(before, crossingWeight(problem, a));
      }
      const r = await fmSolver.solve(problem, fmSolver.parseSettings({ cycles: 6 }), ctx(60, 1));
      expect(isFeasible(problem, r.assignment)).toBe(true);
      expect(r.value).toBeLessThanOrEqual(before + 1e-9);
    }
  });
});
