import { exactSolver } from '../../../shared/engine/solvers/exact';
import { bruteForce, complete, ctx, cycle, grid, path, petersen, pinsOf, problemOf, randomGraph, type Edge } from './helpers';

const exact = (n: number, edges: Edge[], spec: Record<string, unknown> = {}, weights?: number[], threads = 1) =>
  exactSolver.solve(problemOf(n, edges, spec, weights), exactSolver.parseSettings({ threads }), ctx(60));

describe('exact enumeration: textbook max-cut values (common practice)', () => {
  test.each([4, 5, 7, 10])('K_%i has max-cut ⌊n²/4⌋', async (n) => {
    const r = await exact(n, complete(n));
    expect(r.value).toBe(Math.floor((n * n) / 4));
    expect(r.provenOptimal).toBe(true);
    expect(r.bound).toBe(r.value);
    expect(r.gap).toBe(0);
  });
  test.each([6, 9, 12, 15])('C_%i has max-cut n (even) or n − 1 (odd)', async (n) => {
    expect((await exact(n, cycle(n))).value).toBe(n % 2 === 0 ? n : n - 1);
  });
  test('a bipartite graph (4×4 grid, weighted) cuts its total weight', async () => {
    const edges = grid(4).map(([a, b], i) => [a, b, 1 + (i % 3)] as Edge);
    const total = edges.reduce((s, e) => s + e[2], 0);
    expect((await exact(16, edges)).value).toBe(total);
  });
  test('the Petersen graph has max-cut 12', async () => {
    expect((await exact(10, petersen())).value).toBe(12);
  });
});

describe('exact enumeration: textbook minimum bisections (common practice)', () => {
  test('cycle C_12: 2', async () => expect((await exact(12, cycle(12), { kind: 'bisection' })).value).toBe(2));
  test('path P_11: 1', async () => expect((await exact(11, path(11), { kind: 'bisection' })).value).toBe(1));
  test('4×4 grid: L = 4', async () => expect((await exact(16, grid(4), { kind: 'bisection' })).value).toBe(4));
  test('K_8 (n even): n²/4 = 16', async () => expect((await exact(8, complete(8), { kind: 'bisection' })).value).toBe(16));
});

describe('exact enumeration equals an independent brute force (seeded random graphs)', () => {
  const cases: Array<[number, number, 'unit' | 'pm1' | 'real', number]> = [
    [9, 0.3, 'unit', 1], [11, 0.5, 'pm1', 2], [12, 0.8, 'real', 3], [13, 0.2, 'real', 4], [14, 0.5, 'pm1', 5],
  ];
  test.each(cases)('maxcut n=%i p=%f %s seed %i', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    const r = await exact(n, edges);
    expect(r.value).toBeCloseTo(bruteForce(n, edges, { kind: 'maxcut' }), 9);
    expect(r.provenOptimal).toBe(true);
  });
  test.each(cases)('maxcut with pins n=%i p=%f %s seed %i', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    const pins = { 0: 1, 3: 1, 5: 0 };
    const r = await exact(n, edges, { pins: pinsOf(pins) });
    expect(r.value).toBeCloseTo(bruteForce(n, edges, { kind: 'maxcut', pins }), 9);
    expect([r.assignment[0], r.assignment[3], r.assignment[5]]).toEqual([1, 1, 0]);
  });
  test.each(cases)('bisection n=%i p=%f %s seed %i (tolerance 0 and 0.2, weighted depots)', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    expect((await exact(n, edges, { kind: 'bisection' })).value).toBeCloseTo(bruteForce(n, edges, { kind: 'bisection' }), 9);
    const weights = Array.from({ length: n }, (_, i) => 1 + (i % 4));
    const r = await exact(n, edges, { kind: 'bisection', tolerance: 0.2, pins: pinsOf({ 1: 0 }) }, weights);
    expect(r.value).toBeCloseTo(bruteForce(n, edges, { kind: 'bisection', tolerance: 0.2, weights, pins: { 1: 0 } }), 9);
    expect(r.infeasible).toBeUndefined();
  });
  test.each([[7, 0.5, 'unit', 6], [8, 0.6, 'real', 7]] as const)('kway k=3 n=%i p=%f %s seed %i', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    const r = await exact(n, edges, { kind: 'kway', k: 3 });
    expect(r.value).toBeCloseTo(bruteForce(n, edges, { kind: 'kway', k: 3 }), 9);
    expect(r.provenOptimal).toBe(true);
    const withPins = await exact(n, edges, { kind: 'kway', k: 3, pins: pinsOf({ 0: 2, 1: 2 }), tolerance: 0.3 });
    expect(withPins.value).toBeCloseTo(bruteForce(n, edges, { kind: 'kway', k: 3, pins: { 0: 2, 1: 2 }, tolerance: 0.3 }), 9);
  });
});

describe('exact enumeration limits and threads', () => {
  test('refuses above its limit, naming the limit and the alternatives', () => {
    const problem = problemOf(40, cycle(40));
    const reason = exactSolver.refuses(problem, exactSolver.parseSettings({}));
    expect(reason).toMatch(/32 free depots/);
    expect(reason).toMatch(/39/);
    expect(reason).toMatch(/milp/);
    expect(reason).toMatch(/tabu/);
    expect(exactSolver.refuses(problemOf(30, cycle(30)), exactSolver.parseSettings({}))).toBeNull();
    const kway = problemOf(20, cycle(20), { kind: 'kway', k: 4 });
    expect(exactSolver.refuses(kway, exactSolver.parseSettings({}))).toMatch(/milp|fm/);
  });
  test('two worker threads give the same optimum as one thread (n = 23)', async () => {
    const n = 23;
    const edges = randomGraph(n, 0.3, 11, 'real');
    const one = await exact(n, edges, {}, undefined, 1);
    const two = await exact(n, edges, {}, undefined, 2);
    expect(two.value).toBeCloseTo(one.value, 9);
    expect(two.provenOptimal).toBe(true);
    const bis1 = await exact(n, edges, { kind: 'bisection' }, undefined, 1);
    const bis2 = await exact(n, edges, { kind: 'bisection' }, undefined, 2);
    expect(bis2.value).toBeCloseTo(bis1.value, 9);
  }, 60000);
});
