/**
 * Partition crossover for max-cut against brute force: on small sparse networks the child must
 * be the best of every mix of the parents that takes each connected piece of the depots they
 * differ on wholly from one parent (enumerated here from the edge list, components found by a
 * separate union–find), its reported gain must match the recomputed cut, and pinned depots keep
 * their sides. The cut-and-paste rule itself is textbook (Houdayer 2001; Tinós, Whitley & Chicano
 * 2015, from memory); the brute force is the independent check.
 */
import { createPartitionCrossover } from '../../../shared/engine/classical/partition-crossover';
import { randomSides } from '../../../shared/engine/classical/balance';
import { createRng } from '../../../shared/engine/random';
import { crossingWeight } from '../../../shared/engine/problem/evaluate';
import { mirrorCase, problemOf, randomGraph, type Edge } from './helpers';

const cutOf = (edges: Edge[], s: ArrayLike<number>) => edges.reduce((a, [i, j, w]) => a + (s[i] !== s[j] ? w : 0), 0);

/** Pieces of `inD` connected through lanes with both ends in it (union–find). */
function pieces(n: number, edges: Edge[], inD: boolean[]): number[][] {
  const parent = Array.from({ length: n }, (_, i) => i);
  const find = (x: number): number => (parent[x] === x ? x : (parent[x] = find(parent[x])));
  for (const [i, j] of edges) if (inD[i] && inD[j]) parent[find(i)] = find(j);
  const groups = new Map<number, number[]>();
  for (let v = 0; v < n; v++) if (inD[v]) groups.set(find(v), [...(groups.get(find(v)) ?? []), v]);
  return [...groups.values()];
}

/** The best cut over all mixes taking each piece from a or from b (b possibly mirrored). */
function bestMix(n: number, edges: Edge[], a: Int8Array, b: ArrayLike<number>): number {
  const inD = Array.from({ length: n }, (_, v) => a[v] !== b[v]);
  const parts = pieces(n, edges, inD);
  let best = -Infinity;
  for (let mask = 0; mask < 1 << parts.length; mask++) {
    const s = Array.from(a);
    parts.forEach((p, k) => { if (mask & (1 << k)) for (const v of p) s[v] = b[v]; });
    best = Math.max(best, cutOf(edges, s));
  }
  return best;
}

describe('partition crossover', () => {
  test('the child is the best mix of whole pieces, on sparse ±1, real and unit networks', () => {
    let multiPiece = 0;
    for (const kind of ['pm1', 'real', 'unit'] as const) {
      for (const seed of [1, 2, 3, 4, 5, 6]) {
        const n = 16;
        const edges = randomGraph(n, 0.15, seed, kind);
        const problem = problemOf(n, edges);
        const rng = createRng(seed);
        const a = randomSides(problem, rng), b = randomSides(problem, rng);
        const free = Int32Array.from({ length: n }, (_, i) => i);
        const out = new Int8Array(n);
        // Not mirrorable: b as given.
        const r = createPartitionCrossover(problem.network, free, false).cross(a, b, out, rng);
        const cutA = cutOf(edges, a);
        expect(cutA + r.gain).toBeCloseTo(cutOf(edges, out), 9);
        expect(crossingWeight(problem, out)).toBeCloseTo(cutOf(edges, out), 9);
        expect(cutOf(edges, out)).toBeCloseTo(bestMix(n, edges, a, b), 9);
        expect(cutOf(edges, out)).toBeGreaterThanOrEqual(Math.max(cutA, cutOf(edges, b)) - 1e-9);
        const inD = Array.from({ length: n }, (_, v) => a[v] !== b[v]);
        expect(r.distance).toBe(inD.filter(Boolean).length);
        expect(r.components).toBe(pieces(n, edges, inD).length);
        // Every depot of the child comes from a parent.
        for (let v = 0; v < n; v++) expect(out[v] === a[v] || out[v] === b[v]).toBe(true);
        if (r.components > 1) multiPiece++;
      }
    }
    expect(multiPiece).toBeGreaterThan(5); // the cases exercise the piece-wise choice
  });

  test('mirrors b when that makes the parents closer, and leaves pinned depots alone', () => {
    const n = 14;
    const { edges, problem, rng, a, mirror: b } = mirrorCase(n, 0.2, 9);
    b[3] = a[3]; // the mirror of a, except one depot
    const out = new Int8Array(n);
    const free = Int32Array.from({ length: n }, (_, i) => i);
    const r = createPartitionCrossover(problem.network, free, true).cross(a, b, out, rng);
    expect(r.distance).toBe(1);
    expect(cutOf(edges, out)).toBeCloseTo(bestMix(n, edges, a, b.map((x) => 1 - x)), 9);
    // Depot 0 pinned (outside free): the child keeps a's side there even when b differs.
    const c = a.slice();
    for (let v = 0; v < n; v++) c[v] = 1 - a[v];
    c[5] = a[5];
    const freeButZero = Int32Array.from({ length: n - 1 }, (_, i) => i + 1);
    const out2 = new Int8Array(n);
    createPartitionCrossover(problem.network, freeButZero, false).cross(a, c, out2, rng);
    expect(out2[0]).toBe(a[0]);
  });
});
