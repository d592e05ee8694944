import type { Rng } from '../random';
import type { PartGraph } from './fm-bisection';
import { createGainHeap } from './gain-heap';

/**
 * Direct k-way Fiduccia–Mattheyses refinement (Fiduccia & Mattheyses, DAC 1982, generalised to
 * k regions as in Karypis & Kumar, J. Parallel Distrib. Comput. 48(1) 1998, and the k-way FM of
 * Sanders & Schulz, "Engineering multilevel graph partitioning algorithms", ESA 2011).
 *
 * `part` (Int8Array, region per depot, 0…k−1) is improved in place. Every move keeps the
 * target region within `limit` (the shared balance rule's maxPartWeight), so a feasible start
 * stays feasible; an overweight start is repaired first by the cheapest moves out. Pinned depots
 * (g.pin ≥ 0, the region they must take) never move. A region may empty when the balance rule
 * lets the others take its depots: the rule caps weight only (exact-kway.ts counts the same).
 *
 * A pass moves boundary depots one at a time, always the one whose best allowed move lowers the
 * crossing weight most (gains may be negative: hill-climbing), each at most once, and stops
 * after `stall` moves without a new best; it then rolls back to the best prefix. (Letting a
 * region overshoot the limit by one depot during a pass, as two-way FM does, was tried and
 * measured worse on G22 and G43.) Gains live in
 * one indexed heap keyed by each depot's best allowed gain; a key gone stale because a region
 * filled up is corrected when the depot reaches the top. A depot whose favourite region is full
 * waits on that region's list and is looked at again as soon as a depot leaves it (under a tight
 * balance most moves are blocked, and the room a move frees is where the next gain lies).
 */
export interface KwayFmOptions {
  /** Passes at most (a pass that gains nothing ends the refinement). */
  maxPasses: number;
  /** Moves without a new best before a pass stops: max(stallMin, stallShare · n). */
  stallMin: number;
  stallShare: number;
}

export const kwayFmDefaults: KwayFmOptions = { maxPasses: 10, stallMin: 30, stallShare: 0.05 };

export interface KwayFmState {
  /** Region weights, length k (kept up to date). */
  load: Float64Array;
  /** Crossing weight of `part`. */
  cut: number;
}

export function crossingOf(g: PartGraph, part: Int8Array): number {
  let cut = 0;
  for (let i = 0; i < g.n; i++) for (let p = g.adjStart[i]; p < g.adjStart[i + 1]; p++) if (g.adjIndex[p] > i && part[g.adjIndex[p]] !== part[i]) cut += g.adjWeight[p];
  return cut;
}

export function regionLoads(g: PartGraph, part: Int8Array, k: number): Float64Array {
  const load = new Float64Array(k);
  for (let i = 0; i < g.n; i++) load[part[i]] += g.vw[i];
  return load;
}

/**
 * Scratch for "how strongly is depot v tied to each region": conn[r] summed over v's lanes,
 * with the touched regions listed so clearing costs O(degree), not O(k).
 */
function createTies(k: number) {
  const conn = new Float64Array(k);
  const touched = new Int32Array(k);
  const seen = new Uint8Array(k);
  let count = 0;
  return {
    conn,
    touched,
    count: () => count,
    gather(g: PartGraph, part: Int8Array, v: number): void {
      for (let t = 0; t < count; t++) { conn[touched[t]] = 0; seen[touched[t]] = 0; }
      count = 0;
      const own = part[v];
      seen[own] = 1;
      touched[count++] = own;
      for (let p = g.adjStart[v]; p < g.adjStart[v + 1]; p++) {
        const r = part[g.adjIndex[p]];
        if (!seen[r]) { seen[r] = 1; touched[count++] = r; }
        conn[r] += g.adjWeight[p];
      }
    },
  };
}

/** Moves depots out of overweight regions, cheapest first, until every region fits (when it can). */
function repair(g: PartGraph, part: Int8Array, k: number, limit: number, load: Float64Array): void {
  const ties = createTies(k);
  for (let guard = 0; guard < g.n; guard++) {
    let over = -1;
    for (let r = 0; r < k; r++) if (load[r] > limit && (over < 0 || load[r] > load[over])) over = r;
    if (over < 0) return;
    let bv = -1, bt = -1, bLoss = Infinity;
    for (let v = 0; v < g.n; v++) {
      if (part[v] !== over || g.pin[v] >= 0) continue;
      ties.gather(g, part, v);
      for (let r = 0; r < k; r++) {
        if (r === over || load[r] + g.vw[v] > limit) continue;
        // Lighter depots first among equal losses keeps the overshoot small.
        const loss = ties.conn[over] - ties.conn[r] + 1e-9 * g.vw[v];
        if (loss < bLoss) { bLoss = loss; bv = v; bt = r; }
      }
    }
    if (bv < 0) return;
    part[bv] = bt;
    load[over] -= g.vw[bv];
    load[bt] += g.vw[bv];
  }
}

export function kwayFmRefine(g: PartGraph, part: Int8Array, k: number, limit: number, rng: Rng, opts: KwayFmOptions = kwayFmDefaults): KwayFmState {
  const { n, adjStart, adjIndex, vw, pin } = g;
  const load = regionLoads(g, part, k);
  repair(g, part, k, limit, load);
  let cut = crossingOf(g, part);
  const ties = createTies(k);
  const heap = createGainHeap(n);
  const target = new Int8Array(n);
  const locked = new Uint8Array(n);
  const movedV = new Int32Array(n);
  const movedFrom = new Int8Array(n);
  const stall = Math.max(opts.stallMin, Math.round(opts.stallShare * n));
  // A tiny random tie-break per depot and pass, so equal gains are not always taken in index order.
  const jitter = new Float64Array(n);
  const waiting: number[][] = Array.from({ length: k }, () => []);

  /** Best allowed move of v: sets target[v], returns the gain (−Infinity when none fits). */
  const bestMove = (v: number): number => {
    const own = part[v];
    ties.gather(g, part, v);
    const inside = ties.conn[own];
    let best = -Infinity, bt = -1, favourite = -1, favouriteTie = -Infinity;
    for (let t = 0; t < ties.count(); t++) {
      const r = ties.touched[t];
      if (r !== own && ties.conn[r] > favouriteTie) { favouriteTie = ties.conn[r]; favourite = r; }
      if (r === own || load[r] + vw[v] > limit) continue;
      // Among equal ties prefer the lighter region (room for later moves).
      const score = ties.conn[r] - 1e-9 * load[r];
      if (score > best) { best = score; bt = r; }
    }
    if (favourite >= 0 && load[favourite] + vw[v] > limit && (bt < 0 || ties.conn[bt] < favouriteTie)) waiting[favourite].push(v);
    if (bt < 0) return -Infinity;
    target[v] = bt;
    return ties.conn[bt] - inside;
  };
  const isBoundary = (v: number): boolean => {
    const own = part[v];
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) if (part[adjIndex[p]] !== own) return true;
    return false;
  };

  for (let pass = 0; pass < opts.maxPasses; pass++) {
    heap.clear();
    locked.fill(0);
    for (let r = 0; r < k; r++) waiting[r].length = 0;
    for (let v = 0; v < n; v++) {
      jitter[v] = rng.next() * 1e-7;
      if (pin[v] >= 0 || !isBoundary(v)) continue;
      const gain = bestMove(v);
      if (gain > -Infinity) heap.insert(v, gain + jitter[v]);
    }
    const startCut = cut;
    let bestCut = cut, bestLen = 0, len = 0, since = 0;
    while (heap.size() > 0 && since < stall) {
      const v = heap.top();
      const key = heap.topKey();
      const gain = bestMove(v);
      if (gain === -Infinity) { heap.remove(v); continue; }
      if (gain + jitter[v] < key - 1e-9) { heap.update(v, gain + jitter[v]); continue; }
      heap.remove(v);
      const from = part[v], to = target[v];
      part[v] = to;
      load[from] -= vw[v];
      load[to] += vw[v];
      cut -= gain;
      locked[v] = 1;
      movedV[len] = v;
      movedFrom[len] = from;
      len++;
      since++;
      if (cut < bestCut - 1e-9) { bestCut = cut; bestLen = len; since = 0; }
      for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
        const u = adjIndex[p];
        if (locked[u] || pin[u] >= 0) continue;
        const gu = isBoundary(u) ? bestMove(u) : -Infinity;
        if (gu === -Infinity) heap.remove(u);
        else if (heap.has(u)) heap.update(u, gu + jitter[u]);
        else heap.insert(u, gu + jitter[u]);
      }
      // `from` has room now: the depots that wanted it are looked at again.
      if (waiting[from].length > 0) {
        const list = waiting[from];
        waiting[from] = [];
        for (const u of list) {
          if (locked[u] || pin[u] >= 0 || part[u] === from) continue;
          const gu = bestMove(u);
          if (gu === -Infinity) heap.remove(u);
          else if (heap.has(u)) heap.update(u, gu + jitter[u]);
          else heap.insert(u, gu + jitter[u]);
        }
      }
    }
    for (let t = len - 1; t >= bestLen; t--) {
      const v = movedV[t], to = part[v], from = movedFrom[t];
      part[v] = from;
      load[to] -= vw[v];
      load[from] += vw[v];
    }
    cut = bestCut;
    if (!(bestCut < startCut - 1e-9)) break;
  }
  return { load, cut: crossingOf(g, part) };
}
