import type { Encoding } from '../encodings/types';

/** Per qubit, the probability of reading 1 a warm start aims at (slack qubits stay at ½). */
export function warmProbabilities(encoding: Encoding, assignment: ArrayLike<number>): number[] {
  const probabilities = new Array<number>(encoding.numQubits).fill(0.5);
  encoding.encodeAssignment(assignment).forEach((b, q) => (probabilities[q] = b));
  return probabilities;
}
