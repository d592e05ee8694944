/**
 * Test helpers for the classical solvers: small graph families and an independent brute force.
 * The open data sets (G-set, Biq Mac) are read through tests/data/load.ts.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import type { Problem, ProblemSpec } from '../../../shared/engine/problem/types';
import type { CompactNetwork } from '../../../shared/engine/network/types';
import { createRng, type Rng } from '../../../shared/engine/random';
import { randomSides } from '../../../shared/engine/classical/balance';

import type { Edge } from '../../data/load';

export type { Edge };

export function problemOf(n: number, edges: Edge[], spec: Partial<ProblemSpec> = {}, depotWeights?: number[]): Problem {
  let net: CompactNetwork = compactFromEdges(n, edges);
  if (depotWeights) net = { ...net, depotWeight: Float64Array.from(depotWeights) };
  return bindProblem(net, { kind: 'maxcut', ...spec } as ProblemSpec);
}

export const complete = (n: number): Edge[] => {
  const e: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) e.push([i, j, 1]);
  return e;
};
export const cycle = (n: number): Edge[] => Array.from({ length: n }, (_, i) => [i, (i + 1) % n, 1] as Edge);
export const path = (n: number): Edge[] => Array.from({ length: n - 1 }, (_, i) => [i, i + 1, 1] as Edge);
export const grid = (L: number): Edge[] => {
  const e: Edge[] = [];
  for (let r = 0; r < L; r++) for (let c = 0; c < L; c++) {
    const v = r * L + c;
    if (c + 1 < L) e.push([v, v + 1, 1]);
    if (r + 1 < L) e.push([v, v + L, 1]);
  }
  return e;
};
/** Petersen graph: outer 5-cycle, inner pentagram, spokes. */
export const petersen = (): Edge[] => {
  const e: Edge[] = [];
  for (let i = 0; i < 5; i++) {
    e.push([i, (i + 1) % 5, 1]);
    e.push([5 + i, 5 + ((i + 2) % 5), 1]);
    e.push([i, 5 + i, 1]);
  }
  return e;
};

/** Seeded G(n, p) with weights drawn by `weight`. */
export function randomGraph(n: number, p: number, seed: number, weight: 'unit' | 'pm1' | 'real'): Edge[] {
  const rng = createRng(seed);
  const e: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
    if (rng.next() >= p) continue;
    const w = weight === 'unit' ? 1 : weight === 'pm1' ? (rng.next() < 0.5 ? -1 : 1) : 0.1 + 9.9 * rng.next();
    e.push([i, j, w]);
  }
  return e;
}

/**
 * Brute force written independently of the engine: every 0/1 (or 0…k−1) assignment, lanes
 * summed directly from the edge list, balance per the documented rule
 * max part ≤ (1 + t)·W/k + d_max·(k − 1)/k.
 */
export function bruteForce(n: number, edges: Edge[], opts: { kind: 'maxcut' | 'bisection' | 'kway'; k?: number; pins?: Record<number, number>; tolerance?: number; weights?: number[] }): number {
  const k = opts.kind === 'kway' ? opts.k ?? 3 : 2;
  const dw = opts.weights ?? Array(n).fill(1);
  const total = dw.reduce((a, b) => a + b, 0);
  const dMax = Math.max(...dw);
  const limit = ((1 + (opts.tolerance ?? 0)) * total) / k + (dMax * (k - 1)) / k + 1e-9 * Math.max(1, total);
  const maximise = opts.kind === 'maxcut';
  let best = maximise ? -Infinity : Infinity;
  const a = new Array(n).fill(0);
  const count = k ** n;
  for (let code = 0; code < count; code++) {
    let c = code;
    for (let i = 0; i < n; i++) { a[i] = c % k; c = Math.floor(c / k); }
    let ok = true;
    for (const [i, p] of Object.entries(opts.pins ?? {})) if (a[Number(i)] !== p) ok = false;
    if (!ok) continue;
    if (!maximise) {
      const load = new Array(k).fill(0);
      for (let i = 0; i < n; i++) load[a[i]] += dw[i];
      if (load.some((l) => l > limit)) continue;
    }
    let v = 0;
    for (const [i, j, w] of edges) if (a[i] !== a[j]) v += w;
    if (maximise ? v > best : v < best) best = v;
  }
  return best;
}

/** Pins by depot index → depot id map for ProblemSpec (compactFromEdges ids are 1-based strings). */
export const pinsOf = (pins: Record<number, number>): Record<string, number> =>
  Object.fromEntries(Object.entries(pins).map(([i, p]) => [String(Number(i) + 1), p]));

export const ctx = (timeLimitSeconds: number, seed = 7) => ({ seed, timeLimitSeconds });

/**
 * A random ±1 network, a random assignment `a` on it and a's mirror image (every side swapped),
 * for tests of the rule that a cut and its mirror are the same cut.
 */
export function mirrorCase(n: number, p: number, seed: number): { edges: Edge[]; problem: Problem; rng: Rng; a: Int8Array; mirror: Int8Array } {
  const edges = randomGraph(n, p, seed, 'pm1');
  const problem = problemOf(n, edges);
  const rng = createRng(seed);
  const a = randomSides(problem, rng);
  return { edges, problem, rng, a, mirror: a.map((x) => 1 - x) as Int8Array };
}
