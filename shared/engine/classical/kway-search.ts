import type { Rng } from '../random';
import type { PartGraph } from './fm-bisection';
import { crossingOf, regionLoads } from './kway-fm';
import { kwayFresh, kwayVcycle, multilevelKwayDefaults, type MultilevelKwayOptions } from './kway-multilevel';
import type { RunControl } from './run-control';

/**
 * The anytime k-way search: a fresh answer (recursive bisection + k-way FM), then `vcycles`
 * iterated V-cycles from the best answer so far (none on a graph too small to coarsen), repeated with new random choices until the
 * control says stop or `cycles` ran. Feasible answers (every region within `limit`) rank first,
 * then the lower crossing weight. `trace` lists each improvement with the control's elapsed time,
 * so a benchmark reads the best after 1 s and after 10 s from one run.
 */
export interface KwaySearchResult {
  part: Int8Array;
  cut: number;
  feasible: boolean;
  cycles: number;
  trace: Array<{ seconds: number; cut: number }>;
}

export async function kwaySearch(
  g: PartGraph, k: number, limit: number, rng: Rng, control: RunControl,
  opts: { vcycles: number; cycles: number; ml?: MultilevelKwayOptions },
): Promise<KwaySearchResult> {
  const ml = opts.ml ?? multilevelKwayDefaults;
  let best: Int8Array | null = null;
  let bestCut = Infinity, bestFeasible = false;
  const trace: KwaySearchResult['trace'] = [];
  let cycles = 0;
  // A graph already at the coarsest size has no levels to cycle through: fresh answers only.
  const vcycles = g.n > Math.max(ml.minCoarsest, ml.perRegion * k) ? opts.vcycles : 0;
  while (cycles < opts.cycles) {
    const iterate: boolean = best !== null && bestFeasible && cycles % (vcycles + 1) !== 0;
    const part: Int8Array = iterate ? kwayVcycle(g, k, limit, rng, best!, ml) : kwayFresh(g, k, limit, rng, ml);
    cycles++;
    const cut = crossingOf(g, part);
    const feasible = regionLoads(g, part, k).every((w) => w <= limit);
    if (best === null || (feasible && !bestFeasible) || (feasible === bestFeasible && cut < bestCut - 1e-9)) {
      best = part;
      bestCut = cut;
      bestFeasible = feasible;
      trace.push({ seconds: control.elapsed(), cut });
    }
    if (await control.tick(bestCut, cycles)) break;
    if (control.shouldStop()) break;
  }
  return { part: best!, cut: bestCut, feasible: bestFeasible, cycles, trace };
}
