import type { Ansatz } from '../ansatz/types';
import { minimizeAdam } from '../optimizers/adam';
import { minimizeCobyla } from '../optimizers/cobyla';
import { centralDifferenceGradient, parameterShiftGradient } from '../optimizers/gradients';
import { minimizeNelderMead } from '../optimizers/nelder-mead';
import { minimizeWithRestarts } from '../optimizers/restarts';
import { minimizeSpsa } from '../optimizers/spsa';
import type { Estimate, MinimizeResult } from '../optimizers/types';
import type { Rng } from '../random';
import type { StateVector } from '../statevector/state';

export type OptimizerName = 'nelder-mead' | 'cobyla' | 'spsa' | 'adam';
export const OPTIMIZER_NAMES: OptimizerName[] = ['nelder-mead', 'cobyla', 'spsa', 'adam'];

/** What the app and docs call each optimizer: "-style" where ours simplifies the published method. */
export const OPTIMIZER_LABELS: Record<OptimizerName, string> = {
  'nelder-mead': 'Nelder–Mead simplex (adaptive coefficients)',
  // optimizers/cobyla.ts: Powell's linear-model trust region without constraints, a simplified reading.
  cobyla: 'COBYLA-style (linear models, no constraints)',
  spsa: 'SPSA',
  adam: 'Adam',
};

export interface VariationalLoopOptions {
  ansatz: Ansatz;
  /** Energy of a prepared state (exact or from shots). */
  estimate: (s: StateVector) => Estimate;
  optimizer: OptimizerName;
  /** One start per restart (the first is the informed one). */
  starts: Float64Array[];
  maxIterations: number;
  rng: Rng;
  shouldStop: () => boolean;
  /** `start` is the index of the start (restart) the iteration belongs to, 0 for the first. */
  onIteration?: (iteration: number, energy: number, stdError: number, params: Float64Array, start: number) => void;
  /** Finite-difference step for parameters without a shift rule (exact: 1e-5; shots: larger). */
  differenceStep?: number;
  /** Initial simplex edge / SPSA first step, in radians. */
  step?: number;
}

export interface VariationalLoopResult extends MinimizeResult {
  restarts: number;
  /** The state at the best parameters (exact amplitudes, the run's one buffer). */
  state: StateVector;
}

/**
 * The optimisation loop shared by VQE and QAOA: one state buffer for the whole run, the chosen
 * optimizer from each start, the best result kept. Adam uses the parameter-shift rule where it
 * is exact and central differences elsewhere (QAOA's γ on weighted costs has no two-term rule).
 */
export function optimizeAnsatz(opts: VariationalLoopOptions): VariationalLoopResult {
  const { ansatz } = opts;
  let buffer: StateVector | undefined;
  const energyAt = (x: Float64Array): Estimate => {
    buffer = ansatz.prepare(x, buffer);
    return opts.estimate(buffer);
  };
  let iterationOffset = 0;
  const result = minimizeWithRestarts(opts.starts, (start, index) => {
    const common = {
      maxIterations: opts.maxIterations,
      shouldStop: opts.shouldStop,
      rng: opts.rng,
      onIteration: (i: number, e: number, se: number, x: Float64Array) => { opts.onIteration?.(iterationOffset + i, e, se, x, index); },
    };
    let r: MinimizeResult;
    if (opts.optimizer === 'spsa') r = minimizeSpsa(energyAt, start, { ...common, firstStep: opts.step ?? 0.2, c: opts.differenceStep ?? 0.1 });
    else if (opts.optimizer === 'adam') {
      const shift = parameterShiftGradient(energyAt);
      const diff = centralDifferenceGradient(energyAt, opts.differenceStep ?? 1e-5);
      const allShift = ansatz.gradientRule.every((g) => g === 'shift');
      const gradient = allShift ? shift : ansatz.gradientRule.every((g) => g === 'difference') ? diff : mixedGradient(ansatz, shift, diff);
      r = minimizeAdam(energyAt, start, { ...common, gradient, learningRate: opts.step ?? 0.05, evaluationsPerGradient: 2 * start.length });
    } else if (opts.optimizer === 'cobyla') r = minimizeCobyla(energyAt, start, { ...common, rhoBegin: opts.step ?? 0.25, rhoEnd: opts.differenceStep && opts.differenceStep > 1e-4 ? 1e-3 : 1e-7 });
    else r = minimizeNelderMead(energyAt, start, { ...common, step: opts.step ?? 0.25 });
    iterationOffset += r.iterations;
    return r;
  }, opts.shouldStop);
  const state = ansatz.prepare(result.x, buffer);
  return { ...result, state };
}

function mixedGradient(ansatz: Ansatz, shift: (x: Float64Array) => Float64Array, diff: (x: Float64Array) => Float64Array) {
  return (x: Float64Array) => {
    const a = shift(x), b = diff(x);
    return a.map((v, j) => (ansatz.gradientRule[j] === 'shift' ? v : b[j]));
  };
}
