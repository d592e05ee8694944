import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { balanceWindow } from './balance';
import { createFlipState, flipDepot, laneBetween } from './flip-state';
import type { RunControl } from './run-control';

/**
 * Tabu search for balanced bisection (minimise the crossing weight inside the balance
 * window). Each step makes the best admissible move even when it loses: a single flip that
 * stays inside the window, or a swap of two depots from opposite sides (chosen among the few
 * most eager non-tabu depots of each side, with the exact pair change). Moved depots are tabu
 * for a random tenure; after `stagnation` moves without a new best the search restarts from
 * the best state with a few random balanced swaps (iterated tabu search, common practice).
 */
export interface TabuBisectionOptions {
  tenureMin: number;
  tenureShare: number;
  /** Moves without a new best, as a multiple of the free depot count, before a kick. */
  stagnation: number;
  /** Kick size as a share of the free depots. */
  kickShare: number;
  candidates: number;
}

export const tabuBisectionDefaults: TabuBisectionOptions = { tenureMin: 3, tenureShare: 0.05, stagnation: 20, kickShare: 0.05, candidates: 4 };

export async function tabuBisection(problem: Problem, start: Int8Array, opts: TabuBisectionOptions, rng: Rng, control: RunControl) {
  const net = problem.network;
  const dw = net.depotWeight;
  const n = net.n;
  const free: number[] = [];
  for (let i = 0; i < n; i++) if (problem.pins[i] < 0) free.push(i);
  const f = free.length;
  const { lo, hi } = balanceWindow(problem);
  const fits = (w1: number): boolean => w1 >= lo && w1 <= hi;
  const st = createFlipState(net, start);
  const delta = st.delta;
  let best = fits(st.weight1) ? st.cut : Infinity;
  const bestSide = st.side.slice();
  let bestAt = control.elapsed();
  if (f < 2) return { side: bestSide, cut: best, moves: 0, bestAt };
  const tabuUntil = new Float64Array(n);
  const tMin = Math.max(1, Math.min(opts.tenureMin, f - 1));
  const tMax = Math.max(tMin, Math.round(opts.tenureShare * f));
  let iter = 0;
  let lastImprove = 0;
  const mark = (v: number): void => {
    tabuUntil[v] = iter + tMin + rng.int(tMax - tMin + 1);
  };
  const allowed = (v: number, change: number): boolean => tabuUntil[v] <= iter || st.cut + change < best - 1e-9;
  const top0: number[] = [], top1: number[] = [];
  const c = opts.candidates;
  const step = (): void => {
    iter++;
    let bestFlip = -1, bestFlipChange = Infinity;
    top0.length = 0;
    top1.length = 0;
    for (let t = 0; t < f; t++) {
      const v = free[t];
      const d = delta[v];
      const s = st.side[v];
      if (!allowed(v, d)) continue;
      if (d < bestFlipChange && fits(st.weight1 + (s === 0 ? dw[v] : -dw[v]))) {
        bestFlipChange = d;
        bestFlip = v;
      }
      const top = s === 0 ? top0 : top1;
      if (top.length < c) top.push(v);
      else {
        let worst = 0;
        for (let q = 1; q < c; q++) if (delta[top[q]] > delta[top[worst]]) worst = q;
        if (d < delta[top[worst]] || (d === delta[top[worst]] && rng.int(2) === 0)) top[worst] = v;
      }
    }
    let ba = -1, bb = -1, bestSwap = Infinity;
    for (const a of top0) for (const b of top1) {
      const change = delta[a] + delta[b] + 2 * laneBetween(net, a, b);
      if (change < bestSwap && fits(st.weight1 + dw[a] - dw[b])) { bestSwap = change; ba = a; bb = b; }
    }
    if (bestFlip >= 0 && bestFlipChange <= bestSwap) {
      flipDepot(net, st, bestFlip);
      mark(bestFlip);
    } else if (ba >= 0) {
      flipDepot(net, st, ba);
      flipDepot(net, st, bb);
      mark(ba);
      mark(bb);
    } else {
      // Nothing admissible (all tabu): a random balanced swap keeps the walk going.
      randomSwap();
    }
  };
  const randomSwap = (): void => {
    for (let tries = 0; tries < 50; tries++) {
      const a = free[rng.int(f)], b = free[rng.int(f)];
      if (st.side[a] === st.side[b]) continue;
      const w1 = st.weight1 + (st.side[a] === 0 ? dw[a] - dw[b] : dw[b] - dw[a]);
      if (!fits(w1)) continue;
      flipDepot(net, st, a);
      flipDepot(net, st, b);
      mark(a);
      mark(b);
      return;
    }
  };
  for (;;) {
    for (let j = 0; j < 256; j++) {
      step();
      if (st.cut < best - 1e-9 && fits(st.weight1)) {
        best = st.cut;
        bestSide.set(st.side);
        bestAt = control.elapsed();
        lastImprove = iter;
      }
    }
    if (iter - lastImprove > opts.stagnation * f) {
      for (let t = 0; t < f; t++) if (st.side[free[t]] !== bestSide[free[t]]) flipDepot(net, st, free[t]);
      const kicks = Math.max(1, Math.round(opts.kickShare * f * (0.5 + rng.next())));
      for (let j = 0; j < kicks; j++) randomSwap();
      lastImprove = iter;
    }
    if (await control.tick(best, iter)) break;
  }
  return { side: bestSide.slice(), cut: best, moves: iter, bestAt };
}
