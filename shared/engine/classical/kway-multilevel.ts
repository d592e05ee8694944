import type { Rng } from '../random';
import { coarsen, type PartGraph } from './fm-bisection';
import { kwayFmDefaults, kwayFmRefine, type KwayFmOptions } from './kway-fm';
import { kwayDefaults, kwayPartition, type KwayOptions } from './kway';

/**
 * Multilevel k-way partitioning (Karypis & Kumar, "A fast and high quality multilevel scheme for
 * partitioning irregular graphs", SIAM J. Sci. Comput. 20(1) 1998; Karypis & Kumar, "Multilevel
 * k-way partitioning scheme for irregular graphs", J. Parallel Distrib. Comput. 48(1) 1998):
 * a fresh answer is k regions by recursive multilevel bisection (kway.ts: heavy-edge matching,
 * FM per split) followed by direct k-way FM refinement (kway-fm.ts) on the whole graph; an
 * improving step is an iterated V-cycle (Sanders & Schulz, ESA 2011) from the best answer so
 * far: only depots of the same region are merged, down to about `perRegion`·k depots, and k-way
 * FM refines at every level on the way up.
 *
 * g.pin holds the region a depot must take (−1 free). Answers are region per depot (Int8Array).
 */
export interface MultilevelKwayOptions {
  /** V-cycles stop coarsening at about perRegion · k depots (and at least minCoarsest). */
  perRegion: number;
  minCoarsest: number;
  fm: KwayFmOptions;
  bisect: KwayOptions;
}

export const multilevelKwayDefaults: MultilevelKwayOptions = {
  perRegion: 4,
  minCoarsest: 80,
  fm: kwayFmDefaults,
  // Splits need not be polished: k-way FM refines the whole answer afterwards.
  bisect: { ...kwayDefaults, initialTries: 2, maxPasses: 4, stall: 50, refinePasses: 0 },
};

/** A fresh answer: recursive multilevel bisection on the whole graph, then direct k-way FM. */
export function kwayFresh(g: PartGraph, k: number, limit: number, rng: Rng, opts: MultilevelKwayOptions = multilevelKwayDefaults): Int8Array {
  const part = kwayPartition(g, Int32Array.from(g.pin), k, limit, rng, opts.bisect);
  kwayFmRefine(g, part, k, limit, rng, opts.fm);
  return part;
}

/**
 * An iterated V-cycle from `start`: coarsen within regions only, refine with k-way FM from the
 * coarsest level up. Never raises the crossing weight of a feasible `start`.
 */
export function kwayVcycle(g: PartGraph, k: number, limit: number, rng: Rng, start: Int8Array, opts: MultilevelKwayOptions = multilevelKwayDefaults): Int8Array {
  let total = 0, maxW = 0;
  for (let i = 0; i < g.n; i++) { total += g.vw[i]; maxW = Math.max(maxW, g.vw[i]); }
  const coarsest = Math.max(opts.minCoarsest, opts.perRegion * k);
  // A merged depot stays well below a region's share, so moves between regions stay possible.
  const maxVertexWeight = Math.max(maxW, Math.min((1.5 * total) / coarsest, limit / 4));
  const levels: Array<{ graph: PartGraph; map: Int32Array }> = [];
  let cur = g;
  let keep: Int8Array = start;
  while (cur.n > coarsest) {
    const next = coarsen(cur, rng, maxVertexWeight, keep);
    if (!next || !next.keep) break;
    levels.push({ graph: cur, map: next.map });
    cur = next.coarse;
    keep = next.keep;
  }
  let part = keep.slice();
  kwayFmRefine(cur, part, k, limit, rng, opts.fm);
  for (let l = levels.length - 1; l >= 0; l--) {
    const { graph, map } = levels[l];
    const fine = new Int8Array(graph.n);
    for (let i = 0; i < graph.n; i++) fine[i] = part[map[i]];
    kwayFmRefine(graph, fine, k, limit, rng, opts.fm);
    part = fine;
  }
  return part;
}
