import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { createElitePool } from './elite-pool';
import { createMaxcutMoves } from './maxcut-moves';
import { RecencyList } from './recency-list';
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
 * Opt-in (off by default, see the defaults): kicks (that strong jump, and the kick of a stalled
 * tabu walk, below) may restart from a child of two elite solutions (elite-pool.ts, after Wu &
 * Hao 2012; the best cut of each period between kicks is offered to the pool), and a search with
 * no new best for restartStagnation·n moves may restart from a random assignment.
 * Each moved depot stays tabu for a tenure drawn uniformly from [tenureMin, tenureMax]
 * (a random tenure matters a lot on the G-set, see references.md).
 * Move choices come from maxcut-moves.ts (gain buckets with tabu depots kept apart for integer
 * lanes, a scan for real ones); the recency-based jump from recency-list.ts, both O(1) per move.
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
  /** Moves per epoch (× free depots) before switching between breakout and tabu walk; 0 = breakout only. */
  epochMoves: number;
  /** Lower tenure during the tabu walk. */
  walkTenureMin: number;
  /** Walk moves without a new best (× free depots) before a random kick. */
  walkStagnation: number;
  /** Moves without a new best (× free depots) before the search restarts from a random assignment (0 = never). */
  restartStagnation: number;
  /** Elite solutions kept for recombination at kicks (0 = random kicks only). */
  eliteSize: number;
  /** Share of kicks that restart from a combination of two elite solutions instead of a random jump. */
  combineShare: number;
  /**
   * Moves without a new best (× free depots) after which the run returns (0 = run to the time
   * limit): the improvement step of the path-relinking search (relink-maxcut.ts).
   */
  stallMoves: number;
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
  // Tuned here on G1, G2, G11, G14, G18, G22, G32, G43, G51 at 4 s (see tests/bench/classical.ts).
  epochMoves: 200,
  walkTenureMin: 20,
  walkStagnation: 100,
  // Both off: on G14–G20 and G51 at 5 CPU s (several seeds) neither beat the plain schedule
  // beyond the seed-to-seed spread; tests/bench/classical.ts keeps measuring them on G18–G20.
  restartStagnation: 0,
  eliteSize: 0,
  combineShare: 0.5,
  stallMoves: 0,
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
  const L0 = Math.max(1, Math.round(opts.jumpShare * f));
  const Lmax = Math.max(L0 + 1, Math.round(opts.strongJumpShare * f));
  const tMin = Math.max(1, Math.min(opts.tenureMin, f - 1));
  const tMax = Math.max(tMin, Math.round(opts.tenureShare * f));
  const wMin = Math.max(1, Math.min(opts.walkTenureMin, f - 1));
  const bTenure = [tMin, tMax];
  const wTenure = [wMin, Math.max(wMin, tMax)];
  const moves = createMaxcutMoves(net, start, free, Math.max(tMax, wTenure[1]), rng);
  let best = moves.cut();
  let bestSide = start.slice();
  let bestAt = control.elapsed();
  if (f === 0) return { side: bestSide, cut: best, moves: 0, bestAt };
  const side = moves.side;
  const eps = 1e-9;
  const recency = new RecencyList(n, free);
  let iter = 0;
  const flip = (v: number): void => moves.flip(v);

  let tMinNow = tMin, tMaxNow = tMax;
  const move = (v: number): void => {
    moves.flip(v);
    iter++;
    moves.release(iter);
    recency.touch(v);
    moves.hold(v, iter + tMinNow + rng.int(tMaxNow - tMinNow + 1));
  };
  const ascend = (): void => {
    // Descent moves count as recent too (tabu for the next jump).
    for (let v = moves.ascent(); v >= 0; v = moves.ascent()) move(v);
  };
  const directedMove = (): void => {
    const v = moves.directed(best);
    move(v >= 0 ? v : free[rng.int(f)]);
  };
  const recencyMove = (): void => move(recency.oldest());

  let L = L0;
  let omega = 0;
  let previousOptimum = NaN;
  // Epochs alternate between the breakout loop and a plain tabu walk (every move the best
  // admissible one, longer tenure). Measured on the G-set here: the walk wins on dense
  // random graphs (G1–G3, G22), the breakout loop on toroidal ones (G11, G32); alternating
  // keeps both strengths at the cost of half the time for each.
  const epoch = Math.max(1000, Math.round(opts.epochMoves * f));
  let walking = false;
  let epochEnd = iter + epoch;
  let lastImprove = 0;
  // The best cut since the last kick (offered to the elite pool at the next kick).
  const pool = opts.eliteSize >= 2 ? createElitePool(opts.eliteSize, n) : null;
  let periodBest = -Infinity;
  const periodSide = new Int8Array(n);
  const childSide = new Int8Array(n);
  const mirrorable = f === n;
  const kick = (): void => {
    if (pool) {
      pool.admit(periodSide, periodBest);
      periodBest = -Infinity;
    }
    if (pool && rng.next() < opts.combineShare && pool.child(rng, free, mirrorable, childSide)) {
      // Plain flips: the restart is a new start, not a sequence of tabu moves.
      for (let t = 0; t < f; t++) if (side[free[t]] !== childSide[free[t]]) flip(free[t]);
    } else {
      for (let j = 0; j < Lmax; j++) move(free[rng.int(f)]);
    }
  };
  const record = (): void => {
    if (pool && moves.cut() > periodBest) {
      periodBest = moves.cut();
      periodSide.set(side);
    }
    if (moves.cut() > best + eps) {
      best = moves.cut();
      bestSide.set(side);
      bestAt = control.elapsed();
      omega = 0;
      lastImprove = iter;
      lastBest = iter;
    }
  };
  let nextTick = 0;
  let lastBest = 0;
  const restartAfter = opts.restartStagnation > 0 ? opts.restartStagnation * f : Infinity;
  const stallAfter = opts.stallMoves > 0 ? opts.stallMoves * f : Infinity;
  while (best < target - eps && iter - lastBest <= stallAfter) {
    if (iter - lastBest > restartAfter) {
      for (let t = 0; t < f; t++) if (rng.int(2) === 1) flip(free[t]);
      moves.releaseAll();
      walking = false;
      [tMinNow, tMaxNow] = bTenure;
      epochEnd = iter + epoch;
      omega = 0;
      L = L0;
      lastImprove = lastBest = iter;
      periodBest = -Infinity;
    }
    if (walking) {
      for (let j = 0; j < 1000; j++) {
        directedMove();
        record();
      }
      if (iter - lastImprove > opts.walkStagnation * f) {
        kick();
        lastImprove = iter;
      }
    } else {
      ascend();
      const before = best;
      record();
      if (best === before) omega++;
      L = Math.abs(moves.cut() - previousOptimum) <= eps ? L + 1 : L0;
      previousOptimum = moves.cut();
      if (omega > opts.stagnation) {
        kick();
        omega = 0;
      } else {
        const pDirected = Math.max(Math.exp(-omega / opts.stagnation), opts.directedFloor);
        const jump = Math.min(L, Lmax);
        const r = rng.next();
        for (let j = 0; j < jump; j++) {
          if (r < pDirected) directedMove();
          else if (rng.next() < opts.recencyShare) recencyMove();
          else move(free[rng.int(f)]);
          record(); // a jump can walk straight into a better cut
        }
      }
    }
    if (iter >= epochEnd && opts.epochMoves > 0) {
      walking = !walking;
      [tMinNow, tMaxNow] = walking ? wTenure : bTenure;
      epochEnd = iter + epoch;
      lastImprove = iter;
    }
    // The clock and the event loop every ~1000 moves, not after every local optimum: a tick
    // (an await, and a clock read) costs as much as dozens of moves.
    if (iter >= nextTick) {
      nextTick = iter + 1024;
      if (await control.tick(best, iter)) break;
    }
  }
  bestSide = bestSide.slice();
  return { side: bestSide, cut: best, moves: iter, bestAt };
}
