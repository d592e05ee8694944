/**
 * Path relinking for max-cut and the pool search built on it: the greedy path against a copy
 * recomputed from the edge list, the distance rule of the elite pool, a tabu run that returns
 * once it stalls, and the relinking search against brute-force optima (helpers.ts) on small
 * networks with ±1, real and unit lanes, with and without pins and partition crossover (whose
 * own brute-force check is partition-crossover.test.ts); on a ±1 grid its rounds do cross.
 */
import { createElitePool } from '../../../shared/engine/classical/elite-pool';
import { relinkPath } from '../../../shared/engine/classical/path-relink';
import { relinkDefaults, relinkMaxcut } from '../../../shared/engine/classical/relink-maxcut';
import { tabuMaxcut, tabuMaxcutDefaults } from '../../../shared/engine/classical/tabu-maxcut';
import type { RunControl } from '../../../shared/engine/classical/run-control';
import { randomSides } from '../../../shared/engine/classical/balance';
import { createRng } from '../../../shared/engine/random';
import { crossingWeight, respectsPins } from '../../../shared/engine/problem/evaluate';
import { bruteForce, grid, mirrorCase, pinsOf, problemOf, randomGraph, type Edge } from './helpers';

const allFree = (n: number) => Int32Array.from({ length: n }, (_, i) => i);
const sides = (bits: string) => Int8Array.from(bits, (c) => Number(c));
const cutOf = (edges: Edge[], s: ArrayLike<number>) => edges.reduce((a, [i, j, w]) => a + (s[i] !== s[j] ? w : 0), 0);

/** A control that stops after `limit` ticks (a tick comes every ~1000 moves). */
const ticks = (limit: number): RunControl => {
  let count = 0;
  return { elapsed: () => 0, shouldStop: () => count > limit, fraction: () => 0, tick: async () => ++count > limit };
};

describe('path relinking', () => {
  test('the child is the best cut of the middle third of the greedy path, recomputed from the edges', () => {
    // Real lanes: no two flips gain the same, so the greedy path is unique and can be redone.
    for (const seed of [1, 2, 3, 4]) {
      const n = 40;
      const edges = randomGraph(n, 0.2, seed, 'real');
      const problem = problemOf(n, edges);
      const rng = createRng(seed);
      const a = randomSides(problem, rng), b = randomSides(problem, rng);
      const out = new Int8Array(n);
      // Not mirrorable here, so the path goes to b itself.
      const step = relinkPath(problem.network, a, b, allFree(n), false, rng, out);
      const cur = Array.from(a);
      const todo = new Set<number>();
      for (let i = 0; i < n; i++) if (a[i] !== b[i]) todo.add(i);
      expect(step.distance).toBe(todo.size);
      const d = todo.size;
      let best = -Infinity, bestSide: number[] = [];
      for (let s = 1; s <= Math.floor((2 * d) / 3); s++) {
        let pick = -1, pickGain = -Infinity;
        for (const v of todo) {
          const before = cutOf(edges, cur);
          cur[v] = 1 - cur[v];
          const gain = cutOf(edges, cur) - before;
          cur[v] = 1 - cur[v];
          if (gain > pickGain) { pickGain = gain; pick = v; }
        }
        cur[pick] = 1 - cur[pick];
        todo.delete(pick);
        const c = cutOf(edges, cur);
        if (s >= Math.ceil(d / 3) && c > best) { best = c; bestSide = cur.slice(); }
      }
      expect(step.cut).toBeCloseTo(best, 9);
      expect(Array.from(out)).toEqual(bestSide);
      expect(crossingWeight(problem, out)).toBeCloseTo(step.cut, 9);
    }
  });

  test('mirrors the guide when that is closer, keeps pinned depots, and gives no child for parents two flips apart', () => {
    const n = 30;
    const { problem, rng, a, mirror: b } = mirrorCase(n, 0.3, 9);
    // b: the mirror image of a with 6 depots changed, so 6 apart after mirroring (24 without).
    for (const v of [0, 3, 7, 11, 20, 29]) b[v] = 1 - b[v];
    const out = new Int8Array(n);
    const mirrored = relinkPath(problem.network, a, b, allFree(n), true, rng, out);
    expect(mirrored.distance).toBe(6);
    for (let i = 0; i < n; i++) if (![0, 3, 7, 11, 20, 29].includes(i)) expect(out[i]).toBe(a[i]);
    expect(relinkPath(problem.network, a, b, allFree(n), false, rng, out).distance).toBe(24);
    // Only depots 2…29 free: depots 0 and 1 keep a's side along the whole path.
    const free = Int32Array.from({ length: n - 2 }, (_, i) => i + 2);
    const pinnedOut = new Int8Array(n);
    relinkPath(problem.network, a, b, free, false, rng, pinnedOut);
    expect([pinnedOut[0], pinnedOut[1]]).toEqual([a[0], a[1]]);
    const near = a.slice();
    near[4] = 1 - near[4];
    near[5] = 1 - near[5];
    expect(relinkPath(problem.network, a, near, allFree(n), true, rng, out)).toEqual({ distance: 2, cut: -Infinity });
  });
});

describe('elite pool with a minimum distance', () => {
  test('a near solution only replaces its neighbour, and only when better; far ones follow the worst-out rule', () => {
    const pool = createElitePool(2, 8, 2);
    pool.admit(sides('00001111'), 10);
    pool.admit(sides('00001110'), 9); // 1 from the 10: refused, not better
    expect(pool.size).toBe(1);
    pool.admit(sides('11110001'), 11); // the mirror of 00001110: 1 from the 10, better: replaces it
    expect(pool.size).toBe(1);
    expect(pool.cutOf(0)).toBe(11);
    pool.admit(sides('01010101'), 5); // far: room, kept
    pool.admit(sides('00110011'), 7); // far from both, better than the worst: replaces the 5
    expect(pool.size).toBe(2);
    expect([pool.cutOf(0), pool.cutOf(1)].sort()).toEqual([11, 7].sort());
    pool.admit(sides('00110010'), 6); // near the 7, worse: refused even though the pool would take a 6 nowhere
    expect([pool.cutOf(0), pool.cutOf(1)].sort()).toEqual([11, 7].sort());
  });
});

describe('tabu run with a stall limit', () => {
  test('returns by itself once it stalls, with the cut of the sides it returns', async () => {
    const n = 24;
    const edges = randomGraph(n, 0.3, 5, 'pm1');
    const problem = problemOf(n, edges);
    const rng = createRng(5);
    const start = randomSides(problem, rng);
    // The control never stops the run: only the stall limit can end it.
    const never: RunControl = { elapsed: () => 0, shouldStop: () => false, fraction: () => 0, tick: async () => false };
    const r = await tabuMaxcut(problem, start, { ...tabuMaxcutDefaults, stallMoves: 50 }, rng, never);
    expect(r.cut).toBe(crossingWeight(problem, r.side));
    expect(r.cut).toBeGreaterThanOrEqual(crossingWeight(problem, start));
    expect(r.moves).toBeLessThan(100_000);
  });
});

describe('relinking search', () => {
  test.each([
    [16, 0.4, 'pm1', 41, false], [15, 0.5, 'real', 42, false], [16, 0.3, 'unit', 43, false], [14, 0.6, 'pm1', 44, false],
    [16, 0.2, 'pm1', 45, true], [15, 0.25, 'real', 46, true], [16, 0.2, 'unit', 47, true],
  ] as const)('n=%i p=%f %s seed %i, partition crossover %s: reaches the brute-force optimum, reports the cut of its sides', async (n, p, w, seed, crossing) => {
    const edges = randomGraph(n, p, seed, w);
    for (const pins of [{}, { 2: 1, 9: 0 }] as Array<Record<number, number>>) {
      const problem = problemOf(n, edges, Object.keys(pins).length ? { pins: pinsOf(pins) } : {});
      const optimum = bruteForce(n, edges, { kind: 'maxcut', pins });
      const rng = createRng(seed);
      const start = randomSides(problem, rng);
      // Short improvement runs, so the budget covers many relinking rounds.
      const opts = { ...tabuMaxcutDefaults, ...relinkDefaults, poolSize: 4, relinkStall: 5, startStall: 0, childStall: 0, crossover: crossing };
      const r = await relinkMaxcut(problem, start, opts, rng, ticks(60));
      expect(r.cut).toBeCloseTo(crossingWeight(problem, r.side), 9);
      expect(r.cut).toBeGreaterThanOrEqual(crossingWeight(problem, start) - 1e-9);
      expect(r.cut).toBeCloseTo(optimum, 9);
      expect(respectsPins(problem, r.side)).toBe(true);
    }
  });

  test('on a ±1 grid the pool rounds cross members whose best mix beats both, and the cut stays true', async () => {
    // A 16×16 grid with random ±1 lanes (a 2D spin glass, where the depots two good cuts differ
    // on fall into many separate pieces): short runs leave pool members that partition crossover
    // can improve on. Without crossover no round is counted as crossed.
    const rngW = createRng(77);
    const edges = grid(16).map(([i, j]) => [i, j, rngW.int(2) === 1 ? 1 : -1] as Edge);
    const problem = problemOf(256, edges);
    const opts = { ...tabuMaxcutDefaults, ...relinkDefaults, poolSize: 6, relinkStall: 3, startStall: 0, childStall: 0 };
    const on = await relinkMaxcut(problem, randomSides(problem, createRng(3)), { ...opts, crossover: true }, createRng(3), ticks(80));
    expect(on.crossed).toBeGreaterThan(0);
    expect(on.cut).toBeCloseTo(crossingWeight(problem, on.side), 9);
    const off = await relinkMaxcut(problem, randomSides(problem, createRng(3)), { ...opts, crossover: false }, createRng(3), ticks(80));
    expect(off.crossed).toBe(0);
    expect(off.cut).toBeCloseTo(crossingWeight(problem, off.side), 9);
  });
});
