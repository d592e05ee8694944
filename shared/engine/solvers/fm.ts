/** `fm`: multilevel Fiduccia–Mattheyses bisection; k regions by recursive bisection. */
import { balanceWindow } from '../classical/balance';
import { multilevelBisect } from '../classical/fm-bisection';
import { kwayDefaults, kwayPartition } from '../classical/kway';
import { classicalResult } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { better, type Ranked } from '../problem/compare';
import { crossingWeight, isFeasible, maxPartWeight } from '../problem/evaluate';
import { senseOf } from '../problem/types';
import { createRng } from '../random';
import { partGraph } from './classical-common';
import { defineSolver } from './define';
import { intField, settingsObject } from './settings';

const settings = settingsObject({
  coarsestSize: intField(80, 2, 100000),
  initialTries: intField(8, 1, 1000),
  maxPasses: intField(8, 1, 1000),
  stall: intField(200, 1, 1e6),
  /** Most V-cycles to run (they repeat with new seeds while time remains). */
  cycles: intField(1000, 1, 1e6),
});

export const fmSolver = defineSolver({
  name: 'fm',
  label: 'Multilevel Fiduccia–Mattheyses (bisection; k-way by recursive bisection)',
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
    let best: number[] | null = null;
    let bestRank: Ranked = { value: Infinity, feasible: false };
    let cycles = 0;
    while (cycles < s.cycles) {
      // Bisection: fresh V-cycles alternate with iterated ones from the best split so far.
      const iterate: boolean = problem.kind === 'bisection' && best !== null && bestRank.feasible && cycles % 2 === 1;
      const side: Int8Array = problem.kind === 'bisection'
        ? multilevelBisect(g, win, rng, s, iterate ? Int8Array.from(best!) : null)
        : kwayPartition(g, problem.pins, problem.k, limit, rng, { ...kwayDefaults, ...s });
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
