/**
 * `best`: the classical portfolio — exact enumeration when it fits, else the strongest heuristic
 * (tabu or multilevel FM) beside the MILP, then the tightest proven bound.
 */
import { enumeratedDepots } from '../classical/exact';
import { classicalResult } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { meets } from '../problem/compare';
import { senseOf } from '../problem/types';
import { createRng } from '../random';
import { computeBounds } from './bounds';
import { pickBest, threadsField, workerCopies } from './classical-common';
import { defineSolver } from './define';
import { exactSolver } from './exact';
import { fmSolver } from './fm';
import { milpSolver } from './milp';
import { intField, numberField, settingsObject } from './settings';
import { tabuSolver } from './tabu';
import type { SolveContext, SolveResult } from './types';

const settings = settingsObject({
  threads: threadsField(2),
  /** Use exact enumeration up to this many free depots. */
  exactDepots: intField(28, 0, 34),
  /** Run the MILP beside the heuristic up to this many depots … */
  milpDepots: intField(150, 0, 5000),
  /** … and this average degree. */
  milpDegree: numberField(6, 0, 1000),
  /** Share of the time limit kept for the bound computation at the end. */
  boundShare: numberField(0.1, 0, 0.9),
});

export const bestSolver = defineSolver({
  name: 'best',
  label: 'Best classical (portfolio)',
  family: 'exact',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'Runs the strongest applicable solvers within the time limit (exact enumeration when small; else tabu or multilevel FM beside the MILP) and reports the best answer with the tightest proven bound; optimal when the bound meets the value.',
  settings,
  async solve(problem, s, ctx) {
    const control = createRunControl(ctx);
    const rng = createRng(ctx.seed);
    const { n, m } = problem.network;
    const notes: string[] = [];
    const results: SolveResult[] = [];
    let milpBound: number | null = null;
    const exactSettings = exactSolver.parseSettings({ threads: s.threads, maxDepots: s.exactDepots });
    // Enumeration only when it should finish in half the time (≈ 3·10⁷ states/s per thread
    // measured on this kind of machine under load, see docs/benchmarks.md).
    const exactFits = problem.kind === 'kway'
      ? exactSolver.refuses(problem, exactSettings) === null
      : enumeratedDepots(problem) <= s.exactDepots && 2 ** enumeratedDepots(problem) / (3e7 * s.threads) <= 0.5 * ctx.timeLimitSeconds;
    const sub = (fraction: number): SolveContext => ({ ...ctx, seed: rng.fork().int(2 ** 31), timeLimitSeconds: Math.max(0.05, ctx.timeLimitSeconds * fraction - control.elapsed()) });
    if (exactFits) {
      const r = await exactSolver.solve(problem, exactSettings, sub(1));
      results.push(r);
      notes.push(`exact enumeration${r.provenOptimal ? ' proved the optimum' : ' stopped early'}`);
    }
    if (results.length === 0 || !results[0].provenOptimal) {
      const work = 1 - s.boundShare;
      const useMilp = n <= s.milpDepots && (n === 0 || (2 * m) / n <= s.milpDegree);
      const tasks: Array<Promise<SolveResult | null>> = [];
      if (useMilp) tasks.push(milpSolver.solve(problem, milpSolver.parseSettings({}), sub(work)).catch(() => null));
      // The second core: the MILP worker when it runs, else a worker copy of a heuristic.
      // Bisection: tabu in the worker (it wins on dense random networks, FM on sparse ones).
      if (!useMilp && s.threads > 1 && problem.kind !== 'maxcut') {
        const other = problem.kind === 'bisection' ? tabuSolver : fmSolver;
        tasks.push(workerCopies(other.name, problem, other.parseSettings({}), sub(work), s.threads - 1, rng).then((r) => r[0] ?? null));
        notes.push(`worker thread ran ${other.name}`);
      }
      if (problem.kind === 'maxcut') tasks.push(tabuSolver.solve(problem, tabuSolver.parseSettings({ threads: useMilp ? 1 : s.threads }), sub(work)));
      else tasks.push(fmSolver.solve(problem, fmSolver.parseSettings({}), sub(work)));
      for (const r of await Promise.all(tasks)) if (r) results.push(r);
      for (const r of results) {
        if (r.bound !== null && r.notes?.some((x) => x.startsWith('HiGHS'))) milpBound = r.bound;
      }
      notes.push(`ran ${useMilp ? 'milp + ' : ''}${problem.kind === 'maxcut' ? 'tabu' : 'fm'}`);
    }
    const best = pickBest(problem, results);
    const sense = senseOf(problem.kind);
    const proven = results.find((r) => r.provenOptimal && r.value === best.value);
    let bound: number | null = proven ? proven.bound : null;
    if (!proven) {
      const report = computeBounds(problem, { milpBound, knownValue: problem.kind === 'maxcut' ? best.value : null, seed: ctx.seed });
      bound = report.bound;
      notes.push(`bound from ${report.source}`, ...report.details.notes);
    }
    return classicalResult(problem, {
      assignment: best.assignment,
      bound,
      provenOptimal: meets(sense, best.value, bound) || proven !== undefined,
      seconds: control.elapsed(),
      evaluations: results.reduce((a, r) => a + r.evaluations, 0),
      notes: [...notes, ...(best.notes ?? [])],
    });
  },
});
