import type { StateVector } from '../statevector/state';

/**
 * A parameterised circuit that prepares |ψ(θ)⟩ on the CPU statevector.
 * `prepare` overwrites `into` when given (one 16·2ⁿ-byte buffer per run, not per evaluation).
 */
export interface Ansatz {
  name: string;
  numQubits: number;
  numParams: number;
  /** Names for reports, e.g. γ1 … γp, β1 … βp. */
  paramNames: string[];
  /**
   * Per parameter: 'shift' when it enters exactly one gate e^{−iθP/2} (parameter-shift rule
   * exact), 'difference' when it does not (QAOA's γ and β) and finite differences are used.
   */
  gradientRule: ('shift' | 'difference')[];
  prepare(params: ArrayLike<number>, into?: StateVector): StateVector;
}
