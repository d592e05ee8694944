import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { balanceWindow } from './balance';
import { createFlipState, flipDepot, laneBetween } from './flip-state';
import type { RunControl } from './run-control';

/**
 * Simulated annealing with a geometric schedule (Kirkpatrick, Gelatt, Vecchi 1983; common
 * practice). Calibration: the start temperature accepts an average losing move with
 * probability `acceptStart`, the end temperature with `acceptEnd`, both measured on random
 * moves from the start state. Each run lasts `sweeps` × free depots moves; runs repeat
 * (from the best state, re-heated to a tenth of the start) until the time is up.
 * Max-cut moves flip one depot; bisection moves flip one depot when the balance window
 * allows it, else swap two depots from opposite sides.
 */
export interface AnnealOptions {
  sweeps: number;
  acceptStart: number;
  acceptEnd: number;
}

export const annealDefaults: AnnealOptions = { sweeps: 2000, acceptStart: 0.5, acceptEnd: 0.001 };

export async function anneal(problem: Problem, start: Int8Array, opts: AnnealOptions, rng: Rng, control: RunControl) {
  const net = problem.network;
  const dw = net.depotWeight;
  const maximise = problem.kind === 'maxcut';
  const free: number[] = [];
  for (let i = 0; i < net.n; i++) if (problem.pins[i] < 0) free.push(i);
  const f = free.length;
  const { lo, hi } = balanceWindow(problem);
  const fits = (w1: number): boolean => maximise || (w1 >= lo && w1 <= hi);
  const st = createFlipState(net, start);
  // "loss" of a change: positive when it makes the answer worse.
  const lossOf = (change: number): number => (maximise ? -change : change);
  let best = st.cut;
  const bestSide = st.side.slice();
  let bestAt = 0;
  let moves = 0;
  if (f < 2) return { side: bestSide, cut: best, moves, bestAt };

  let sum = 0, count = 0;
  for (let s = 0; s < 200; s++) {
    const loss = lossOf(st.delta[free[rng.int(f)]]);
    if (loss > 0) { sum += loss; count++; }
  }
  const typical = count > 0 ? sum / count : 1;
  const tStart = typical / -Math.log(opts.acceptStart);
  const tEnd = typical / -Math.log(opts.acceptEnd);

  const perRun = Math.max(1000, opts.sweeps * f);
  let heat = tStart;
  const better = (a: number, b: number): boolean => (maximise ? a > b + 1e-9 : a < b - 1e-9);
  outer: for (;;) {
    const ratio = Math.pow(tEnd / heat, 1 / perRun);
    let temp = heat;
    for (let t = 0; t < perRun; t++, temp *= ratio) {
      const a = free[rng.int(f)];
      const flipW1 = st.weight1 + (st.side[a] === 0 ? dw[a] : -dw[a]);
      if (fits(flipW1)) {
        const loss = lossOf(st.delta[a]);
        if (loss <= 0 || rng.next() < Math.exp(-loss / temp)) flipDepot(net, st, a);
      } else {
        const b = free[rng.int(f)];
        if (st.side[a] === st.side[b]) continue;
        const w1 = st.weight1 + (st.side[a] === 0 ? dw[a] - dw[b] : dw[b] - dw[a]);
        if (!fits(w1)) continue;
        const loss = lossOf(st.delta[a] + st.delta[b] + 2 * laneBetween(net, a, b));
        if (loss <= 0 || rng.next() < Math.exp(-loss / temp)) {
          flipDepot(net, st, a);
          flipDepot(net, st, b);
        }
      }
      moves++;
      if (better(st.cut, best) && fits(st.weight1)) {
        best = st.cut;
        bestSide.set(st.side);
        bestAt = control.elapsed();
      }
      if ((t & 4095) === 0 && (await control.tick(best, moves))) break outer;
    }
    for (let i = 0; i < f; i++) if (st.side[free[i]] !== bestSide[free[i]]) flipDepot(net, st, free[i]);
    heat = tStart / 10;
  }
  return { side: bestSide.slice(), cut: best, moves, bestAt };
}
