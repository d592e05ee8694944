import { buildAdjacency } from '../network/build';
import type { CompactNetwork } from '../network/types';
import { maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { gcdOf } from '../encodings/slack';

/** One bisection the recursive strategy asks for: a sub-network and its allowed D = W₀ − W₁. */
export interface BisectionStep {
  problem: Problem;
  /** Allowed depot-weight difference between side 0 and side 1 (for encodeBisection). */
  imbalanceWindow: { min: number; max: number };
  /** Original depot index of each sub-network depot. */
  depots: Int32Array;
  /** Regions the two sides will hold: [first, first + regions0) and the rest. */
  firstRegion: number;
  regions0: number;
  regions1: number;
}

/** The sub-network induced by `depots` (lanes with both ends inside), weights kept. */
export function inducedNetwork(net: CompactNetwork, depots: Int32Array): CompactNetwork {
  const local = new Int32Array(net.n).fill(-1);
  depots.forEach((d, i) => (local[d] = i));
  const from: number[] = [], to: number[] = [], w: number[] = [];
  for (let e = 0; e < net.m; e++) {
    const a = local[net.laneFrom[e]], b = local[net.laneTo[e]];
    if (a >= 0 && b >= 0) { from.push(Math.min(a, b)); to.push(Math.max(a, b)); w.push(net.laneWeight[e]); }
  }
  const laneFrom = Int32Array.from(from), laneTo = Int32Array.from(to), laneWeight = Float64Array.from(w);
  return {
    n: depots.length,
    depotIds: Array.from(depots, (d) => net.depotIds[d]),
    m: from.length,
    laneFrom, laneTo, laneWeight,
    depotWeight: Float64Array.from(depots, (d) => net.depotWeight[d]),
    ...buildAdjacency(depots.length, laneFrom, laneTo, laneWeight),
  };
}

/**
 * Heaviest weight one region can actually take: maxPartWeight rounded down to the depot-weight
 * gcd when weights are whole numbers (unit depots, L = 2.75 ⇒ 2), so that uneven first splits
 * do not hand a side more depots than its regions can hold.
 */
export function regionLimit(problem: Problem): number {
  const L = maxPartWeight(problem);
  const w = problem.network.depotWeight;
  if (!Array.from(w).every((x) => Math.abs(x - Math.round(x)) < 1e-9)) return L;
  const g = gcdOf(w);
  return g > 0 ? Math.floor(L / g + 1e-9) * g : L;
}

/** The bisection asked for when regions [first, first + regions) share `depots` (regions ≥ 2). */
export function bisectionStep(problem: Problem, depots: Int32Array, first: number, regions: number): BisectionStep {
  const L = regionLimit(problem);
  const r0 = Math.floor(regions / 2), r1 = regions - r0;
  const network = inducedNetwork(problem.network, depots);
  let W = 0;
  for (let i = 0; i < network.n; i++) W += network.depotWeight[i];
  const pins = new Int32Array(network.n).fill(-1);
  depots.forEach((d, i) => {
    const pin = problem.pins[d];
    if (pin >= 0) pins[i] = pin < first + r0 ? 0 : 1;
  });
  const sub: Problem = { kind: 'bisection', k: 2, network, pins, tolerance: problem.tolerance };
  return { problem: sub, imbalanceWindow: { min: W - 2 * r1 * L, max: 2 * r0 * L - W }, depots, firstRegion: first, regions0: r0, regions1: r1 };
}

/** The first (largest) split of a k-way problem: all depots, all regions. */
export const firstBisectionStep = (problem: Problem): BisectionStep =>
  bisectionStep(problem, Int32Array.from({ length: problem.network.n }, (_, i) => i), 0, problem.k);

/**
 * k-way partitioning by recursive bisection (a driver-level strategy): split the regions
 * [first, first + r) into ⌊r/2⌋ and ⌈r/2⌉, bisect the depots accordingly, recurse. Uneven
 * region counts get uneven targets: with L = regionLimit of the k-way problem, side 0 may
 * weigh at most ⌊r/2⌋·L and side 1 at most ⌈r/2⌉·L, i.e. D = W₀ − W₁ ∈ [W − 2r₁L, 2r₀L − W].
 * Pins: a depot pinned to a region of side 0's range is pinned to side 0, and so on.
 * `bisect` returns side 0/1 per sub-network depot; the final answer is checked by the caller
 * with the k-way balance rule (the windows are necessary, not sufficient, for it).
 */
export async function recursiveBisection(
  problem: Problem,
  bisect: (step: BisectionStep) => Promise<ArrayLike<number>>,
): Promise<Int32Array> {
  const assignment = new Int32Array(problem.network.n);
  const all = Int32Array.from({ length: problem.network.n }, (_, i) => i);
  const split = async (depots: Int32Array, first: number, regions: number): Promise<void> => {
    if (regions === 1 || depots.length === 0) {
      depots.forEach((d) => (assignment[d] = first));
      return;
    }
    const step = bisectionStep(problem, depots, first, regions);
    const { regions0: r0, regions1: r1 } = step;
    const sides = await bisect(step);
    const left: number[] = [], right: number[] = [];
    depots.forEach((d, i) => (sides[i] ? right : left).push(d));
    await split(Int32Array.from(left), first, r0);
    await split(Int32Array.from(right), first + r0, r1);
  };
  await split(all, 0, problem.k);
  return assignment;
}
