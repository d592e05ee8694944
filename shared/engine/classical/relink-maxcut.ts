import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { randomSides } from './balance';
import { createElitePool } from './elite-pool';
import { relinkPath } from './path-relink';
import type { RunControl } from './run-control';
import { tabuMaxcut, type TabuMaxcutOptions, type TabuRun } from './tabu-maxcut';

/**
 * Max-cut search around a pool of good cuts: tabu runs (tabu-maxcut.ts) that return after
 * `relinkStall`·n moves without a new best fill an elite pool (elite-pool.ts), then each round
 * relinks two members (path-relink.ts) and improves the child the same way, in the manner of
 * the memetic / path-relinking searches of Wu & Hao 2012 and Ma & Hao 2017. A single tabu run
 * drifts around one region of the G-set's flat landscapes; children of two good cuts start where
 * both agree and differ only on the rest.
 * With `poolSize` below 2 this is one tabu run to the time limit.
 */
export interface RelinkOptions {
  /** Elite cuts kept (below 2 = no relinking, one tabu run). */
  poolSize: number;
  /** Moves without a new best (× free depots) before an improvement run returns. */
  relinkStall: number;
  /** Members closer than this share of the depots count as one region (elite-pool.ts, minDistance). */
  relinkDistance: number;
}

export const relinkDefaults: RelinkOptions = {
  // Measured on the G-set at 20 CPU s (docs/benchmarks.md): a stall of 2000·n ended G22's first
  // run before it reached the best known value, which the single run finds after ~10 s.
  poolSize: 8,
  relinkStall: 5000,
  relinkDistance: 0.05,
};

export async function relinkMaxcut(
  problem: Problem,
  start: Int8Array,
  opts: TabuMaxcutOptions & RelinkOptions,
  rng: Rng,
  control: RunControl,
  target = Infinity,
): Promise<TabuRun> {
  if (opts.poolSize < 2) return tabuMaxcut(problem, start, opts, rng, control, target);
  const n = problem.network.n;
  const freeList: number[] = [];
  for (let i = 0; i < n; i++) if (problem.pins[i] < 0) freeList.push(i);
  const free = Int32Array.from(freeList);
  const mirrorable = free.length === n;
  const inner = { ...opts, stallMoves: opts.relinkStall };
  const pool = createElitePool(opts.poolSize, n, Math.round(opts.relinkDistance * free.length));
  let best: TabuRun | null = null;
  let moves = 0;
  const improve = async (from: Int8Array): Promise<void> => {
    const run = await tabuMaxcut(problem, from, inner, rng, control, target);
    moves += run.moves;
    if (best === null || run.cut > best.cut) best = run;
    pool.admit(run.side, run.cut);
  };
  const done = (): boolean => control.shouldStop() || (best !== null && best.cut >= target - 1e-9);
  await improve(start);
  for (let k = 1; k < opts.poolSize && !done(); k++) await improve(randomSides(problem, rng));
  const child = new Int8Array(n);
  while (!done()) {
    if (pool.size < 2) {
      await improve(randomSides(problem, rng));
      continue;
    }
    const a = rng.int(pool.size);
    let b = rng.int(pool.size - 1);
    if (b >= a) b++;
    child.set(pool.member(a));
    const step = relinkPath(problem.network, pool.member(a), pool.member(b), free, mirrorable, rng, child);
    // Parents within two flips of each other: nothing between them, start afresh instead.
    await improve(step.cut === -Infinity ? randomSides(problem, rng) : child.slice());
  }
  const found = best as unknown as TabuRun; // the first improvement run always sets it
  return { side: found.side, cut: found.cut, moves, bestAt: found.bestAt };
}
