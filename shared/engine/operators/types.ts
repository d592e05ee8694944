/**
 * Operators.
 *
 * `IsingOperator`: the diagonal cost operator encodings produce,
 *   H(s) = offset + Σ_i h_i s_i + Σ_(i<j) J_ij s_i s_j,   s_i = ±1 (s = +1 ⇔ bit 0 ⇔ Z eigenvalue +1).
 * `PauliSum`: a general weighted sum of Pauli strings over I, X, Y, Z (custom spin models).
 *
 * Qubit convention everywhere: qubit q is bit q of the basis-state index (qubit 0 = least
 * significant bit); bit value 0 ⇔ Z = +1 ⇔ spin s = +1 ⇔ side/assignment 0.
 */

export interface IsingOperator {
  numQubits: number;
  offset: number;
  /** Linear (Z_i) coefficients, length numQubits. */
  linear: Float64Array;
  /** Quadratic (Z_i Z_j) terms, i < j, parallel arrays of length numQuadratic. */
  quadI: Int32Array;
  quadJ: Int32Array;
  quadCoeff: Float64Array;
}

export type PauliLetter = 'I' | 'X' | 'Y' | 'Z';

export interface PauliTerm {
  /** One letter per qubit; string index q is qubit q (written left to right from qubit 0). */
  letters: string;
  coeff: number;
}

export interface PauliSum {
  numQubits: number;
  /** Coefficient of the identity. */
  offset: number;
  terms: PauliTerm[];
}
