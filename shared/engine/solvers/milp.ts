/**
 * `milp`: the question as a mixed-integer program solved by branch-and-cut (the HiGHS library,
 * run in a worker thread), started from a quick heuristic answer.
 */
import { balanceWindow } from '../classical/balance';
import { createFlipState } from '../classical/flip-state';
import { multilevelBisect } from '../classical/fm-bisection';
import { kwayPartition } from '../classical/kway';
import { greedyMaxcut, polishMaxcut } from '../classical/local-search';
import { loadPool } from '../classical/threads/load-pool';
import { classicalResult, freeDepots, integerLanes } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { tabuMaxcut, tabuMaxcutDefaults } from '../classical/tabu-maxcut';
import { better } from '../problem/compare';
import { crossingWeight, isFeasible, maxPartWeight } from '../problem/evaluate';
import { senseOf, type Problem } from '../problem/types';
import { createRng, type Rng } from '../random';
import { partGraph } from './classical-common';
import { defineSolver } from './define';
import { intField, settingsObject } from './settings';

const settings = settingsObject({
  maxDepots: intField(2000, 1, 20000),
  maxLanes: intField(20000, 1, 200000),
});

/** Quick heuristic answer used as a MIP start and as the fallback answer. */
function quickStart(problem: Problem, rng: Rng): Int8Array {
  const free = freeDepots(problem.pins);
  if (problem.kind === 'maxcut') {
    const st = createFlipState(problem.network, greedyMaxcut(problem));
    polishMaxcut(problem, st, free);
    return st.side;
  }
  const g = partGraph(problem);
  if (problem.kind === 'bisection') return multilevelBisect(g, balanceWindow(problem), rng);
  return kwayPartition(g, problem.pins, problem.k, maxPartWeight(problem), rng);
}

export const milpSolver = defineSolver({
  name: 'milp',
  label: 'Mixed-integer program (branch-and-cut)',
  family: 'exact',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'Branch-and-cut on a mixed-integer model (solved with the HiGHS library): optimal when it finishes, otherwise the best answer found with a proven dual bound and gap.',
  settings,
  refuses(problem, s) {
    const { n, m } = problem.network;
    if (n > s.maxDepots || m > s.maxLanes) {
      return `the MILP is limited to ${s.maxDepots} depots and ${s.maxLanes} lanes (this network has ${n} and ${m}); use tabu (max-cut) or fm (partitioning) instead`;
    }
    return null;
  },
  async solve(problem, _s, ctx) {
    const control = createRunControl(ctx);
    const rng = createRng(ctx.seed);
    let start = quickStart(problem, rng);
    if (problem.kind === 'maxcut' && problem.network.n > 0) {
      // A short tabu run gives HiGHS a strong incumbent, so its search prunes from the start.
      const short = createRunControl(ctx, Math.min(1, 0.05 * ctx.timeLimitSeconds));
      start = (await tabuMaxcut(problem, start, tabuMaxcutDefaults, rng, short)).side;
    }
    const { runInWorker } = loadPool();
    const remaining = Math.max(0.1, ctx.timeLimitSeconds - control.elapsed());
    const ticker = setInterval(() => ctx.onProgress?.({ fraction: control.fraction() }), 250);
    let run;
    try {
      run = await runInWorker(
        { task: 'milp', problem, timeLimitSeconds: remaining, seed: ctx.seed, start: Array.from(start) },
        { cancel: ctx.cancel, killAfterSeconds: remaining + 30 },
      );
    } finally {
      clearInterval(ticker);
    }
    const notes: string[] = [];
    let assignment: ArrayLike<number> = start;
    let bound: number | null = null;
    let proven = false;
    const sense = senseOf(problem.kind);
    if (run) {
      notes.push(`HiGHS status: ${run.status}${run.nodes !== null ? `, ${run.nodes} nodes` : ''}`);
      if (run.assignment) {
        // HiGHS's answer unless the starting one is strictly better (problem/compare.ts).
        const rank = (a: ArrayLike<number>) => ({ value: crossingWeight(problem, a), feasible: isFeasible(problem, a) });
        if (!better(sense, rank(start), rank(run.assignment))) assignment = run.assignment;
      }
      if (run.dualBound !== null) {
        bound = run.dualBound;
        if (integerLanes(problem)) bound = problem.kind === 'maxcut' ? Math.floor(bound + 1e-6) : Math.ceil(bound - 1e-6);
      }
      proven = run.status === 'optimal';
      if (proven && bound !== null) {
        // HiGHS proved optimality of its incumbent: the bound is that value.
        const v = crossingWeight(problem, assignment);
        bound = problem.kind === 'maxcut' ? Math.max(v, Math.min(bound, v)) : Math.min(v, Math.max(bound, v));
      }
    } else notes.push('MILP stopped (cancelled); answer from the starting heuristic');
    return classicalResult(problem, { assignment, bound, provenOptimal: proven, seconds: control.elapsed(), evaluations: run?.nodes ?? 0, notes });
  },
});
