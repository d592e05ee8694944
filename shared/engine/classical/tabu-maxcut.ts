import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { createFlipState, flipDepot } from './flip-state';
import type { RunControl } from './run-control';

/**
 * Breakout-style tabu search for max-cut, in the spirit of Benlic & Hao, "Breakout local
 * search for the max-cut problem", Eng. Appl. AI 26(3) (2013):
 *  1. steepest ascent by single flips to a local optimum;
 *  2. a "jump" of L moves; L grows by one each time the search falls back into the same
 *     local optimum and resets to L0 otherwise;
 *  3. the jump is directed (best non-tabu flip, even if it loses weight; a tabu flip is
 *     allowed when it beats the best cut) with probability max(e^(−ω/T), P0), ω = local
 *     optima in a row without a new best; otherwise recency-based (the depot left alone the
 *     longest) or random; after T optima without progress a strong random jump of Lmax.
 * Each moved depot stays tabu for a tenure drawn uniformly from [tenureMin, tenureMax]
 * (a random tenure matters a lot on the G-set, see references.md).
 * Moves scan the free depots' delta array (works for real weights, no buckets needed).
 */
export interface TabuMaxcutOptions {
  /** Jump length after a new local optimum, as a share of the free depots (L0). */
  jumpShare: number;
  /** Strong jump length share (Lmax). */
  strongJumpShare: number;
  /** Local optima without progress before a strong jump (T). */
  stagnation: number;
  /** Floor for the probability of a directed jump (P0). */
  directedFloor: number;
  /** Probability of recency-based (vs random) when not directed (Q). */
  recencyShare: number;
  tenureMin: number;
  /** Upper tenure as a share of the free depots. */
  tenureShare: number;
}

export const tabuMaxcutDefaults: TabuMaxcutOptions = {
  // Values in the range reported by Benlic & Hao 2013 [memory]: L0 = 0.01n, Lmax = 0.1n,
  // T = 1000, P0 = 0.8, Q = 0.5, tenure in [3, n/10].
  jumpShare: 0.01,
  strongJumpShare: 0.1,
  stagnation: 1000,
  directedFloor: 0.8,
  recencyShare: 0.5,
  tenureMin: 3,
  tenureShare: 0.1,
};

export interface TabuRun {
  side: Int8Array;
  cut: number;
  moves: number;
  /** Seconds into the run when the best cut was found. */
  bestAt: number;
}

export async function tabuMaxcut(
  problem: Problem,
  start: Int8Array,
  opts: TabuMaxcutOptions,
  rng: Rng,
  control: RunControl,
  target = Infinity,
): Promise<TabuRun> {
  const net = problem.network;
  const n = net.n;
  const freeList: number[] = [];
  for (let i = 0; i < n; i++) if (problem.pins[i] < 0) freeList.push(i);
  const free = Int32Array.from(freeList);
  const f = free.length;
  const st = createFlipState(net, start);
  const delta = st.delta;
  let best = st.cut;
  let bestSide = st.side.slice();
  let bestAt = control.elapsed();
  if (f === 0) return { side: bestSide, cut: best, moves: 0, bestAt };

  const tabuUntil = new Float64Array(n);
  const lastMoved = new Float64Array(n);
  let iter = 0;
  const L0 = Math.max(1, Math.round(opts.jumpShare * f));
  const Lmax = Math.max(L0 + 1, Math.round(opts.strongJumpShare * f));
  const tMin = Math.max(1, Math.min(opts.tenureMin, f - 1));
  const tMax = Math.max(tMin, Math.round(opts.tenureShare * f));
  const eps = 1e-9;

  const move = (v: number): void => {
    flipDepot(net, st, v);
    iter++;
    lastMoved[v] = iter;
    tabuUntil[v] = iter + tMin + rng.int(tMax - tMin + 1);
  };
  const ascend = (): void => {
    for (;;) {
      let bv = -1, bd = eps, ties = 0;
      for (let t = 0; t < f; t++) {
        const v = free[t];
        const d = delta[v];
        if (d > bd + eps) { bd = d; bv = v; ties = 1; }
        else if (bv >= 0 && d > bd - eps && rng.int(++ties) === 0) bv = v;
      }
      if (bv < 0) return;
      move(bv); // descent moves count as recent too (tabu for the next jump)
    }
  };
  const directedMove = (): void => {
    let bv = -1, bd = -Infinity, ties = 0;
    for (let t = 0; t < f; t++) {
      const v = free[t];
      const d = delta[v];
      if (tabuUntil[v] > iter && st.cut + d <= best + eps) continue;
      if (d > bd + eps) { bd = d; bv = v; ties = 1; }
      else if (d > bd - eps && rng.int(++ties) === 0) bv = v;
    }
    move(bv >= 0 ? bv : free[rng.int(f)]);
  };
  const recencyMove = (): void => {
    let bv = free[0];
    for (let t = 1; t < f; t++) if (lastMoved[free[t]] < lastMoved[bv]) bv = free[t];
    move(bv);
  };

  let L = L0;
  let omega = 0;
  let previousOptimum = NaN;
  for (;;) {
    if (best >= target - eps) break;
    ascend();
    if (st.cut > best + eps) {
      best = st.cut;
      bestSide.set(st.side);
      bestAt = control.elapsed();
      omega = 0;
      if (best >= target - eps) break;
    } else omega++;
    L = Math.abs(st.cut - previousOptimum) <= eps ? L + 1 : L0;
    previousOptimum = st.cut;
    if (await control.tick(best, iter)) break;
    if (omega > opts.stagnation) {
      for (let j = 0; j < Lmax; j++) move(free[rng.int(f)]);
      omega = 0;
      continue;
    }
    const pDirected = Math.max(Math.exp(-omega / opts.stagnation), opts.directedFloor);
    const jump = Math.min(L, Lmax);
    const r = rng.next();
    for (let j = 0; j < jump; j++) {
      if (r < pDirected) directedMove();
      else if (rng.next() < opts.recencyShare) recencyMove();
      else move(free[rng.int(f)]);
      // A jump can walk straight into a better cut; keep it.
      if (st.cut > best + eps) {
        best = st.cut;
        bestSide.set(st.side);
        bestAt = control.elapsed();
        omega = 0;
      }
    }
  }
  bestSide = bestSide.slice();
  return { side: bestSide, cut: best, moves: iter, bestAt };
}
