import type { CompactNetwork } from '../network/types';

/**
 * Two-sided state with O(degree) flips: `delta[i]` is how much the crossing weight changes
 * when depot i changes side (Σ over lanes to its own side minus Σ over lanes to the other).
 * Max-cut wants delta > 0, the min kinds want delta < 0; both read the same array.
 */
export interface FlipState {
  side: Int8Array; // 0/1 per depot
  delta: Float64Array; // crossing-weight change if the depot flips
  /** Crossing weight of `side` (kept incrementally). */
  cut: number;
  /** Total depot weight on side 1 (for the balance rule). */
  weight1: number;
}

export function createFlipState(net: CompactNetwork, side: ArrayLike<number>): FlipState {
  const { n, adjStart, adjIndex, adjWeight, depotWeight } = net;
  const s = Int8Array.from(side as ArrayLike<number>);
  const delta = new Float64Array(n);
  let cut = 0, weight1 = 0;
  for (let i = 0; i < n; i++) {
    let d = 0;
    for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
      if (s[adjIndex[p]] === s[i]) d += adjWeight[p];
      else {
        d -= adjWeight[p];
        if (adjIndex[p] > i) cut += adjWeight[p];
      }
    }
    delta[i] = d;
    if (s[i] === 1) weight1 += depotWeight[i];
  }
  return { side: s, delta, cut, weight1 };
}

export function flipDepot(net: CompactNetwork, st: FlipState, v: number): void {
  const { adjStart, adjIndex, adjWeight } = net;
  const side = st.side, delta = st.delta;
  const sv = side[v];
  st.cut += delta[v];
  for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
    const j = adjIndex[p], w2 = 2 * adjWeight[p];
    // Before the flip j on v's side: the lane starts crossing, so flipping j later undoes it.
    delta[j] += side[j] === sv ? -w2 : w2;
  }
  delta[v] = -delta[v];
  side[v] = (1 - sv) as 0 | 1;
  st.weight1 += sv === 0 ? net.depotWeight[v] : -net.depotWeight[v];
}

/** Lane weight between a and b (0 when no lane); O(degree of a). */
export function laneBetween(net: CompactNetwork, a: number, b: number): number {
  for (let p = net.adjStart[a]; p < net.adjStart[a + 1]; p++) if (net.adjIndex[p] === b) return net.adjWeight[p];
  return 0;
}
