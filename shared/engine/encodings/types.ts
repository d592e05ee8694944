import type { IsingOperator } from '../operators/types';
import type { ProblemKind } from '../problem/types';

/**
 * A quadratic unconstrained binary objective over bits x_i ∈ {0,1}:
 *   E(x) = offset + Σ_i linear_i x_i + Σ_(i<j) quadCoeff·x_i x_j.
 * Bit x_i is bit i of a basis index, so x = 1 ⇔ spin s = −1 (x = (1 − s)/2).
 */
export interface Qubo {
  numVars: number;
  offset: number;
  linear: Float64Array;
  quadI: Int32Array;
  quadJ: Int32Array;
  quadCoeff: Float64Array;
}

/** One penalty family inside an encoding, with the weight it got and why. */
export interface PenaltyTerm {
  name: string;
  weight: number;
  /** The rule that set the weight, in plain words. */
  rule: string;
}

/**
 * A splitting question written as an Ising cost operator, with the map back to business values.
 *
 * Sign convention (everywhere): the operator's ground state is the best answer, for every kind.
 * - maxcut:     energy = −(cut weight).                          value = −energy.
 * - bisection:  energy = crossing weight + A·(imbalance penalty), value = energy when feasible.
 * - kway:       energy = crossing weight + one-hot and balance penalties, same reading.
 * QAOA's cost operator is C = −H (for max-cut exactly the cut-value operator Σ w(1 − ZZ)/2),
 * and the driver maximises ⟨C⟩, i.e. minimises ⟨H⟩.
 */
export interface Encoding {
  kind: ProblemKind;
  /** Short name of the encoding ('maxcut', 'bisection', 'kway-onehot'). */
  method: string;
  numQubits: number;
  operator: IsingOperator;
  /** Qubits that carry depots (the rest are slack qubits). */
  depotQubits: number;
  /** depot i → its qubit (or first qubit of its one-hot block), −1 when pinned. Length n. */
  qubitOfDepot: Int32Array;
  /** Region/side per depot (input order, pinned depots included) from a basis index or bits. */
  decode(state: number | Uint8Array): Int32Array;
  /**
   * The business value as an operator on the same qubits (maxcut: the cut; partitions: the
   * crossing weight without penalties), so its exact expectation is one diagonal pass.
   */
  valueOperator: IsingOperator;
  /** Depot-qubit bits (length depotQubits) that encode an assignment (warm starts). */
  encodeAssignment(assignment: ArrayLike<number>): Uint8Array;
  /** Business value of an assignment (crossingWeight: cut for maxcut, crossing for partitions). */
  valueOf(assignment: ArrayLike<number>): number;
  /** Balance rule of shared/engine/problem/evaluate.ts (always true for maxcut). */
  feasible(assignment: ArrayLike<number>): boolean;
  /**
   * Business reading of an energy: maxcut → cut weight (−energy); partitions →
   * crossing weight + penalty (energy / laneScale with laneScale = 1 here).
   */
  valueOfEnergy(energy: number): number;
  penalties: PenaltyTerm[];
  /** Everything above in plain words (shown in reports). */
  rule: string;
  /** True when depot weights had to be rounded to a grid for the penalty (see rule). */
  approximate: boolean;
}
