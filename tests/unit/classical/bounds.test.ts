import { computeBounds } from '../../../shared/engine/solvers/bounds';
import { exactSolver } from '../../../shared/engine/solvers/exact';
import { maxcutEigenBound, fiedlerValue, bisectionSpectralBound } from '../../../shared/engine/classical/bounds';
import { gapOfKind as gapOf } from '../../../shared/engine/problem/compare';
import { complete, ctx, cycle, grid, petersen, pinsOf, problemOf, randomGraph, type Edge } from './helpers';

const family: Array<[string, number, Edge[]]> = [
  ['K_9', 9, complete(9)],
  ['C_11', 11, cycle(11)],
  ['Petersen', 10, petersen()],
  ['4×4 grid', 16, grid(4)],
  ['G(14, 0.5) ±1', 14, randomGraph(14, 0.5, 31, 'pm1')],
  ['G(15, 0.3) real', 15, randomGraph(15, 0.3, 32, 'real')],
  ['G(16, 0.7) unit', 16, randomGraph(16, 0.7, 33, 'unit')],
  ['G(13, 0.4) real', 13, randomGraph(13, 0.4, 34, 'real')],
];

describe('max-cut bounds (Mohar & Poljak, Czechoslovak Math. J. 40 (1990); Delorme & Poljak 1993)', () => {
  test.each(family)('%s: eigenvalue bounds (plain and shifted) ≥ exact optimum, pinned too', async (_name, n, edges) => {
    const problem = problemOf(n, edges);
    const opt = (await exactSolver.solve(problem, exactSolver.parseSettings({ threads: 1 }), ctx(30))).value;
    const eig = maxcutEigenBound(problem, { knownValue: opt })!;
    expect(eig.plain).toBeGreaterThanOrEqual(opt - 1e-9);
    expect(eig.shifted).toBeGreaterThanOrEqual(opt - 1e-9);
    const report = computeBounds(problem, { knownValue: opt });
    expect(report.bound!).toBeGreaterThanOrEqual(opt - 1e-9);
    expect(gapOf('maxcut', opt, report.bound)).toBeGreaterThanOrEqual(0); // null (a contradicted bound) fails
    expect(report.source.length).toBeGreaterThan(0);
    // Pins only shrink the feasible set: the bound stays valid for the pinned question.
    const pinned = problemOf(n, edges, { pins: pinsOf({ 0: 1, 1: 1 }) });
    const pinnedOpt = (await exactSolver.solve(pinned, exactSolver.parseSettings({ threads: 1 }), ctx(30))).value;
    expect(computeBounds(pinned).bound!).toBeGreaterThanOrEqual(pinnedOpt - 1e-9);
  });

  test('K_n: (n/4)·λmax(L) = n²/4 since λmax(L(K_n)) = n (textbook spectrum, common practice)', () => {
    const eig = maxcutEigenBound(problemOf(8, complete(8)), { shiftSteps: 0 })!;
    expect(eig.plain).toBeCloseTo(16, 6);
  });

  test('C_5: plain bound = (5/4)(2 + 2cos(π/5)) (cycle spectrum, common practice); no shift can lower it', () => {
    const eig = maxcutEigenBound(problemOf(5, cycle(5)))!;
    expect(eig.plain).toBeCloseTo((5 / 4) * (2 + 2 * Math.cos(Math.PI / 5)), 6);
    // C_5 is vertex-transitive: u ↦ λmax(L + diag u) is convex and invariant under the graph's
    // automorphisms, so averaging any u with Σu = 0 over them gives u = 0 — the optimal shift is
    // zero and the plain bound already equals the SDP value (Delorme & Poljak, Math. Programming
    // 62 (1993), vertex-transitive graphs [from memory]; the argument above is common practice). A shift step
    // that went below it would be an invalid bound.
    expect(eig.shifted).toBeGreaterThanOrEqual(eig.plain - 1e-6);
  });

  test('irregular graph (star K_1,7): the diagonal shift tightens the bound a lot (plain = n²/4 = 16, optimum 7)', () => {
    const star: Edge[] = Array.from({ length: 7 }, (_, i) => [0, i + 1, 1] as Edge);
    const eig = maxcutEigenBound(problemOf(8, star), { knownValue: 7 })!;
    expect(eig.plain).toBeCloseTo(16, 6); // λmax(L(K_1,7)) = 8 (textbook spectrum, common practice)
    expect(eig.shifted).toBeGreaterThanOrEqual(7 - 1e-9);
    expect(eig.shifted).toBeLessThan(0.75 * eig.plain);
  });

  test('±1 weights: the sum of positive weights is used when it is tighter (references.md)', () => {
    // A star of −1 lanes plus one +1 lane: eigenvalue bound is large, positive sum is 1.
    const edges: Edge[] = [[0, 1, 1], [0, 2, -1], [0, 3, -1], [0, 4, -1], [2, 3, -1]];
    const report = computeBounds(problemOf(5, edges));
    expect(report.bound).toBe(1);
    expect(report.source).toMatch(/positive/);
  });

  test('sparse Lanczos path (n = 240 > 200, certified by Cholesky) stays above a known cut', () => {
    const edges = randomGraph(240, 0.03, 35, 'unit');
    const problem = problemOf(240, edges);
    // Any cut is a lower bound on the optimum; take the bipartition by index parity.
    let cut = 0;
    for (const [a, b, w] of edges) if (a % 2 !== b % 2) cut += w;
    const eig = maxcutEigenBound(problem, { knownValue: cut })!;
    expect(eig).not.toBeNull();
    expect(eig.shifted).toBeGreaterThanOrEqual(cut);
    const total = edges.length;
    expect(eig.shifted).toBeLessThan(total); // tighter than the trivial bound on this graph
  });
});

describe('bisection lower bounds (Fiedler λ₂; Donath & Hoffman)', () => {
  test.each(family.filter(([name]) => !name.includes('±1')))('%s: spectral bound ≤ exact minimum bisection', async (_name, n, edges) => {
    const problem = problemOf(n, edges, { kind: 'bisection' });
    const opt = (await exactSolver.solve(problem, exactSolver.parseSettings({ threads: 1 }), ctx(30))).value;
    const lam = fiedlerValue(problem)!;
    expect(bisectionSpectralBound(problem, lam)).toBeLessThanOrEqual(opt + 1e-9);
    const report = computeBounds(problem);
    expect(report.bound!).toBeLessThanOrEqual(opt + 1e-9);
    expect(gapOf('bisection', opt, report.bound)).toBeGreaterThanOrEqual(0); // null (a contradicted bound) fails
  });
  test('cycle C_n: λ₂ = 2 − 2cos(2π/n) (cycle spectrum, common practice)', () => {
    expect(fiedlerValue(problemOf(12, cycle(12), { kind: 'bisection' }))!).toBeCloseTo(2 - 2 * Math.cos((2 * Math.PI) / 12), 6);
  });
  test('negative lanes: the bound is the sum of negative weights or better, still ≤ the optimum', async () => {
    const edges = randomGraph(12, 0.5, 36, 'pm1');
    const problem = problemOf(12, edges, { kind: 'bisection' });
    const opt = (await exactSolver.solve(problem, exactSolver.parseSettings({ threads: 1 }), ctx(30))).value;
    const neg = edges.filter((e) => e[2] < 0).reduce((s, e) => s + e[2], 0);
    const report = computeBounds(problem);
    expect(report.bound!).toBeGreaterThanOrEqual(neg);
    expect(report.bound!).toBeLessThanOrEqual(opt + 1e-9);
  });
});
