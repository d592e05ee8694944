import { createQaoaAnsatz } from '../ansatz/qaoa';
import { warmProbabilities } from '../circuits/warm';
import type { Encoding } from '../encodings/types';
import type { Rng } from '../random';
import { expectationOfDiagonal, isingDiagonal } from '../statevector/diagonal';
import { diagonalLevels } from '../statevector/gates';
import type { StateOptions } from '../statevector/state';
import { objectiveEstimator } from './cvar';
import { couplingScale, restartStarts, transferredAngles } from './initial-angles';
import { optimizeAnsatz, type OptimizerName } from './optimize';
import { finishEncodingRun } from './outcome';

import type { VariationalOutcome, VariationalTracePoint } from './outcome';

export type { VariationalOutcome, VariationalTracePoint };


export interface QaoaRunOptions {
  encoding: Encoding;
  layers: number;
  optimizer: OptimizerName;
  /** Shots per energy estimate; 0 = exact expectation. */
  shots: number;
  /** Shots for the final read-out; default `shots`, or 1024 when shots = 0. */
  readoutShots?: number;
  restarts: number;
  maxIterations: number;
  rng: Rng;
  shouldStop?: () => boolean;
  onIteration?: (point: VariationalTracePoint) => void;
  /** Warm start from a classical assignment (Egger et al. 2021); ε regulariser default 0.25. */
  warmStart?: { assignment: ArrayLike<number>; epsilon?: number };
  /** Override the informed first start [γ…, β…]. */
  initialParams?: Float64Array;
  /** CVaR objective share α in (0, 1] (variational/cvar.ts); 1 or absent = plain expectation. */
  cvarAlpha?: number;
  topSamples?: number;
  stateOptions?: StateOptions;
  /** Monotonic clock in seconds (tests pass a fake one). */
  clock?: () => number;
}

export const defaultClock = () => performance.now() / 1000;

/**
 * QAOA on an encoding: cost diagonal built once (and compressed to its distinct levels), p
 * layers in the engine convention (ansatz/qaoa.ts), informed start = transferred fixed angles
 * rescaled by the coupling scale, restarts jittered around it, then exact energy, exact
 * expected business value and a decoded read-out at the best parameters.
 */
export function runQaoa(opts: QaoaRunOptions): VariationalOutcome {
  const { encoding } = opts;
  const clock = opts.clock ?? defaultClock;
  const t0 = clock();
  const diag = isingDiagonal(encoding.operator, opts.stateOptions);
  const levels = diagonalLevels(diag);
  let warm: { probabilities: Float64Array; epsilon?: number } | undefined;
  if (opts.warmStart) {
    warm = { probabilities: Float64Array.from(warmProbabilities(encoding, opts.warmStart.assignment)), epsilon: opts.warmStart.epsilon };
  }
  const ansatz = createQaoaAnsatz({ numQubits: encoding.numQubits, layers: opts.layers, energyDiagonal: levels ?? diag, warmStart: warm, stateOptions: opts.stateOptions });
  const first = opts.initialParams ?? transferredAngles(opts.layers, couplingScale(encoding.operator));
  const trace: VariationalTracePoint[] = [];
  const loop = optimizeAnsatz({
    ansatz,
    estimate: objectiveEstimator(diag, opts.shots, opts.rng, opts.cvarAlpha),
    optimizer: opts.optimizer,
    starts: restartStarts(first, Math.max(1, opts.restarts), opts.rng),
    maxIterations: opts.maxIterations,
    rng: opts.rng,
    shouldStop: opts.shouldStop ?? (() => false),
    differenceStep: opts.shots > 0 ? 0.05 : 1e-5,
    onIteration: (iteration, energy, stdError, _params, start) => {
      const point = { iteration, energy, stdError, seconds: clock() - t0, start };
      trace.push(point);
      opts.onIteration?.(point);
    },
  });
  const energy = expectationOfDiagonal(loop.state, diag);
  return finishEncodingRun(encoding, ansatz, loop, trace, energy, opts);
}
