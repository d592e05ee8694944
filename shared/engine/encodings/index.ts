import type { Problem } from '../problem/types';
import { encodeBisection, type BisectionEncodingOptions } from './bisection';
import { encodeKwayOneHot, type KwayEncodingOptions } from './kway-onehot';
import { encodeMaxCut } from './maxcut';
import type { Encoding } from './types';

export type EncodingOptions = BisectionEncodingOptions & KwayEncodingOptions;

/** The direct (single operator) encoding of a problem: maxcut, bisection, or k-way one-hot. */
export function encodeProblem(problem: Problem, opts: EncodingOptions = {}): Encoding {
  if (problem.kind === 'maxcut') return encodeMaxCut(problem);
  if (problem.kind === 'bisection') return encodeBisection(problem, opts);
  return encodeKwayOneHot(problem, opts);
}

/** Qubits the direct encoding would need (for refusals, without building the operator twice). */
export function qubitsNeeded(problem: Problem, opts: EncodingOptions = {}): number {
  return encodeProblem(problem, opts).numQubits;
}

export type { Encoding, Qubo, PenaltyTerm } from './types';
