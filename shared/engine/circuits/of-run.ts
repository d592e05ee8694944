import { createLadderAnsatz } from '../ansatz/ladder';
import { createQaoaAnsatz } from '../ansatz/qaoa';
import type { Ansatz } from '../ansatz/types';
import { isingDiagonal } from '../statevector/diagonal';
import { encodeBisection } from '../encodings/bisection';
import { encodeProblem } from '../encodings';
import type { Encoding } from '../encodings/types';
import type { Problem } from '../problem/types';
import { firstBisectionStep } from '../variational/recursive-bisection';
import { ladderCircuit } from './ladder';
import { qaoaCircuit } from './qaoa';
import type { LogicalCircuit } from './types';

/**
 * What a variational run's circuit was, small enough to keep with the result (JSON): enough to
 * rebuild the gate list from the problem for resources, noise and OpenQASM.
 */
export interface CircuitSpec {
  /** 'qaoa' is QAOA and VQE's alternating ansatz; 'ladder' the hardware-efficient one. */
  ansatz: 'qaoa' | 'ladder';
  layers: number;
  entangler?: 'line' | 'ring';
  /** Warm-start bits per qubit (probability that the qubit reads 1) and ε. */
  warmStart?: { probabilities: number[]; epsilon: number };
  /** Which operator: the problem's direct encoding, or the first split of a recursive k-way run. */
  encoding: 'direct' | 'first-split';
  penaltyRule: 'lucas' | 'dominant';
}

/** The encoding a spec names (the same calls the solvers make). */
export function encodingOf(problem: Problem, spec: Pick<CircuitSpec, 'encoding' | 'penaltyRule'>): Encoding {
  if (spec.encoding === 'first-split') {
    const sub = firstBisectionStep(problem);
    return encodeBisection(sub.problem, { penaltyRule: spec.penaltyRule, imbalanceWindow: sub.imbalanceWindow });
  }
  return encodeProblem(problem, { penaltyRule: spec.penaltyRule });
}

/** The logical circuit of a run on its encoding. */
export function circuitOf(encoding: Encoding, spec: CircuitSpec): LogicalCircuit {
  if (spec.ansatz === 'ladder') return ladderCircuit({ numQubits: encoding.numQubits, layers: spec.layers, entangler: spec.entangler });
  return qaoaCircuit({ operator: encoding.operator, layers: spec.layers, warmStart: spec.warmStart });
}

/** The statevector ansatz of a run (the one the solver optimised), for its noiseless state. */
export function ansatzOf(encoding: Encoding, spec: CircuitSpec): Ansatz {
  if (spec.ansatz === 'ladder') return createLadderAnsatz({ numQubits: encoding.numQubits, layers: spec.layers, entangler: spec.entangler });
  return createQaoaAnsatz({ numQubits: encoding.numQubits, layers: spec.layers, energyDiagonal: isingDiagonal(encoding.operator), warmStart: spec.warmStart });
}
