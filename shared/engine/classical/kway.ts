import type { Rng } from '../random';
import { fmRefine, multilevelBisect, sideWeight, windowViolation, type PartGraph } from './fm-bisection';

/**
 * k-way partitioning by recursive bisection (each split by multilevel FM, regions split as
 * ⌊k/2⌋ : ⌈k/2⌉ with proportional weights), then greedy k-way boundary refinement and a
 * repair pass so every region ends within `limit` (the shared balance rule's maxPartWeight).
 * Pins name a region; during a split a pin becomes the side holding its region's range.
 */
export interface KwayOptions {
  /** FM settings for each split. */
  coarsestSize: number;
  initialTries: number;
  maxPasses: number;
  stall: number;
  refinePasses: number;
}

export const kwayDefaults: KwayOptions = { coarsestSize: 80, initialTries: 6, maxPasses: 8, stall: 200, refinePasses: 10 };

/** Sub-graph induced by `members` (in the given order). */
function induced(g: PartGraph, members: Int32Array, pin: Int8Array): PartGraph {
  const local = new Int32Array(g.n).fill(-1);
  members.forEach((v, i) => (local[v] = i));
  const starts = new Int32Array(members.length + 1);
  let size = 0;
  for (let i = 0; i < members.length; i++) size += g.adjStart[members[i] + 1] - g.adjStart[members[i]];
  const idx = new Int32Array(size), wts = new Float64Array(size);
  let len = 0;
  for (let i = 0; i < members.length; i++) {
    const v = members[i];
    for (let p = g.adjStart[v]; p < g.adjStart[v + 1]; p++) {
      const j = local[g.adjIndex[p]];
      if (j >= 0) { idx[len] = j; wts[len++] = g.adjWeight[p]; }
    }
    starts[i + 1] = len;
  }
  const vw = new Float64Array(members.length);
  members.forEach((v, i) => (vw[i] = g.vw[v]));
  return { n: members.length, adjStart: starts, adjIndex: idx.slice(0, len), adjWeight: wts.slice(0, len), vw, pin };
}

export function kwayPartition(g: PartGraph, regionPin: Int32Array, k: number, limit: number, rng: Rng, opts: KwayOptions = kwayDefaults): Int8Array {
  // Region ids live in an Int8Array (and refinement is O(n·k)): made for a handful of regions.
  if (!(k >= 1 && k <= 127)) throw new RangeError(`kwayPartition makes 1…127 regions (got ${k}); use sizeLimitedBlocks for many small blocks`);
  const part = new Int8Array(g.n);
  let total = 0;
  for (let i = 0; i < g.n; i++) total += g.vw[i];
  // Share of the slack each split may use, so the later splits keep room.
  const perPart = total / k;
  const split = (members: Int32Array, first: number, count: number): void => {
    if (count === 1) {
      for (const v of members) part[v] = first;
      return;
    }
    const k0 = Math.floor(count / 2), k1 = count - k0;
    const pin = new Int8Array(members.length).fill(-1);
    members.forEach((v, i) => {
      const r = regionPin[v];
      if (r >= 0) pin[i] = r < first + k0 ? 0 : 1;
    });
    const sub = induced(g, members, pin);
    let w = 0;
    for (let i = 0; i < sub.n; i++) w += sub.vw[i];
    const slack = Math.max(0, limit - perPart) * 0.5;
    const hi1 = Math.min(k1 * (perPart + slack), w);
    const lo1 = Math.max(0, w - k0 * (perPart + slack));
    const win = { lo: lo1, hi: hi1 };
    const side = multilevelBisect(sub, win, rng, opts);
    const m0: number[] = [], m1: number[] = [];
    members.forEach((v, i) => (side[i] === 0 ? m0 : m1).push(v));
    split(Int32Array.from(m0), first, k0);
    split(Int32Array.from(m1), first + k0, k1);
  };
  split(Int32Array.from({ length: g.n }, (_, i) => i), 0, k);
  refineKway(g, part, regionPin, k, limit, opts.refinePasses);
  return part;
}

/**
 * Greedy k-way refinement: move a free depot to the neighbouring region it is most tied to
 * when that lowers the crossing weight and the region stays within the limit; first, repair
 * any overweight region by its cheapest moves. Returns the crossing weight.
 */
/**
 * Blocks of at most `maxSize` depots (depot weights ignored), any number of them: recursive
 * multilevel bisection, each split giving the two sides ⌊c/2⌋ : ⌈c/2⌉ of the c blocks still
 * needed (±3 % of the depots), until every piece fits. No k-way refinement: blocks only need
 * few lanes between them, not balance. Returns the block id per depot, 0…B−1 (Int32Array).
 */
export function sizeLimitedBlocks(g: PartGraph, maxSize: number, rng: Rng, opts: KwayOptions = kwayDefaults): Int32Array {
  if (!(maxSize >= 1)) throw new RangeError(`blocks need at least one depot each (got maxSize ${maxSize})`);
  const block = new Int32Array(g.n);
  let next = 0;
  const split = (members: Int32Array): void => {
    if (members.length <= maxSize) {
      for (const v of members) block[v] = next;
      next++;
      return;
    }
    const count = Math.ceil(members.length / maxSize);
    const k1 = count - Math.floor(count / 2);
    const size = members.length;
    const sub = induced(g, members, new Int8Array(size).fill(-1));
    sub.vw.fill(1);
    const target = (size * k1) / count, slack = Math.max(1, 0.03 * size);
    const side = multilevelBisect(sub, { lo: Math.max(1, target - slack), hi: Math.min(size - 1, target + slack) }, rng, opts);
    const m0: number[] = [], m1: number[] = [];
    members.forEach((v, i) => (side[i] === 0 ? m0 : m1).push(v));
    if (m0.length === 0 || m1.length === 0) { // a degenerate split: halve in order instead
      split(members.slice(0, size >> 1));
      split(members.slice(size >> 1));
      return;
    }
    split(Int32Array.from(m0));
    split(Int32Array.from(m1));
  };
  if (g.n > 0) split(Int32Array.from({ length: g.n }, (_, i) => i));
  return block;
}

export function refineKway(g: PartGraph, part: Int8Array, regionPin: Int32Array, k: number, limit: number, passes: number): number {
  const { n, adjStart, adjIndex, adjWeight, vw } = g;
  const load = new Float64Array(k);
  for (let i = 0; i < n; i++) load[part[i]] += vw[i];
  const conn = new Float64Array(k);
  const tie = (v: number): void => {
    conn.fill(0);
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) conn[part[adjIndex[p]]] += adjWeight[p];
  };
  // Repair: while a region is over the limit, make the cheapest move out of it.
  for (let guard = 0; guard < n; guard++) {
    let over = -1;
    for (let r = 0; r < k; r++) if (load[r] > limit && (over < 0 || load[r] > load[over])) over = r;
    if (over < 0) break;
    let bv = -1, bt = -1, bLoss = Infinity;
    for (let v = 0; v < n; v++) {
      if (part[v] !== over || regionPin[v] >= 0) continue;
      tie(v);
      for (let r = 0; r < k; r++) {
        if (r === over || load[r] + vw[v] > limit) continue;
        const loss = conn[over] - conn[r];
        if (loss < bLoss) { bLoss = loss; bv = v; bt = r; }
      }
    }
    if (bv < 0) break;
    part[bv] = bt;
    load[over] -= vw[bv];
    load[bt] += vw[bv];
  }
  for (let pass = 0; pass < passes; pass++) {
    let improved = false;
    for (let v = 0; v < n; v++) {
      if (regionPin[v] >= 0) continue;
      const own = part[v];
      tie(v);
      let bt = -1, bGain = 1e-9;
      for (let r = 0; r < k; r++) {
        if (r === own || load[r] + vw[v] > limit) continue;
        const gain = conn[r] - conn[own];
        if (gain > bGain) { bGain = gain; bt = r; }
      }
      if (bt >= 0) {
        part[v] = bt;
        load[own] -= vw[v];
        load[bt] += vw[v];
        improved = true;
      }
    }
    if (!improved) break;
  }
  let cut = 0;
  for (let i = 0; i < n; i++) for (let p = adjStart[i]; p < adjStart[i + 1]; p++) if (adjIndex[p] > i && part[adjIndex[p]] !== part[i]) cut += adjWeight[p];
  return cut;
}

export { fmRefine, sideWeight, windowViolation };
