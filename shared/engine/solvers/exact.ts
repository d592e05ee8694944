/** `exact`: exhaustive enumeration (Gray-code walk over two sides, or a k-way search), optionally on worker threads. */
import { betterExact, createChunkWalk, emptyExact, enumeratedDepots, planExact, type ExactBest } from '../classical/exact';
import { exactKway, kwaySearchSize } from '../classical/exact-kway';
import { loadPool } from '../classical/threads/load-pool';
import { classicalResult } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import type { Problem } from '../problem/types';
import { fallbackAssignment, threadsField } from './classical-common';
import { defineSolver } from './define';
import { intField, numberField, settingsObject } from './settings';
import type { SolveContext } from './types';

const settings = settingsObject({
  maxDepots: intField(32, 1, 36),
  maxKwayStates: numberField(1e7, 1, 1e8),
  threads: threadsField(2),
});

export const exactSolver = defineSolver({
  name: 'exact',
  label: 'Exact enumeration',
  family: 'exact',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'Visits every assignment (Gray-code order, one depot fixed by symmetry), so the answer is optimal when it finishes within the time limit.',
  settings,
  refuses(problem, s) {
    if (problem.kind === 'kway') {
      const size = kwaySearchSize(problem);
      return size > s.maxKwayStates
        ? `exact k-way search is limited to ${s.maxKwayStates.toExponential(0)} assignments (this question has about ${size.toExponential(1)}); use milp for a proven optimum or fm for a fast answer`
        : null;
    }
    const f = enumeratedDepots(problem);
    return f > s.maxDepots
      ? `exact enumeration is limited to ${s.maxDepots} free depots (2^${s.maxDepots} states); this question has ${f}. Use milp for a proven optimum or tabu for a fast answer`
      : null;
  },
  async solve(problem, s, ctx) {
    const control = createRunControl(ctx);
    if (problem.kind === 'kway') {
      const r = exactKway(problem, () => control.shouldStop());
      const assignment = r.assignment ?? fallbackAssignment(problem);
      return classicalResult(problem, {
        assignment,
        bound: r.complete && r.assignment ? r.value : null,
        provenOptimal: r.complete && r.assignment !== null,
        seconds: control.elapsed(),
        evaluations: r.nodes,
        notes: r.assignment ? (r.complete ? [] : ['time limit reached before the search finished: best found so far, not proven']) : ['no assignment meets the balance rule with these pins'],
      });
    }
    const f = enumeratedDepots(problem);
    const threads = f >= 22 ? s.threads : 1;
    const plan = planExact(problem, threads > 1 ? threads * 4 : 1);
    const chunks = 2 ** plan.splitBits;
    let best: ExactBest = emptyExact(problem);
    let threaded = threads > 1 && chunks > 1;
    if (threaded) {
      try {
        best = await exactInWorkers(problem, plan, chunks, threads, ctx);
      } catch {
        threaded = false; // no worker threads here (or one failed): walk on this thread instead
        best = emptyExact(problem);
      }
    }
    if (!threaded) {
      outer: for (let c = 0; c < chunks; c++) {
        const walk = createChunkWalk(problem, plan, c);
        while (!walk.run(16)) {
          const sofar = problem.kind === 'maxcut' ? Math.max(best.value, walk.bestValue()) : Math.min(best.value, walk.bestValue());
          if (await control.tick(Number.isFinite(sofar) ? sofar : undefined)) {
            best = betterExact(problem, best, { ...walk.result(), complete: false });
            break outer;
          }
        }
        best = betterExact(problem, best, walk.result());
      }
    }
    const found = best.assignment !== null;
    return classicalResult(problem, {
      assignment: found ? best.assignment! : fallbackAssignment(problem),
      bound: best.complete && found ? best.value : null,
      provenOptimal: best.complete && found,
      seconds: control.elapsed(),
      evaluations: best.states,
      notes: !found
        ? [best.complete ? 'no assignment meets the balance rule with these pins' : 'stopped before a feasible state was found']
        : best.complete ? [] : ['stopped before every state was seen: best found so far, not proven'],
    });
  },
});

async function exactInWorkers(problem: Problem, plan: ReturnType<typeof planExact>, chunks: number, threads: number, ctx: SolveContext): Promise<ExactBest> {
  const { runInWorker } = loadPool();
  const deadlineMs = Date.now() + ctx.timeLimitSeconds * 1000;
  const jobs = Array.from({ length: threads }, (_, t) => {
    const mine: number[] = [];
    for (let c = t; c < chunks; c += threads) mine.push(c);
    return runInWorker({ task: 'exact', problem, plan, chunks: mine, deadlineMs }, { cancel: ctx.cancel, killAfterSeconds: ctx.timeLimitSeconds + 30 });
  });
  let best = emptyExact(problem);
  for (const a of await Promise.all(jobs)) best = betterExact(problem, best, a ?? { ...emptyExact(problem), complete: false });
  return best;
}
