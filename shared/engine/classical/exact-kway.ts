import { maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';

/**
 * Exact k-way partitioning by depth-first search for tiny networks (k^n up to ~1e7).
 * Without pins, regions are interchangeable, so labels are assigned in first-use order
 * (depot i may open at most one new region), which divides the work by about k!.
 * Branches are cut when a region overflows the balance rule or, with non-negative lanes,
 * when the partial crossing weight already reaches the best complete one.
 */
export interface KwayExactResult {
  value: number;
  assignment: Int8Array | null;
  nodes: number;
  /** False when stopped early by `shouldStop`. */
  complete: boolean;
}

/** Number of leaves of the search without pruning (k^free, reduced by symmetry when unpinned). */
export function kwaySearchSize(problem: Problem): number {
  let free = 0;
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] < 0) free++;
  const size = problem.k ** free;
  if (free < problem.pins.length) return size;
  let fact = 1;
  for (let i = 2; i <= problem.k; i++) fact *= i;
  return size / fact;
}

export function exactKway(problem: Problem, shouldStop: () => boolean = () => false): KwayExactResult {
  const { n, adjStart, adjIndex, adjWeight, depotWeight, laneWeight } = problem.network;
  const k = problem.k;
  const pins = problem.pins;
  const limit = maxPartWeight(problem);
  let nonNegative = true;
  for (let e = 0; e < laneWeight.length; e++) if (laneWeight[e] < 0) nonNegative = false;
  const symmetric = pins.every((p) => p < 0);
  const part = new Int8Array(n).fill(-1);
  const load = new Float64Array(k);
  let best = Infinity;
  let bestPart: Int8Array | null = null;
  let nodes = 0;
  let stopped = false;

  // Place pinned depots first: their crossing weight is fixed.
  let partial = 0;
  for (let i = 0; i < n; i++) {
    if (pins[i] < 0) continue;
    part[i] = pins[i];
    load[pins[i]] += depotWeight[i];
    for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
      const j = adjIndex[p];
      if (j < i && part[j] >= 0 && part[j] !== part[i]) partial += adjWeight[p];
    }
  }
  if (load.some((w) => w > limit)) return { value: Infinity, assignment: null, nodes: 0, complete: true };
  const order: number[] = [];
  for (let i = 0; i < n; i++) if (pins[i] < 0) order.push(i);

  const visit = (depth: number, cost: number, used: number): void => {
    if (stopped) return;
    if ((++nodes & 0xffff) === 0 && shouldStop()) {
      stopped = true;
      return;
    }
    if (nonNegative && cost >= best) return;
    if (depth === order.length) {
      if (cost < best) {
        best = cost;
        bestPart = part.slice();
      }
      return;
    }
    const i = order[depth];
    const top = symmetric ? Math.min(k, used + 1) : k;
    for (let r = 0; r < top; r++) {
      if (load[r] + depotWeight[i] > limit) continue;
      let add = 0;
      for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
        const j = adjIndex[p];
        if (part[j] >= 0 && part[j] !== r) add += adjWeight[p];
      }
      part[i] = r;
      load[r] += depotWeight[i];
      visit(depth + 1, cost + add, Math.max(used, r + 1));
      load[r] -= depotWeight[i];
      part[i] = -1;
    }
  };
  visit(0, partial, 0);
  return { value: best, assignment: bestPart, nodes, complete: !stopped };
}
