import { maxPartWeight } from '../problem/evaluate';
import { better } from '../problem/compare';
import { senseOf, type Problem } from '../problem/types';

/**
 * Exact enumeration for max-cut and balanced bisection (two sides).
 *
 * The free depots are split into a "low" block of L depots and a "high" block. For a fixed
 * high configuration the cut is  base + Σ_i c_i·x_i + lowCut[x_low]  (x_i the low sides), so
 * the inner Gray-code walk over the 2^L low configurations costs O(1) per state: one table
 * look-up and one add. Flipping one high depot (outer Gray code) updates base and c in
 * O(degree). Side weights for the balance rule follow the same split (lowWeight table).
 *
 * Work is cut into 2^splitBits chunks by fixing the top `splitBits` high depots, so threads
 * can share it. With no pins one depot is fixed to side 0: a cut and its mirror are equal
 * and the balance rule is symmetric.
 */
export interface ExactPlan {
  /** Depots enumerated, low block first (length = low + high). */
  order: Int32Array;
  low: number;
  high: number;
  /** Side per depot that never changes (pins, the symmetry depot), −1 for enumerated ones. */
  fixedSide: Int8Array;
  /** Number of top high depots fixed per chunk. */
  splitBits: number;
}

export interface ExactBest {
  /** Best value found in the chunks enumerated (−∞ / +∞ when none was feasible). */
  value: number;
  /** Side per depot of the best state, or null when no state was feasible. */
  assignment: Int8Array | null;
  /** States visited. */
  states: number;
  /** False when a deadline stopped the walk before every state was seen. */
  complete: boolean;
}

/** Number of depots the enumeration walks over (its cost is 2^this). */
export function enumeratedDepots(problem: Problem): number {
  let free = 0;
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] < 0) free++;
  return free === problem.pins.length && free > 0 ? free - 1 : free;
}

export function planExact(problem: Problem, chunksWanted = 1): ExactPlan {
  const n = problem.network.n;
  const fixedSide = new Int8Array(n).fill(-1);
  const free: number[] = [];
  for (let i = 0; i < n; i++) {
    if (problem.pins[i] >= 0) fixedSide[i] = problem.pins[i];
    else free.push(i);
  }
  // Symmetry: with no pins fix the best-connected depot (it constrains most, order does not matter for correctness).
  if (free.length === n && n > 0) {
    const sym = free.pop()!;
    fixedSide[sym] = 0;
  }
  const f = free.length;
  const low = Math.min(f, 16);
  const high = f - low;
  let splitBits = 0;
  while ((1 << splitBits) < chunksWanted && splitBits < high) splitBits++;
  return { order: Int32Array.from(free), low, high, fixedSide, splitBits };
}

/**
 * A resumable walk over one chunk: `run(maxOuter)` advances at most maxOuter outer steps and
 * returns true when the chunk is finished, so callers can check time and cancel in between.
 */
export function createChunkWalk(problem: Problem, plan: ExactPlan, chunk: number) {
  const { n, adjStart, adjIndex, adjWeight, laneFrom, laneTo, laneWeight, m, depotWeight } = problem.network;
  const maximise = problem.kind === 'maxcut';
  const { order, low, high, splitBits } = plan;
  const side = new Int8Array(n);
  const lowPos = new Int32Array(n).fill(-1);
  for (let i = 0; i < n; i++) side[i] = plan.fixedSide[i] >= 0 ? plan.fixedSide[i] : 0;
  for (let b = 0; b < low; b++) lowPos[order[b]] = b;
  // Chunk prefix: the top splitBits high depots take the bits of `chunk`.
  for (let b = 0; b < splitBits; b++) side[order[low + high - 1 - b]] = (chunk >> b) & 1;
  const outerBits = high - splitBits;

  // Low-block tables: cut among low depots and side-1 weight, per low configuration.
  const size = 1 << low;
  const lowCut = new Float64Array(size);
  const lowWeight = new Float64Array(size);
  const lowNeighbourW = new Float64Array(low * low);
  for (let e = 0; e < m; e++) {
    const a = lowPos[laneFrom[e]], b = lowPos[laneTo[e]];
    if (a >= 0 && b >= 0) {
      lowNeighbourW[a * low + b] += laneWeight[e];
      lowNeighbourW[b * low + a] += laneWeight[e];
    }
  }
  for (let g = 1; g < size; g++) {
    const top = 31 - Math.clz32(g);
    const rest = g ^ (1 << top);
    // Moving depot `top` to side 1: lanes to side-0 low depots start crossing, lanes to
    // side-1 ones stop (all low depots above `top` are on side 0 in both states).
    let add = 0;
    for (let j = 0; j < low; j++) {
      if (j === top) continue;
      add += ((rest >> j) & 1) === 0 ? lowNeighbourW[top * low + j] : -lowNeighbourW[top * low + j];
    }
    lowCut[g] = lowCut[rest] + add;
    lowWeight[g] = lowWeight[rest] + depotWeight[order[top]];
  }

  // base and c for the starting high configuration.
  const c = new Float64Array(low);
  let base = 0;
  let highWeight = 0;
  for (let i = 0; i < n; i++) if (lowPos[i] < 0 && side[i] === 1) highWeight += depotWeight[i];
  for (let e = 0; e < m; e++) {
    const u = laneFrom[e], v = laneTo[e], w = laneWeight[e];
    const pu = lowPos[u], pv = lowPos[v];
    if (pu < 0 && pv < 0) {
      if (side[u] !== side[v]) base += w;
    } else if (pu >= 0 && pv < 0) {
      if (side[v] === 1) { base += w; c[pu] -= w; } else c[pu] += w;
    } else if (pv >= 0 && pu < 0) {
      if (side[u] === 1) { base += w; c[pv] -= w; } else c[pv] += w;
    }
  }

  let total = 0;
  for (let i = 0; i < n; i++) total += depotWeight[i];
  const limit = maxPartWeight(problem);
  const lo = total - limit, hi = limit;
  const balanced = problem.kind !== 'maxcut';

  let bestValue = maximise ? -Infinity : Infinity;
  let bestSide: Int8Array | null = null;
  let bestLow = 0;
  let outerStep = 0;
  const outerCount = 2 ** outerBits;
  let states = 0;

  const scanLow = (): void => {
    let g = 0, lin = 0;
    let localBest = maximise ? -Infinity : Infinity;
    let localG = -1;
    if (balanced) {
      const w0 = highWeight;
      for (let t = 0; t < size; t++) {
        if (t > 0) {
          const bit = 31 - Math.clz32(t & -t);
          g ^= 1 << bit;
          lin += (g >> bit) & 1 ? c[bit] : -c[bit];
        }
        const w1 = w0 + lowWeight[g];
        if (w1 < lo || w1 > hi) continue;
        const v = lin + lowCut[g];
        if (maximise ? v > localBest : v < localBest) { localBest = v; localG = g; }
      }
    } else {
      for (let t = 0; t < size; t++) {
        if (t > 0) {
          const bit = 31 - Math.clz32(t & -t);
          g ^= 1 << bit;
          lin += (g >> bit) & 1 ? c[bit] : -c[bit];
        }
        const v = lin + lowCut[g];
        if (v > localBest) { localBest = v; localG = g; }
      }
    }
    states += size;
    if (localG >= 0) {
      const v = base + localBest;
      if (maximise ? v > bestValue : v < bestValue) {
        bestValue = v;
        bestSide = side.slice();
        bestLow = localG;
      }
    }
  };

  const flipHigh = (h: number): void => {
    const s = side[h];
    for (let p = adjStart[h]; p < adjStart[h + 1]; p++) {
      const j = adjIndex[p], w = adjWeight[p];
      const pj = lowPos[j];
      if (pj >= 0) {
        if (s === 0) { c[pj] -= 2 * w; base += w; } else { c[pj] += 2 * w; base -= w; }
      } else base += side[j] === s ? w : -w;
    }
    side[h] = (1 - s) as 0 | 1;
    highWeight += s === 0 ? depotWeight[h] : -depotWeight[h];
  };

  return {
    run(maxOuter: number): boolean {
      const stop = Math.min(outerCount, outerStep + maxOuter);
      for (; outerStep < stop; outerStep++) {
        if (outerStep > 0) {
          const t = outerStep;
          const bit = 31 - Math.clz32(t & -t);
          flipHigh(order[low + bit]);
        }
        scanLow();
      }
      return outerStep >= outerCount;
    },
    /** Best value so far in this chunk (±∞ before a feasible state). */
    bestValue: (): number => bestValue,
    /** Outer steps per chunk (for progress). */
    outerCount,
    result(): ExactBest {
      let assignment: Int8Array | null = null;
      if (bestSide !== null) {
        assignment = (bestSide as Int8Array).slice();
        for (let b = 0; b < low; b++) assignment[order[b]] = ((bestLow >> b) & 1) as 0 | 1;
      }
      return { value: bestValue, assignment, states, complete: outerStep >= outerCount };
    },
  };
}

/** Merge chunk results by the problem's sense. */
export function betterExact(problem: Problem, a: ExactBest, b: ExactBest): ExactBest {
  const states = a.states + b.states;
  const complete = a.complete && b.complete;
  if (a.assignment === null) return { ...b, states, complete };
  if (b.assignment === null) return { ...a, states, complete };
  // Both walks keep balanced states only: the shared rule then compares values.
  const takeB = better(senseOf(problem.kind), { value: b.value, feasible: true }, { value: a.value, feasible: true });
  return { ...(takeB ? b : a), states, complete };
}

export const emptyExact = (problem: Problem): ExactBest => ({ value: problem.kind === 'maxcut' ? -Infinity : Infinity, assignment: null, states: 0, complete: true });

/**
 * Walk the given chunks synchronously (worker threads), stopping at `deadlineMs`
 * (Date.now() clock) with `complete: false`.
 */
export function enumerateChunks(problem: Problem, plan: ExactPlan, chunks: number[], deadlineMs = Infinity): ExactBest {
  let best = emptyExact(problem);
  for (const chunk of chunks) {
    const walk = createChunkWalk(problem, plan, chunk);
    let done = false;
    while (!done && Date.now() < deadlineMs) done = walk.run(64);
    best = betterExact(problem, best, walk.result());
    if (!done) return { ...best, complete: false };
  }
  return best;
}
