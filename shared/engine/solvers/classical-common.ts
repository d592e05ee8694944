/**
 * Pieces several classical solver files share: worker-thread copies, the starting sides, the
 * partitioning graph, and the settings field for threads. Worker threads are reached only through
 * loadPool (loaded on first use), so pure engine code never loads node:worker_threads.
 */
import { loadPool } from '../classical/threads/load-pool';
import { randomBalancedSides, randomSides } from '../classical/balance';
import type { PartGraph } from '../classical/fm-bisection';
import { bestOf } from '../problem/compare';
import { isFeasible } from '../problem/evaluate';
import { senseOf, type Problem } from '../problem/types';
import type { Rng } from '../random';
import { intField } from './settings';
import type { SolveContext, SolveResult } from './types';

export const threadsField = (def = 1) => intField(def, 1, 8);

/** Run `copies` of a classical solver in worker threads with forked seeds (null answers dropped). */
export async function workerCopies(name: string, problem: Problem, settings: unknown, ctx: SolveContext, copies: number, rng: Rng): Promise<SolveResult[]> {
  if (copies <= 0) return [];
  const { runInWorker } = loadPool();
  const runs = Array.from({ length: copies }, () =>
    runInWorker(
      { task: 'solve', solver: name, problem, settings, seed: rng.fork().int(2 ** 31), timeLimitSeconds: ctx.timeLimitSeconds },
      { cancel: ctx.cancel, killAfterSeconds: ctx.timeLimitSeconds + 30 },
    ).catch(() => null),
  );
  return (await Promise.all(runs)).filter((r): r is SolveResult => r !== null);
}

/** The best of several answers to one problem (problem/compare.ts: feasible first, then value). */
export function pickBest(problem: Problem, results: SolveResult[]): SolveResult {
  return bestOf(senseOf(problem.kind), results, (r) => ({ value: r.value, feasible: !r.infeasible && isFeasible(problem, r.assignment) }))!;
}

/** A starting assignment that respects pins (and the balance window for two-sided min). */
export function startSides(problem: Problem, rng: Rng): Int8Array {
  return problem.kind === 'maxcut' ? randomSides(problem, rng) : randomBalancedSides(problem, rng);
}

/** Pinned depots at their pin, the rest on side/region 0 (an answer when nothing better was found). */
export function fallbackAssignment(problem: Problem): number[] {
  return Array.from(problem.pins, (p) => (p >= 0 ? p : 0));
}

/** The network as a partitioning graph with two-sided or region pins. */
export function partGraph(problem: Problem): PartGraph {
  const net = problem.network;
  const pin = new Int8Array(net.n);
  for (let i = 0; i < net.n; i++) pin[i] = problem.pins[i];
  return { n: net.n, adjStart: net.adjStart, adjIndex: net.adjIndex, adjWeight: net.adjWeight, vw: net.depotWeight, pin };
}
