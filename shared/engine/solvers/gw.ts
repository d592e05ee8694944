/** `gw`: Goemans–Williamson-style max-cut — a low-rank SDP (Burer–Monteiro) and random-hyperplane rounding. */
import { certifiedShiftBound } from '../classical/bounds';
import { goemansWilliamson, gwDefaults } from '../classical/goemans-williamson';
import { classicalResult, integerLanes } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { createRng } from '../random';
import { defineSolver } from './define';
import { intField, numberField, settingsObject } from './settings';

const settings = settingsObject({
  rank: intField(gwDefaults.rank, 0, 1000),
  maxSweeps: intField(gwDefaults.maxSweeps, 1, 1e6),
  hyperplanes: intField(gwDefaults.hyperplanes, 1, 1e6),
  tolerance: numberField(gwDefaults.tolerance, 0, 1),
});

export const gwSolver = defineSolver({
  name: 'gw',
  // The published method solves the full SDP; ours solves a low-rank one, hence "-style".
  label: 'Goemans–Williamson-style (low-rank SDP + hyperplane rounding)',
  family: 'heuristic',
  kinds: ['maxcut'],
  otherwise: 'fm, tabu or milp for partitioning',
  guarantee: 'For non-negative lanes the random-hyperplane cut has expected value ≥ 0.878 × the SDP value of the vectors found (Goemans & Williamson 1995); the SDP value itself is an estimate, and the upper bound reported is the dual candidate from the vectors, certified by Cholesky (n ≤ 1500).',
  settings,
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const control = createRunControl(ctx);
    const r = await goemansWilliamson(problem, s, rng, control);
    // The vectors' dual candidate becomes a proven bound once Cholesky certifies it.
    const certified = control.shouldStop() ? null : certifiedShiftBound(problem, r.dualShift, 1500, ctx.seed);
    const bound = certified === null ? null : integerLanes(problem) ? Math.floor(certified + 1e-9) : certified;
    return classicalResult(problem, {
      assignment: r.side,
      bound,
      seconds: control.elapsed(),
      evaluations: r.sweeps * problem.network.m + r.rounds,
      notes: [
        `SDP estimate (Burer–Monteiro, not a bound): ${r.sdpEstimate.toFixed(3)}`,
        `expected hyperplane cut of the vectors: ${r.expectedCut.toFixed(3)}`,
        bound === null ? 'SDP dual not certified (stopped, or n above 1500)' : 'bound: SDP dual candidate from the vectors, certified by Cholesky',
        `${r.sweeps} ascent sweeps, ${r.rounds} hyperplanes`,
      ],
    });
  },
});
