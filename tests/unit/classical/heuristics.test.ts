import { annealSolver } from '../../../shared/engine/solvers/anneal';
import { exactSolver } from '../../../shared/engine/solvers/exact';
import { fmSolver } from '../../../shared/engine/solvers/fm';
import { greedySolver } from '../../../shared/engine/solvers/greedy';
import { gwSolver } from '../../../shared/engine/solvers/gw';
import { tabuSolver } from '../../../shared/engine/solvers/tabu';
import { isBalanced, respectsPins, crossingWeight } from '../../../shared/engine/problem/evaluate';
import type { Problem } from '../../../shared/engine/problem/types';
import type { SolverDefinition } from '../../../shared/engine/solvers/types';
import { ctx, pinsOf, problemOf, randomGraph } from './helpers';

// Seeded random graphs n ≤ 16 at several densities, ±1 and positive real weights. The optimum
// comes from `exact`, itself checked against an independent brute force in exact.test.ts.
const graphs: Array<[number, number, 'pm1' | 'real' | 'unit', number]> = [
  [12, 0.3, 'pm1', 21], [14, 0.6, 'real', 22], [16, 0.2, 'unit', 23], [15, 0.5, 'pm1', 24], [16, 0.8, 'real', 25],
];
const pins = { 2: 1, 7: 0 };

async function run(def: SolverDefinition<any>, problem: Problem, seconds = 0.1) {
  return def.solve(problem, def.parseSettings({}), ctx(seconds));
}

describe('max-cut heuristics never beat the exact optimum and respect pins', () => {
  test.each(graphs)('n=%i p=%f %s seed %i', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    for (const pinned of [false, true]) {
      const problem = problemOf(n, edges, pinned ? { pins: pinsOf(pins) } : {});
      const opt = (await run(exactSolver, problem)).value;
      for (const def of [greedySolver, tabuSolver, annealSolver, gwSolver]) {
        const r = await run(def, problem);
        expect(r.value).toBeLessThanOrEqual(opt + 1e-9);
        expect(r.value).toBeCloseTo(crossingWeight(problem, r.assignment), 9);
        expect(respectsPins(problem, r.assignment)).toBe(true);
        expect(r.shots).toBe(0);
        expect(r.energy).toBeNull();
        if (def === tabuSolver) expect(r.value).toBeCloseTo(opt, 9); // small enough for tabu to be exact
      }
    }
  });
});

describe('bisection heuristics never beat the exact optimum, stay balanced and respect pins', () => {
  test.each(graphs)('n=%i p=%f %s seed %i', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    const weights = Array.from({ length: n }, (_, i) => 1 + ((i * 7) % 5));
    const variants = [
      { spec: { kind: 'bisection' as const }, weights: undefined },
      { spec: { kind: 'bisection' as const, tolerance: 0.1, pins: pinsOf(pins) }, weights },
    ];
    for (const v of variants) {
      const problem = problemOf(n, edges, v.spec, v.weights);
      const opt = (await run(exactSolver, problem)).value;
      for (const def of [greedySolver, tabuSolver, annealSolver, fmSolver]) {
        const r = await run(def, problem);
        expect(isBalanced(problem, r.assignment)).toBe(true);
        expect(r.infeasible).toBeUndefined();
        expect(respectsPins(problem, r.assignment)).toBe(true);
        expect(r.value).toBeGreaterThanOrEqual(opt - 1e-9);
        if (def === tabuSolver || def === fmSolver) expect(r.value).toBeCloseTo(opt, 9);
      }
    }
  });
});

describe('kind handling', () => {
  test('solvers that cannot answer a kind say so in plain words', () => {
    const kway = problemOf(10, randomGraph(10, 0.5, 1, 'unit'), { kind: 'kway', k: 3 });
    expect(tabuSolver.refuses(kway, tabuSolver.parseSettings({}))).toMatch(/not k-way/);
    expect(gwSolver.refuses(problemOf(6, randomGraph(6, 0.5, 1, 'unit'), { kind: 'bisection' }), gwSolver.parseSettings({}))).toMatch(/not balanced bisection/);
    expect(fmSolver.refuses(problemOf(6, randomGraph(6, 0.5, 1, 'unit')), fmSolver.parseSettings({}))).toMatch(/not max-cut/);
    expect(tabuSolver.kinds).toEqual(['maxcut', 'bisection']);
  });
  test('settings: defaults, and clear field errors for bad input', () => {
    expect(tabuSolver.parseSettings({}).tenureMin).toBe(3);
    expect(() => tabuSolver.parseSettings({ tenureMin: -2 })).toThrow(/tenureMin: must lie in 1…1000/);
    expect(() => tabuSolver.parseSettings({ tenur: 5 })).toThrow(/tenur: unknown setting/);
    expect(() => annealSolver.parseSettings({ sweeps: 'many' })).toThrow(/sweeps: must be a number/);
    expect(() => exactSolver.parseSettings({ threads: 1.5 })).toThrow(/threads: must be a whole number/);
  });
});
