import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { randomSides } from './balance';
import { createElitePool } from './elite-pool';
import { createPartitionCrossover } from './partition-crossover';
import { relinkPath } from './path-relink';
import type { RunControl } from './run-control';
import { tabuMaxcut, type TabuMaxcutOptions, type TabuRun } from './tabu-maxcut';

/**
 * Max-cut search around a pool of good cuts: a first tabu run (tabu-maxcut.ts) that returns after
 * `relinkStall`·n moves without a new best, then shorter ones from random starts (`startStall`),
 * fill an elite pool (elite-pool.ts); then each round takes two members and improves a child of
 * them with a tabu run (`childStall`), in the manner of the memetic / path-relinking searches of
 * Wu & Hao 2012 and Ma & Hao 2017. The child is the members' partition crossover
 * (partition-crossover.ts) when that beats both — on sparse networks two good cuts differ in
 * separate pieces, and the best of each piece adds up — and otherwise the best cut of the middle
 * of the greedy path from one to the other (path-relink.ts). A single tabu run drifts around one
 * region of the G-set's flat landscapes; children of two good cuts start where both agree and
 * differ only on the rest.
 * With `poolSize` below 2 this is one tabu run to the time limit.
 */
export interface RelinkOptions {
  /** Elite cuts kept (below 2 = no relinking, one tabu run). */
  poolSize: number;
  /** Moves without a new best (× free depots) before the first tabu run returns. */
  relinkStall: number;
  /** Members closer than this share of the depots count as one region (elite-pool.ts, minDistance). */
  relinkDistance: number;
  /** Stall (× free depots) of the runs that fill the pool after the first (0 = relinkStall). */
  startStall: number;
  /** Stall (× free depots) of the runs that improve relinked children (0 = relinkStall). */
  childStall: number;
  /**
   * Each round first crosses the two members by partition crossover (partition-crossover.ts)
   * and improves that child when it beats both; path relinking only when it does not.
   */
  crossover: boolean;
}

export const relinkDefaults: RelinkOptions = {
  // Measured on the G-set at 20 CPU s (docs/benchmarks.md): a stall of 2000·n ended G22's first
  // run before it reached the best known value, which the single run finds after ~10 s.
  poolSize: 8,
  relinkStall: 5000,
  relinkDistance: 0.05,
  // Measured on the 11 G-set instances tabu missed most often (G14, G16, G17, G19, G21, G32, G33,
  // G51–G54), 3 seeds at 20 CPU s (docs/benchmarks.md): pool runs of 1000·n after the first
  // (more rounds in the budget) 8 → 11 of 33 matched; with partition crossover 16 of 33, G32
  // and G33 in every seed (0 of 3 on G33 before). 500·n was worse (12 of 33).
  startStall: 1000,
  childStall: 1000,
  crossover: true,
};

export interface RelinkRun extends TabuRun {
  /** Tabu runs made (the pool's starting runs, then one per round). */
  runs: number;
  /** Rounds whose child came from partition crossover (the others walked a relinking path). */
  crossed: number;
}

export async function relinkMaxcut(
  problem: Problem,
  start: Int8Array,
  opts: TabuMaxcutOptions & RelinkOptions,
  rng: Rng,
  control: RunControl,
  target = Infinity,
): Promise<RelinkRun> {
  if (opts.poolSize < 2) return { ...(await tabuMaxcut(problem, start, opts, rng, control, target)), runs: 1, crossed: 0 };
  const n = problem.network.n;
  const freeList: number[] = [];
  for (let i = 0; i < n; i++) if (problem.pins[i] < 0) freeList.push(i);
  const free = Int32Array.from(freeList);
  const mirrorable = free.length === n;
  const first = { ...opts, stallMoves: opts.relinkStall };
  const starting = { ...opts, stallMoves: opts.startStall || opts.relinkStall };
  const children = { ...opts, stallMoves: opts.childStall || opts.relinkStall };
  const pool = createElitePool(opts.poolSize, n, Math.round(opts.relinkDistance * free.length));
  let best: TabuRun | null = null;
  let moves = 0, runs = 0, crossed = 0;
  const px = opts.crossover ? createPartitionCrossover(problem.network, free, mirrorable) : null;
  const child = new Int8Array(n), trial = new Int8Array(n);
  /** A crossover child that beats both its parents, to improve next. */
  let pending: Int8Array | null = null;
  /**
   * The cut of the partition-crossover child of `side` and pool member k, written to `out`, when
   * it beats both parents (the only children worth a run); −Infinity otherwise.
   */
  const crossBeatingBoth = (side: Int8Array, cut: number, k: number, out: Int8Array): number => {
    if (!px) return -Infinity;
    const c = cut + px.cross(side, pool.member(k), out, rng).gain;
    return c > Math.max(cut, pool.cutOf(k)) + 1e-9 ? c : -Infinity;
  };
  /** The best child of a new cut and any member that beats both (null when none does). */
  const crossOnArrival = (side: Int8Array, cut: number): Int8Array | null => {
    let found: Int8Array | null = null, foundCut = -Infinity;
    for (let k = 0; px && k < pool.size; k++) {
      const c = crossBeatingBoth(side, cut, k, trial);
      if (c > foundCut) {
        foundCut = c;
        found = trial.slice();
      }
    }
    return found;
  };
  const improve = async (from: Int8Array, inner: TabuMaxcutOptions): Promise<void> => {
    const run = await tabuMaxcut(problem, from, inner, rng, control, target);
    moves += run.moves;
    runs++;
    if (best === null || run.cut > best.cut) best = run;
    // Crossed with the pool as it arrives, so crossing starts while the pool is still filling.
    pending = crossOnArrival(run.side, run.cut);
    pool.admit(run.side, run.cut);
  };
  const done = (): boolean => control.shouldStop() || (best !== null && best.cut >= target - 1e-9);
  await improve(start, first);
  let startingRuns = 1;
  while (!done()) {
    if (pending) {
      const from: Int8Array = pending;
      crossed++;
      await improve(from, children);
      continue;
    }
    if (startingRuns < opts.poolSize || pool.size < 2) {
      startingRuns++;
      await improve(randomSides(problem, rng), starting);
      continue;
    }
    const a = rng.int(pool.size);
    let b = rng.int(pool.size - 1);
    if (b >= a) b++;
    if (crossBeatingBoth(pool.member(a), pool.cutOf(a), b, child) > -Infinity) {
      crossed++;
      await improve(child.slice(), children);
      continue;
    }
    child.set(pool.member(a));
    const step = relinkPath(problem.network, pool.member(a), pool.member(b), free, mirrorable, rng, child);
    // Parents within two flips of each other: nothing between them, start afresh instead.
    await improve(step.cut === -Infinity ? randomSides(problem, rng) : child.slice(), children);
  }
  const found = best as unknown as TabuRun; // the first improvement run always sets it
  return { side: found.side, cut: found.cut, moves, bestAt: found.bestAt, runs, crossed };
}
