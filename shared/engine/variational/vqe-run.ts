import { createLadderAnsatz } from '../ansatz/ladder';
import { createQaoaAnsatz } from '../ansatz/qaoa';
import type { Ansatz } from '../ansatz/types';
import type { Encoding } from '../encodings/types';
import type { Estimate } from '../optimizers/types';
import type { Rng } from '../random';
import { expectationOfDiagonal, isingDiagonal } from '../statevector/diagonal';
import { diagonalLevels } from '../statevector/gates';
import type { StateOptions, StateVector } from '../statevector/state';
import { objectiveEstimator } from './cvar';
import { restartStarts } from './initial-angles';
import { optimizeAnsatz, type OptimizerName } from './optimize';
import { defaultClock, type VariationalOutcome, type VariationalTracePoint } from './qaoa-run';
import { finishEncodingRun } from './outcome';

export type VqeAnsatzName = 'ladder' | 'alternating';

export interface VqeCommonOptions {
  ansatz: VqeAnsatzName;
  layers: number;
  entangler?: 'line' | 'ring';
  optimizer: OptimizerName;
  shots: number;
  restarts: number;
  maxIterations: number;
  rng: Rng;
  shouldStop?: () => boolean;
  onIteration?: (point: VariationalTracePoint) => void;
  initialParams?: Float64Array;
  stateOptions?: StateOptions;
  clock?: () => number;
  /** Initial simplex edge / Adam learning rate / SPSA first step. */
  step?: number;
  /** CVaR objective share α in (0, 1] (variational/cvar.ts); 1 or absent = plain expectation. */
  cvarAlpha?: number;
}

/**
 * Informed first start for the ladder: the first rotation layer at R_Y(π/2) (every qubit in
 * |+⟩, an unbiased superposition of all answers) and the rest at zero, plus a small seeded
 * jitter so the rungs are not stuck at a symmetric point.
 */
export function ladderStart(numQubits: number, layers: number, rng: Rng): Float64Array {
  const x = new Float64Array(2 * numQubits * (layers + 1));
  for (let j = 0; j < x.length; j++) x[j] = 0.05 * rng.normal();
  for (let q = 0; q < numQubits; q++) x[q] += Math.PI / 2;
  return x;
}

/** The shared loop: optimise, then exact energy at the best parameters. */
export function runVqeLoop(
  ansatz: Ansatz,
  estimate: (s: StateVector) => Estimate,
  exactEnergy: (s: StateVector) => number,
  first: Float64Array,
  opts: VqeCommonOptions,
) {
  const clock = opts.clock ?? defaultClock;
  const t0 = clock();
  const trace: VariationalTracePoint[] = [];
  const loop = optimizeAnsatz({
    ansatz,
    estimate,
    optimizer: opts.optimizer,
    starts: restartStarts(first, Math.max(1, opts.restarts), opts.rng, 0.3),
    maxIterations: opts.maxIterations,
    rng: opts.rng,
    shouldStop: opts.shouldStop ?? (() => false),
    differenceStep: opts.shots > 0 ? 0.1 : 1e-5,
    step: opts.step,
    onIteration: (iteration, energy, stdError, _params, start) => {
      const point = { iteration, energy, stdError, seconds: clock() - t0, start };
      trace.push(point);
      opts.onIteration?.(point);
    },
  });
  return { loop, trace, energy: exactEnergy(loop.state) };
}

/**
 * VQE on an encoding's (diagonal) cost operator with the ladder or the alternating ansatz
 * (the alternating one is QAOA's circuit with free angles; see ansatz/qaoa.ts).
 */
export function runVqeOnEncoding(encoding: Encoding, opts: VqeCommonOptions & { readoutShots?: number; topSamples?: number }): VariationalOutcome {
  const n = encoding.numQubits;
  const diag = isingDiagonal(encoding.operator, opts.stateOptions);
  const ansatz = opts.ansatz === 'alternating'
    ? createQaoaAnsatz({ numQubits: n, layers: opts.layers, energyDiagonal: diagonalLevels(diag) ?? diag, stateOptions: opts.stateOptions })
    : createLadderAnsatz({ numQubits: n, layers: opts.layers, entangler: opts.entangler, stateOptions: opts.stateOptions });
  const first = opts.initialParams ?? (opts.ansatz === 'alternating'
    ? new Float64Array(2 * opts.layers).fill(0.3)
    : ladderStart(n, opts.layers, opts.rng));
  const { loop, trace, energy } = runVqeLoop(ansatz, objectiveEstimator(diag, opts.shots, opts.rng, opts.cvarAlpha), (s) => expectationOfDiagonal(s, diag), first, opts);
  return finishEncodingRun(encoding, ansatz, loop, trace, energy, opts);
}
