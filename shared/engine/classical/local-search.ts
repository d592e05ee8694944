import type { Problem } from '../problem/types';
import { createFlipState, flipDepot, laneBetween, type FlipState } from './flip-state';
import { balanceWindow } from './balance';

/**
 * 1-flip local search for max-cut: sweep the free depots and flip any whose flip raises the
 * cut, until a full sweep changes nothing. Returns the number of flips.
 */
export function polishMaxcut(problem: Problem, st: FlipState, free: Int32Array): number {
  const net = problem.network;
  let flips = 0;
  for (let changed = true; changed; ) {
    changed = false;
    for (let t = 0; t < free.length; t++) {
      const v = free[t];
      if (st.delta[v] > 1e-9) {
        flipDepot(net, st, v);
        flips++;
        changed = true;
      }
    }
  }
  return flips;
}

/**
 * Local search for balanced bisection: single flips that lower the crossing weight and keep
 * the balance window, then improving swaps (best pair among the few most eager depots of
 * each side), until neither helps.
 */
export function polishBisection(problem: Problem, st: FlipState, free: Int32Array, candidates = 6): number {
  const net = problem.network;
  const dw = net.depotWeight;
  const { lo, hi } = balanceWindow(problem);
  let moves = 0;
  const fits = (w1: number): boolean => w1 >= lo && w1 <= hi;
  for (let changed = true; changed; ) {
    changed = false;
    for (let t = 0; t < free.length; t++) {
      const v = free[t];
      if (st.delta[v] < -1e-9 && fits(st.weight1 + (st.side[v] === 0 ? dw[v] : -dw[v]))) {
        flipDepot(net, st, v);
        moves++;
        changed = true;
      }
    }
    if (changed) continue;
    const pick = (s: number): number[] => {
      const top: number[] = [];
      for (let t = 0; t < free.length; t++) {
        const v = free[t];
        if (st.side[v] !== s) continue;
        if (top.length < candidates) top.push(v);
        else {
          let worst = 0;
          for (let q = 1; q < top.length; q++) if (st.delta[top[q]] > st.delta[top[worst]]) worst = q;
          if (st.delta[v] < st.delta[top[worst]]) top[worst] = v;
        }
      }
      return top;
    };
    const a0 = pick(0), a1 = pick(1);
    let bestGain = -1e-9, ba = -1, bb = -1;
    for (const a of a0) for (const b of a1) {
      const change = st.delta[a] + st.delta[b] + 2 * laneBetween(net, a, b);
      if (change < bestGain && fits(st.weight1 + dw[a] - dw[b])) { bestGain = change; ba = a; bb = b; }
    }
    if (ba >= 0) {
      flipDepot(net, st, ba);
      flipDepot(net, st, bb);
      moves += 2;
      changed = true;
    }
  }
  return moves;
}

/**
 * Greedy construction for max-cut: pinned depots first, then free depots by decreasing total
 * |lane weight|, each on the side that cuts more weight to the depots already placed.
 */
export function greedyMaxcut(problem: Problem): Int8Array {
  const { n, adjStart, adjIndex, adjWeight } = problem.network;
  const side = new Int8Array(n).fill(-1);
  const strength = new Float64Array(n);
  for (let i = 0; i < n; i++) for (let p = adjStart[i]; p < adjStart[i + 1]; p++) strength[i] += Math.abs(adjWeight[p]);
  const order = Array.from({ length: n }, (_, i) => i).filter((i) => problem.pins[i] < 0).sort((a, b) => strength[b] - strength[a]);
  for (let i = 0; i < n; i++) if (problem.pins[i] >= 0) side[i] = problem.pins[i];
  for (const v of order) {
    let to0 = 0, to1 = 0;
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
      const s = side[adjIndex[p]];
      if (s === 0) to0 += adjWeight[p];
      else if (s === 1) to1 += adjWeight[p];
    }
    side[v] = to0 >= to1 ? 1 : 0; // joining side 1 cuts the lanes to side 0
  }
  return side;
}

export { createFlipState };

/**
 * Move the cheapest free depots off the heavy side until side-1 weight is inside the balance
 * window (or no free depot is left there). Returns the number of moves.
 */
export function repairBalance(problem: Problem, st: FlipState, free: Int32Array): number {
  const { lo, hi } = balanceWindow(problem);
  let moves = 0;
  for (let guard = 0; guard < problem.network.n && (st.weight1 > hi + 1e-9 || st.weight1 < lo - 1e-9); guard++) {
    const from = st.weight1 > hi ? 1 : 0;
    let pick = -1;
    for (const v of free) if (st.side[v] === from && (pick < 0 || st.delta[v] < st.delta[pick])) pick = v;
    if (pick < 0) break;
    flipDepot(problem.network, st, pick);
    moves++;
  }
  return moves;
}
