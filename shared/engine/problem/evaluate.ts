import type { Problem } from './types';

/**
 * The business value of an assignment, the one definition every solver and test shares:
 * maxcut → total weight of lanes whose ends differ; bisection / kway → total weight of lanes
 * whose ends lie in different regions (the same sum; the sense differs).
 */
export function crossingWeight(problem: Problem, assignment: ArrayLike<number>): number {
  const { m, laneFrom, laneTo, laneWeight } = problem.network;
  let total = 0;
  for (let e = 0; e < m; e++) if (assignment[laneFrom[e]] !== assignment[laneTo[e]]) total += laneWeight[e];
  return total;
}

/**
 * How much crossingWeight changes when depots[i] takes sides[i] (the other depots keep
 * `assignment`; a depot listed twice takes its last side), from the lanes at the depots that
 * change only: O(their degrees), not O(lanes). A lane with both ends changing is counted once,
 * with both new ends. Exact for every kind: crossingWeight is a plain sum over lanes (the balance
 * rule is apart, isBalanced). `sides` may be longer than `depots` (the rest is not read).
 */
export function crossingChange(problem: Problem, assignment: ArrayLike<number>, depots: ArrayLike<number>, sides: ArrayLike<number>): number {
  const { adjStart, adjIndex, adjWeight } = problem.network;
  const moved = new Map<number, number>();
  for (let i = 0; i < depots.length; i++) {
    if (sides[i] !== assignment[depots[i]]) moved.set(depots[i], sides[i]);
    else moved.delete(depots[i]);
  }
  let change = 0;
  for (const [v, to] of moved) {
    const from = assignment[v];
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
      const j = adjIndex[p];
      const jTo = moved.get(j);
      // A lane between two changing depots: counted from its lower end only.
      if (jTo !== undefined && j < v) continue;
      const before = assignment[j], after = jTo ?? before;
      if ((from !== before) !== (to !== after)) change += to !== after ? adjWeight[p] : -adjWeight[p];
    }
  }
  return change;
}

/** Total depot weight per part, length k. */
export function partWeights(problem: Problem, assignment: ArrayLike<number>): Float64Array {
  const w = new Float64Array(problem.k);
  const dw = problem.network.depotWeight;
  for (let i = 0; i < problem.network.n; i++) w[assignment[i]] += dw[i];
  return w;
}

/**
 * The balance rule (one place): the heaviest part may weigh at most
 *   (1 + t)·W/k + d_max·(k − 1)/k,
 * W total depot weight, d_max the heaviest depot. For k = 2 this is |W₀ − W₁| ≤ t·W + d_max,
 * so tolerance 0 with unit weights means the sides' depot counts differ by at most one.
 * Max-cut has no balance rule.
 */
export function maxPartWeight(problem: Problem): number {
  const dw = problem.network.depotWeight;
  let total = 0, dMax = 0;
  for (let i = 0; i < dw.length; i++) {
    total += dw[i];
    if (dw[i] > dMax) dMax = dw[i];
  }
  const k = problem.k;
  return ((1 + problem.tolerance) * total) / k + (dMax * (k - 1)) / k + 1e-9 * Math.max(1, total);
}

export function isBalanced(problem: Problem, assignment: ArrayLike<number>): boolean {
  if (problem.kind === 'maxcut') return true;
  const limit = maxPartWeight(problem);
  return partWeights(problem, assignment).every((w) => w <= limit);
}

export function respectsPins(problem: Problem, assignment: ArrayLike<number>): boolean {
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] >= 0 && assignment[i] !== problem.pins[i]) return false;
  return true;
}


/** Pins kept and balance rule met: the feasibility that problem/compare.ts ranks first. */
export function isFeasible(problem: Problem, assignment: ArrayLike<number>): boolean {
  return respectsPins(problem, assignment) && isBalanced(problem, assignment);
}
