import type { Rng } from '../random';
import { createGainHeap } from './gain-heap';

/**
 * Balanced two-way partitioning of a weighted graph: Fiduccia–Mattheyses refinement
 * (Fiduccia & Mattheyses, DAC 1982; Kernighan & Lin, Bell Syst. Tech. J. 49(2) 1970) inside
 * a multilevel scheme with heavy-edge matching (Karypis & Kumar, SIAM J. Sci. Comput. 20(1)
 * 1998). Side-1 weight must end inside [lo, hi]; pinned depots (pin 0/1) never move and are
 * only merged with depots of the same pin or free ones.
 */
export interface PartGraph {
  n: number;
  adjStart: Int32Array;
  adjIndex: Int32Array;
  adjWeight: Float64Array;
  /** Depot (or merged depot) weight. */
  vw: Float64Array;
  /** −1 free, else the side the depot must take. */
  pin: Int8Array;
}

export interface Window {
  lo: number;
  hi: number;
}

const violation = (w1: number, win: Window): number => (w1 > win.hi ? w1 - win.hi : w1 < win.lo ? win.lo - w1 : 0);

export function cutOf(g: PartGraph, side: Int8Array): number {
  let cut = 0;
  for (let i = 0; i < g.n; i++) for (let p = g.adjStart[i]; p < g.adjStart[i + 1]; p++) if (g.adjIndex[p] > i && side[g.adjIndex[p]] !== side[i]) cut += g.adjWeight[p];
  return cut;
}

/**
 * FM passes until a pass gains nothing. Each pass moves every free depot at most once, always
 * the highest-gain move whose side can take it (moves that shrink a balance violation are
 * forced first), then rolls back to the best prefix. Gains live in one indexed heap per side,
 * so a pass costs O(|E| log n). Returns the final crossing weight.
 */
export function fmRefine(g: PartGraph, side: Int8Array, win: Window, opts: { maxPasses: number; stall: number }): number {
  const { n, adjStart, adjIndex, adjWeight, vw, pin } = g;
  const gain = new Float64Array(n); // crossing-weight reduction if the depot moves
  const heaps = [createGainHeap(n), createGainHeap(n)];
  const locked = new Uint8Array(n);
  const moved = new Int32Array(n);
  let w1 = 0;
  for (let i = 0; i < n; i++) if (side[i] === 1) w1 += vw[i];
  let cut = cutOf(g, side);
  // During a pass the window may be overstepped by one free depot's weight (as in FM: a swap
  // is two moves); only prefixes inside the window (or closer to it) are kept.
  let slack = 0;
  for (let i = 0; i < n; i++) if (pin[i] < 0 && vw[i] > slack) slack = vw[i];
  for (let pass = 0; pass < opts.maxPasses; pass++) {
    heaps[0].clear();
    heaps[1].clear();
    for (let i = 0; i < n; i++) {
      let gi = 0;
      for (let p = adjStart[i]; p < adjStart[i + 1]; p++) gi += side[adjIndex[p]] !== side[i] ? adjWeight[p] : -adjWeight[p];
      gain[i] = gi;
      locked[i] = 0;
      if (pin[i] < 0) heaps[side[i]].insert(i, gi);
    }
    const startCut = cut, startViolation = violation(w1, win);
    let bestCut = cut, bestViolation = startViolation, bestLen = 0;
    let len = 0, since = 0;
    let curCut = cut, curW1 = w1;
    while (since < opts.stall) {
      // Candidate from each side; a side is blocked when its best move would break the window
      // further (moving from s changes w1 by ∓vw).
      let pick = -1, pickGain = -Infinity;
      const v0 = violation(curW1, win);
      for (let s = 0; s < 2; s++) {
        const v = heaps[s].top();
        if (v < 0) continue;
        const nw1 = s === 0 ? curW1 + vw[v] : curW1 - vw[v];
        const nv = violation(nw1, win);
        if (nv > Math.max(v0, slack) + 1e-12) continue;
        const gk = heaps[s].topKey() + (v0 > 0 && nv < v0 ? 1e15 : 0);
        if (gk > pickGain) { pickGain = gk; pick = v; }
      }
      if (pick < 0) break;
      const s = side[pick];
      heaps[s].remove(pick);
      locked[pick] = 1;
      curCut -= gain[pick];
      curW1 += s === 0 ? vw[pick] : -vw[pick];
      side[pick] = (1 - s) as 0 | 1;
      gain[pick] = -gain[pick];
      for (let p = adjStart[pick]; p < adjStart[pick + 1]; p++) {
        const j = adjIndex[p], w2 = 2 * adjWeight[p];
        // j on pick's old side: the lane now crosses, so moving j would now save it.
        gain[j] += side[j] === s ? w2 : -w2;
        if (!locked[j] && pin[j] < 0) heaps[side[j]].update(j, gain[j]);
      }
      moved[len++] = pick;
      since++;
      const vio = violation(curW1, win);
      if (vio < bestViolation - 1e-12 || (vio <= bestViolation + 1e-12 && curCut < bestCut - 1e-9)) {
        bestViolation = vio;
        bestCut = curCut;
        bestLen = len;
        since = 0;
      }
    }
    // Roll back to the best prefix.
    for (let t = len - 1; t >= bestLen; t--) {
      const v = moved[t];
      side[v] = (1 - side[v]) as 0 | 1;
    }
    w1 = 0;
    for (let i = 0; i < n; i++) if (side[i] === 1) w1 += vw[i];
    cut = bestCut;
    if (!(bestCut < startCut - 1e-9 || bestViolation < startViolation - 1e-12)) break;
  }
  return cut;
}

/** Heavy-edge matching: returns the coarse graph and the fine → coarse map, or null when it stalls. */
export function coarsen(g: PartGraph, rng: Rng, maxVertexWeight: number, keep: Int8Array | null = null): { coarse: PartGraph; map: Int32Array; keep?: Int8Array | null } | null {
  const { n, adjStart, adjIndex, adjWeight, vw, pin } = g;
  const match = new Int32Array(n).fill(-1);
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  for (let i = n - 1; i > 0; i--) {
    const j = rng.int(i + 1);
    const t = order[i];
    order[i] = order[j];
    order[j] = t;
  }
  for (let q = 0; q < n; q++) {
    const u = order[q];
    if (match[u] >= 0) continue;
    let best = -1, bw = 0;
    for (let p = adjStart[u]; p < adjStart[u + 1]; p++) {
      const v = adjIndex[p];
      if (match[v] >= 0 || v === u || adjWeight[p] <= bw) continue;
      if (pin[u] >= 0 && pin[v] >= 0 && pin[u] !== pin[v]) continue;
      if (keep && keep[u] !== keep[v]) continue;
      if (vw[u] + vw[v] > maxVertexWeight) continue;
      best = v;
      bw = adjWeight[p];
    }
    match[u] = best >= 0 ? best : u;
    if (best >= 0) match[best] = u;
  }
  const map = new Int32Array(n).fill(-1);
  let cn = 0;
  for (let u = 0; u < n; u++) {
    if (map[u] >= 0) continue;
    map[u] = cn;
    if (match[u] !== u) map[match[u]] = cn;
    cn++;
  }
  if (cn > 0.95 * n) return null;
  const keepCoarse = keep ? new Int8Array(cn) : null;
  if (keep && keepCoarse) for (let u = 0; u < n; u++) keepCoarse[map[u]] = keep[u];
  const cvw = new Float64Array(cn);
  const cpin = new Int8Array(cn).fill(-1);
  for (let u = 0; u < n; u++) {
    cvw[map[u]] += vw[u];
    if (pin[u] >= 0) cpin[map[u]] = pin[u];
  }
  // Coarse adjacency: merge parallel lanes with a marker array, drop lanes inside a pair.
  const members = new Int32Array(n);
  const memberStart = new Int32Array(cn + 1);
  for (let u = 0; u < n; u++) memberStart[map[u] + 1]++;
  for (let c = 0; c < cn; c++) memberStart[c + 1] += memberStart[c];
  const fill = memberStart.slice(0, cn);
  for (let u = 0; u < n; u++) members[fill[map[u]]++] = u;
  const marker = new Int32Array(cn).fill(-1);
  const starts = new Int32Array(cn + 1);
  // Typed scratch of the fine size (a coarse graph never has more adjacency entries).
  const idx = new Int32Array(adjIndex.length);
  const wts = new Float64Array(adjIndex.length);
  let len = 0;
  for (let c = 0; c < cn; c++) {
    const begin = len;
    for (let q = memberStart[c]; q < memberStart[c + 1]; q++) {
      const u = members[q];
      for (let p = adjStart[u]; p < adjStart[u + 1]; p++) {
        const d = map[adjIndex[p]];
        if (d === c) continue;
        if (marker[d] < begin) {
          marker[d] = len;
          idx[len] = d;
          wts[len++] = adjWeight[p];
        } else wts[marker[d]] += adjWeight[p];
      }
    }
    starts[c + 1] = len;
  }
  return {
    coarse: { n: cn, adjStart: starts, adjIndex: idx.slice(0, len), adjWeight: wts.slice(0, len), vw: cvw, pin: cpin },
    map,
    keep: keepCoarse,
  };
}

/** Initial two-way split: pins first, then grow side 1 from a random seed by strongest pull. */
function growSplit(g: PartGraph, win: Window, rng: Rng): Int8Array {
  const { n, adjStart, adjIndex, adjWeight, vw, pin } = g;
  const side = new Int8Array(n);
  let w1 = 0;
  for (let i = 0; i < n; i++) if (pin[i] === 1) { side[i] = 1; w1 += vw[i]; }
  const target = (win.lo + win.hi) / 2;
  const pull = new Float64Array(n);
  const heap = createGainHeap(n);
  for (let i = 0; i < n; i++) if (pin[i] < 0) heap.insert(i, 0);
  const join = (v: number): void => {
    side[v] = 1;
    w1 += vw[v];
    heap.remove(v);
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
      const j = adjIndex[p];
      pull[j] += adjWeight[p];
      if (heap.has(j)) heap.update(j, pull[j]);
    }
  };
  for (let i = 0; i < n; i++) if (pin[i] === 1) for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
    const j = adjIndex[p];
    pull[j] += adjWeight[p];
    if (heap.has(j)) heap.update(j, pull[j]);
  }
  while (w1 < target && heap.size() > 0) {
    // No pull yet (start, or a finished component): take a random free depot as the next seed.
    let v = heap.top();
    if (heap.topKey() <= 0) {
      const cand: number[] = [];
      for (let i = 0; i < n && cand.length < 64; i++) if (heap.has(i)) cand.push(i);
      v = cand[rng.int(cand.length)];
    }
    if (w1 + vw[v] > win.hi) {
      heap.remove(v);
      continue;
    }
    join(v);
  }
  return side;
}

export interface MultilevelOptions {
  coarsestSize: number;
  initialTries: number;
  maxPasses: number;
  stall: number;
}

export const multilevelDefaults: MultilevelOptions = { coarsestSize: 80, initialTries: 8, maxPasses: 8, stall: 200 };

/**
 * One multilevel V-cycle: coarsen, split the coarsest graph a few ways, refine on the way up.
 * With `start`, an iterated V-cycle: only depots on the same side of `start` are merged, the
 * coarsest graph starts from `start` projected, so the result is never worse than `start`
 * (common practice in multilevel partitioners).
 */
export function multilevelBisect(g: PartGraph, win: Window, rng: Rng, opts: MultilevelOptions = multilevelDefaults, start: Int8Array | null = null): Int8Array {
  let total = 0, maxW = 0;
  for (let i = 0; i < g.n; i++) { total += g.vw[i]; maxW = Math.max(maxW, g.vw[i]); }
  const maxVertexWeight = Math.max(maxW, (1.5 * total) / opts.coarsestSize);
  const levels: Array<{ graph: PartGraph; map: Int32Array }> = [];
  let cur = g;
  let keep = start;
  while (cur.n > opts.coarsestSize) {
    const next = coarsen(cur, rng, maxVertexWeight, keep);
    if (!next) break;
    levels.push({ graph: cur, map: next.map });
    cur = next.coarse;
    keep = next.keep ?? null;
  }
  const refine = { maxPasses: opts.maxPasses, stall: Math.max(opts.stall, 50) };
  let bestSide: Int8Array | null = null;
  let bestScore = Infinity;
  const tries = keep ? 1 : opts.initialTries;
  for (let t = 0; t < tries; t++) {
    const side = keep ? keep.slice() : growSplit(cur, win, rng);
    const cut = fmRefine(cur, side, win, refine);
    let w1 = 0;
    for (let i = 0; i < cur.n; i++) if (side[i] === 1) w1 += cur.vw[i];
    const score = violation(w1, win) * 1e12 + cut;
    if (score < bestScore) { bestScore = score; bestSide = side; }
  }
  let side = bestSide!;
  for (let l = levels.length - 1; l >= 0; l--) {
    const { graph, map } = levels[l];
    const fine = new Int8Array(graph.n);
    for (let i = 0; i < graph.n; i++) fine[i] = side[map[i]];
    for (let i = 0; i < graph.n; i++) if (graph.pin[i] >= 0) fine[i] = graph.pin[i];
    fmRefine(graph, fine, win, refine);
    side = fine;
  }
  return side;
}

/** Side-1 weight of an assignment. */
export function sideWeight(g: PartGraph, side: Int8Array): number {
  let w1 = 0;
  for (let i = 0; i < g.n; i++) if (side[i] === 1) w1 += g.vw[i];
  return w1;
}

export { violation as windowViolation };
