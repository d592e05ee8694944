import type { Ansatz } from '../ansatz/types';
import type { Encoding } from '../encodings/types';
import type { Rng } from '../random';
import { expectationOfDiagonal, isingDiagonal } from '../statevector/diagonal';
import type { StateOptions } from '../statevector/state';
import type { VariationalLoopResult } from './optimize';
import type { VariationalOutcome, VariationalTracePoint } from './qaoa-run';
import { readOut } from './samples';

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
