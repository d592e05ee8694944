/** `anneal`: simulated annealing with a calibrated geometric schedule. */
import { anneal, annealDefaults } from '../classical/anneal';
import { classicalResult } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { createRng } from '../random';
import { startSides } from './classical-common';
import { defineSolver } from './define';
import { intField, numberField, settingsObject } from './settings';

const settings = settingsObject({
  sweeps: intField(annealDefaults.sweeps, 1, 1e7),
  acceptStart: numberField(annealDefaults.acceptStart, 1e-6, 0.999),
  acceptEnd: numberField(annealDefaults.acceptEnd, 1e-9, 0.999),
});

export const annealSolver = defineSolver({
  name: 'anneal',
  label: 'Simulated annealing',
  family: 'heuristic',
  kinds: ['maxcut', 'bisection'],
  otherwise: 'fm (recursive bisection) or milp for k-way regions',
  guarantee: 'No optimality guarantee: simulated annealing with a calibrated geometric schedule, restarted from the best state while time remains.',
  settings,
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const control = createRunControl(ctx);
    const r = await anneal(problem, startSides(problem, rng), s, rng, control);
    return classicalResult(problem, { assignment: r.side, seconds: control.elapsed(), evaluations: r.moves });
  },
});
