/**
 * `fm`: multilevel Fiduccia–Mattheyses bisection; k regions by recursive multilevel bisection,
 * direct k-way FM refinement and iterated V-cycles from the best answer (kway-multilevel.ts).
 */
import { balanceWindow } from '../classical/balance';
import { multilevelBisect } from '../classical/fm-bisection';
import { kwaySearch } from '../classical/kway-search';
import { classicalResult } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { better, type Ranked } from '../problem/compare';
import { crossingWeight, isFeasible, maxPartWeight } from '../problem/evaluate';
import { senseOf } from '../problem/types';
import { createRng } from '../random';
import { partGraph } from './classical-common';
import { defineSolver } from './define';
import { intField, settingsObject } from './settings';

// coarsestSize … stall tune the bisection; k regions use kway-multilevel.ts's defaults and `vcycles`.
const settings = settingsObject({
  coarsestSize: intField(80, 2, 100000),
  initialTries: intField(8, 1, 1000),
  maxPasses: intField(8, 1, 1000),
  stall: intField(200, 1, 1e6),
  /** Most V-cycles to run (they repeat with new seeds while time remains). */
  cycles: intField(1000, 1, 1e6),
  /** k regions: iterated V-cycles from the best answer after each fresh one. */
  vcycles: intField(2, 0, 1000),
});

export const fmSolver = defineSolver({
  name: 'fm',
  label: 'Multilevel Fiduccia–Mattheyses (bisection; k-way by recursive bisection and k-way FM)',
  family: 'heuristic',
  kinds: ['bisection', 'kway'],
  otherwise: 'tabu, gw or milp for max-cut',
  guarantee: 'No optimality guarantee: multilevel heavy-edge coarsening with FM refinement, repeated with new seeds while time remains; every answer meets the balance rule whenever the refinement can reach it.',
  settings,
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const control = createRunControl(ctx);
    const g = partGraph(problem);
    const win = balanceWindow(problem);
    const limit = maxPartWeight(problem);
    const sense = senseOf(problem.kind);
    if (problem.kind === 'kway') {
      const r = await kwaySearch(g, problem.k, limit, rng, control, { vcycles: s.vcycles, cycles: s.cycles });
      return classicalResult(problem, { assignment: Array.from(r.part), seconds: control.elapsed(), evaluations: r.cycles, notes: [`${r.cycles} multilevel cycles (fresh and V-cycles)`] });
    }
    let best: number[] | null = null;
    let bestRank: Ranked = { value: Infinity, feasible: false };
    let cycles = 0;
    while (cycles < s.cycles) {
      // Fresh V-cycles alternate with iterated ones from the best split so far.
      const iterate: boolean = best !== null && bestRank.feasible && cycles % 2 === 1;
      const side = multilevelBisect(g, win, rng, s, iterate ? Int8Array.from(best!) : null);
      cycles++;
      const a: number[] = Array.from(side);
      const rank = { value: crossingWeight(problem, a), feasible: isFeasible(problem, a) };
      if (best === null || better(sense, rank, bestRank)) {
        best = a;
        bestRank = rank;
      }
      if (await control.tick(bestRank.value, cycles)) break;
      if (control.shouldStop()) break;
    }
    return classicalResult(problem, { assignment: best!, seconds: control.elapsed(), evaluations: cycles, notes: [`${cycles} multilevel cycles`] });
  },
});
