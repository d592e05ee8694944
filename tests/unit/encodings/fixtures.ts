/** Small graph generators and brute-force oracles shared by the encoding / variational tests. */
import { compactFromEdges } from '../../../shared/engine/network/build';
import type { CompactNetwork } from '../../../shared/engine/network/types';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { crossingWeight, isBalanced } from '../../../shared/engine/problem/evaluate';
import type { Problem, ProblemSpec } from '../../../shared/engine/problem/types';
import type { Rng } from '../../../shared/engine/random';

export type Edge = [number, number, number];

/** Erdős–Rényi G(n, p) with lane weights from `weight` (ensures at least one lane). */
export function randomGraph(rng: Rng, n: number, p: number, weight: () => number = () => 1): Edge[] {
  const edges: Edge[] = [];
  for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) if (rng.next() < p) edges.push([a, b, weight()]);
  if (edges.length === 0) edges.push([0, 1, weight()]);
  return edges;
}

export const ringEdges = (n: number): Edge[] => Array.from({ length: n }, (_, i) => [i, (i + 1) % n, 1] as Edge);

/** Random simple 3-regular graph by the pairing model with rejection (n even). */
export function random3Regular(rng: Rng, n: number): Edge[] {
  for (;;) {
    const points: number[] = [];
    for (let v = 0; v < n; v++) points.push(v, v, v);
    for (let i = points.length - 1; i > 0; i--) {
      const j = rng.int(i + 1);
      [points[i], points[j]] = [points[j], points[i]];
    }
    const seen = new Set<number>();
    const edges: Edge[] = [];
    let ok = true;
    for (let i = 0; i < points.length; i += 2) {
      let a = points[i], b = points[i + 1];
      if (a > b) [a, b] = [b, a];
      if (a === b || seen.has(a * n + b)) { ok = false; break; }
      seen.add(a * n + b);
      edges.push([a, b, 1]);
    }
    if (ok) return edges;
  }
}

export function problemOf(n: number, edges: Edge[], spec: ProblemSpec, depotWeights?: number[]): Problem {
  const network: CompactNetwork = compactFromEdges(n, edges);
  if (depotWeights) depotWeights.forEach((w, i) => (network.depotWeight[i] = w));
  return bindProblem(network, spec);
}

/** Best value over all k^n assignments that respect pins (and balance for partitions). */
export function bruteForceBest(problem: Problem): { value: number; assignment: number[] } {
  const n = problem.network.n, k = problem.k;
  const a = new Array(n).fill(0);
  let best = problem.kind === 'maxcut' ? -Infinity : Infinity;
  let bestA: number[] = [];
  const total = k ** n;
  for (let code = 0; code < total; code++) {
    let c = code, ok = true;
    for (let i = 0; i < n; i++) {
      a[i] = c % k;
      c = Math.floor(c / k);
      if (problem.pins[i] >= 0 && problem.pins[i] !== a[i]) ok = false;
    }
    if (!ok || !isBalanced(problem, a)) continue;
    const v = crossingWeight(problem, a);
    if (problem.kind === 'maxcut' ? v > best : v < best) { best = v; bestA = a.slice(); }
  }
  return { value: best, assignment: bestA };
}
