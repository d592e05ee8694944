import type { Ansatz } from '../ansatz/types';
import type { Encoding } from '../encodings/types';
import type { Rng } from '../random';
import { expectationOfDiagonal, isingDiagonal } from '../statevector/diagonal';
import type { StateOptions } from '../statevector/state';
import type { VariationalLoopResult } from './optimize';
import { readOut, type DecodedSample } from './samples';

export interface VariationalTracePoint {
  iteration: number;
  energy: number;
  stdError: number;
  seconds: number;
  /** Which optimizer start (restart) the point belongs to: 0 for the first (charts mark the jumps). */
  start?: number;
}

/** What a VQE or QAOA run returns (the solver definitions map it onto SolveResult). */
export interface VariationalOutcome {
  params: number[];
  paramNames: string[];
  /** Exact ⟨H⟩ at the returned parameters (statevector, no shot noise). */
  energy: number;
  /** The optimizer's best objective value (a shot estimate when shots > 0) and its error. */
  objective: number;
  stdError: number;
  /** Exact expected business value at the returned parameters (null for custom operators). */
  expectation: number | null;
  evaluations: number;
  iterations: number;
  restarts: number;
  /** Shots spent on energy estimates plus the final read-out. */
  shotsUsed: number;
  trace: VariationalTracePoint[];
  samples: DecodedSample[];
  best: DecodedSample | null;
  /** Share of read-out shots whose decoded assignment meets the balance rule. */
  feasibleShare: number | null;
  stopped: boolean;
}


/**
 * The common end of a QAOA or VQE run on an encoding: the exact expected business value at the
 * final parameters, a read-out of sampled assignments, and the outcome record.
 */
export function finishEncodingRun(
  encoding: Encoding,
  ansatz: Pick<Ansatz, 'paramNames'>,
  loop: VariationalLoopResult,
  trace: VariationalTracePoint[],
  energy: number,
  opts: { shots: number; readoutShots?: number; topSamples?: number; rng: Rng; stateOptions?: StateOptions },
): VariationalOutcome {
  const expectation = expectationOfDiagonal(loop.state, isingDiagonal(encoding.valueOperator, opts.stateOptions));
  const readoutShots = opts.readoutShots ?? (opts.shots > 0 ? opts.shots : 1024);
  const out = readOut(encoding, loop.state, readoutShots, opts.rng, opts.topSamples ?? 10);
  return {
    params: Array.from(loop.x),
    paramNames: ansatz.paramNames,
    energy,
    objective: loop.fx,
    stdError: loop.stdError,
    expectation,
    evaluations: loop.evaluations,
    iterations: loop.iterations,
    restarts: loop.restarts,
    shotsUsed: loop.evaluations * opts.shots + readoutShots,
    trace,
    samples: out.samples,
    best: out.best,
    feasibleShare: encoding.kind === 'maxcut' ? null : out.feasibleShare,
    stopped: loop.reason === 'stopped',
  };
}
