/** `greedy`: a greedy construction polished by 1-flip (max-cut) or flip-and-swap (bisection) local search. */
import { balanceWindow } from '../classical/balance';
import { createFlipState } from '../classical/flip-state';
import { multilevelBisect } from '../classical/fm-bisection';
import { greedyMaxcut, polishBisection, polishMaxcut } from '../classical/local-search';
import { classicalResult, freeDepots } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import type { Problem } from '../problem/types';
import { createRng } from '../random';
import { partGraph } from './classical-common';
import { defineSolver } from './define';
import { settingsObject } from './settings';

/**
 * Greedy bisection: grow side 1 from the pins (or the first free depot) by the strongest
 * pull until it reaches the middle of the balance window (one coarsening level, no refinement).
 */
function greedyBisection(problem: Problem): Int8Array {
  const g = partGraph(problem);
  return multilevelBisect(g, balanceWindow(problem), createRng(1), { coarsestSize: Math.max(2, g.n), initialTries: 1, maxPasses: 0, stall: 0 });
}

export const greedySolver = defineSolver({
  name: 'greedy',
  label: 'Greedy + local search',
  family: 'heuristic',
  kinds: ['maxcut', 'bisection'],
  otherwise: 'fm for k-way regions',
  guarantee: 'No optimality guarantee: a greedy construction followed by 1-flip (and, for bisection, swap) local search to a local optimum.',
  settings: settingsObject({}),
  async solve(problem, _s, ctx) {
    const control = createRunControl(ctx);
    const free = freeDepots(problem.pins);
    if (problem.kind === 'maxcut') {
      const st = createFlipState(problem.network, greedyMaxcut(problem));
      const flips = polishMaxcut(problem, st, free);
      return classicalResult(problem, { assignment: st.side, seconds: control.elapsed(), evaluations: flips + problem.network.n });
    }
    const st = createFlipState(problem.network, greedyBisection(problem));
    const moves = polishBisection(problem, st, free);
    return classicalResult(problem, { assignment: st.side, seconds: control.elapsed(), evaluations: moves + problem.network.n });
  },
});
