import type { CompactNetwork } from '../network/types';
import type { Rng } from '../random';
import { createFlipState, flipDepot } from './flip-state';
import { mirrorToward } from './mirror';

/**
 * Greedy path relinking for max-cut (the path-relinking step as used for max-cut by Wu & Hao,
 * "A memetic approach for the max-cut problem", PPSN XII 2012, and for max-k-cut by Ma & Hao
 * 2017 [details from memory]): walk from an initiating assignment to a guiding one, each step
 * flipping the depot, among those still on the other side than in the guide, whose flip gains
 * most (ties at random). The walk passes through assignments that share about half of each
 * parent; the best one in the middle third of the path is the child (near either end it would be
 * one of the parents again, which the search has already explored).
 * A cut and its mirror image are the same cut, so without pinned depots the guide is mirrored
 * when that brings it closer.
 * initiating, guide, out: Int8Array // 0/1 per depot; pinned depots keep initiating's value
 */
export interface RelinkStep {
  /** Depots the parents differ on (after mirroring). */
  distance: number;
  /** Cut of the child written to `out` (−Infinity when the parents are within 2 flips: no child). */
  cut: number;
}

export function relinkPath(
  net: CompactNetwork,
  initiating: Int8Array,
  guide: Int8Array,
  free: Int32Array,
  mirrorable: boolean,
  rng: Rng,
  out: Int8Array,
): RelinkStep {
  const mirror = mirrorToward(initiating, guide, free, mirrorable);
  // Depots still to flip; swap-removal keeps the list dense.
  const todo = new Int32Array(free.length);
  let d = 0;
  for (let t = 0; t < free.length; t++) {
    const v = free[t];
    if (initiating[v] !== (guide[v] ^ mirror)) todo[d++] = v;
  }
  const distance = d;
  if (distance < 3) return { distance, cut: -Infinity };
  const st = createFlipState(net, initiating);
  const from = Math.max(1, Math.ceil(distance / 3)), to = Math.min(distance - 1, Math.floor((2 * distance) / 3));
  let bestCut = -Infinity;
  for (let step = 1; step <= to; step++) {
    let bi = 0, bd = -Infinity, ties = 0;
    for (let i = 0; i < d; i++) {
      const g = st.delta[todo[i]];
      if (g > bd) { bd = g; bi = i; ties = 1; }
      else if (g === bd && rng.int(++ties) === 0) bi = i;
    }
    flipDepot(net, st, todo[bi]);
    todo[bi] = todo[--d];
    if (step >= from && st.cut > bestCut) {
      bestCut = st.cut;
      out.set(st.side);
    }
  }
  return { distance, cut: bestCut };
}
