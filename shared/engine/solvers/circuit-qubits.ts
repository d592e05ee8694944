/**
 * How wide the QAOA/VQE circuits are: the one place that counts the qubits of the variational
 * solvers (their `qubits` and their refusal both read it). Max-cut and bisection simulate their
 * direct encoding; k regions simulate either the one-hot encoding (n·k qubits plus slack) or, by
 * default, recursive bisection — whose widest circuit is the first split.
 */
import { encodeProblem, type EncodingOptions } from '../encodings';
import type { Problem } from '../problem/types';
import type { CircuitTarget } from './types';
import { DEFAULT_MAX_QUBITS } from '../statevector/state';
import { firstBisectionStep } from '../variational/recursive-bisection';
import type { CircuitChoice } from './circuit-plan';

export type { CircuitChoice };

export interface CircuitSize {
  qubits: number;
  /** True when `qubits` is a lower bound (beyond the simulator's limit no operator is built). */
  atLeast: boolean;
  /** Which circuit, in words (refusals quote it). */
  what: string;
}

export const encodingOptions = (s: CircuitChoice): EncodingOptions => ({ penaltyRule: s.penaltyRule });

const freeCount = (problem: Problem) => {
  let free = 0;
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] < 0) free++;
  return free;
};

/** The problem and encoding options of the widest circuit a QAOA/VQE run simulates (what the preview describes). */
export function widestCircuit(problem: Problem, s: CircuitChoice): CircuitTarget {
  if (problem.kind === 'kway' && s.kwayStrategy === 'recursive') {
    const sub = firstBisectionStep(problem);
    return { problem: sub.problem, options: { ...encodingOptions(s), imbalanceWindow: sub.imbalanceWindow }, what: 'the first bisection of the recursive k-way split' };
  }
  return { problem, options: encodingOptions(s), what: `the ${problem.kind === 'kway' ? 'one-hot k-way' : problem.kind} encoding` };
}

/** The widest circuit of a QAOA/VQE run. Large networks are sized from the depot count alone. */
export function circuitSize(problem: Problem, s: CircuitChoice): CircuitSize {
  const free = freeCount(problem);
  const oneHot = problem.kind === 'kway' && s.kwayStrategy === 'onehot';
  const lower = oneHot ? free * problem.k : free;
  if (lower > DEFAULT_MAX_QUBITS) {
    return { qubits: lower, atLeast: true, what: oneHot ? 'the one-hot k-way encoding' : `one qubit per free depot (${free} free depots)` };
  }
  const c = widestCircuit(problem, s);
  return { qubits: encodeProblem(c.problem, c.options).numQubits, atLeast: false, what: c.what };
}
