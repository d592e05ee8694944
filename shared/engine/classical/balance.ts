import { maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import type { Rng } from '../random';

/**
 * The side-1 weight window [lo, hi] equivalent to the shared balance rule for two sides:
 * both sides weigh at most maxPartWeight, so W − limit ≤ W₁ ≤ limit.
 */
export function balanceWindow(problem: Problem): { lo: number; hi: number; total: number; limit: number } {
  const dw = problem.network.depotWeight;
  let total = 0;
  for (let i = 0; i < dw.length; i++) total += dw[i];
  const limit = maxPartWeight(problem);
  return { lo: total - limit, hi: limit, total, limit };
}

/**
 * A random assignment that respects pins and (for two sides) the balance window: free depots
 * in random order join the lighter side (pins counted first), which lands inside the window
 * because every step closes the gap by at most the heaviest depot.
 */
export function randomBalancedSides(problem: Problem, rng: Rng): Int8Array {
  const n = problem.network.n;
  const dw = problem.network.depotWeight;
  const side = new Int8Array(n);
  const order: number[] = [];
  const load = [0, 0];
  for (let i = 0; i < n; i++) {
    if (problem.pins[i] >= 0) {
      side[i] = problem.pins[i];
      load[side[i]] += dw[i];
    } else order.push(i);
  }
  for (let i = order.length - 1; i > 0; i--) {
    const j = rng.int(i + 1);
    [order[i], order[j]] = [order[j], order[i]];
  }
  // Heavy depots first keeps the final gap small (largest-first greedy balancing).
  order.sort((a, b) => dw[b] - dw[a]);
  for (const v of order) {
    const s = load[0] <= load[1] ? 0 : 1;
    side[v] = s;
    load[s] += dw[v];
  }
  return side;
}

/** Random sides for max-cut (pins respected). */
export function randomSides(problem: Problem, rng: Rng): Int8Array {
  const n = problem.network.n;
  const side = new Int8Array(n);
  for (let i = 0; i < n; i++) side[i] = problem.pins[i] >= 0 ? problem.pins[i] : rng.int(2);
  return side;
}
