/**
 * Dense exact diagonalisation of a PauliSum (n ≤ 10) with ml-matrix.
 *
 * Choice: an operator whose strings all carry an even number of Y is a real symmetric matrix and is
 * diagonalised directly (N = 2ⁿ). Otherwise H = A + iB (A symmetric, B antisymmetric) is replaced
 * by the real symmetric embedding [[A, −B], [B, A]] of size 2N, whose spectrum is H's with every
 * eigenvalue twice. ml-matrix takes ~5 s for N = 1024 on this machine, so the embedding is only
 * practical up to n = 9 (N = 1024 real); use groundEnergyLanczos beyond.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { compilePauliSum, parity } from '../operators/pauli';
import type { PauliSum } from '../operators/types';

export const DENSE_MAX_QUBITS = 10;

/** Row-major 2ⁿ×2ⁿ matrix of p: H[row·N + col] as separate real and imaginary parts. */
export function pauliSumMatrix(p: PauliSum): { dim: number; re: Float64Array; im: Float64Array; real: boolean } {
  if (p.numQubits > DENSE_MAX_QUBITS) {
    throw new RangeError(`dense matrices stop at ${DENSE_MAX_QUBITS} qubits (got ${p.numQubits}); use groundEnergyLanczos`);
  }
  const c = compilePauliSum(p);
  const N = c.diagonal.length;
  const re = new Float64Array(N * N), im = new Float64Array(N * N);
  for (let x = 0; x < N; x++) re[x * N + x] = c.diagonal[x];
  for (const g of c.flipGroups) {
    for (let x = 0; x < N; x++) {
      let pr = 0, pi = 0;
      for (let t = 0; t < g.zy.length; t++) {
        const sgn = parity(x & g.zy[t]) ? -1 : 1;
        pr += sgn * g.re[t];
        pi += sgn * g.im[t];
      }
      const row = x ^ g.flip;
      re[row * N + x] += pr;
      im[row * N + x] += pi;
    }
  }
  return { dim: N, re, im, real: c.real };
}

/** All eigenvalues of p, ascending. */
export function spectrumDense(p: PauliSum): Float64Array {
  const { dim: N, re, im, real } = pauliSumMatrix(p);
  let M: Matrix;
  if (real) {
    M = new Matrix(N, N);
    for (let r = 0; r < N; r++) for (let col = 0; col < N; col++) M.set(r, col, re[r * N + col]);
  } else {
    M = new Matrix(2 * N, 2 * N);
    for (let r = 0; r < N; r++) {
      for (let col = 0; col < N; col++) {
        const a = re[r * N + col], b = im[r * N + col];
        M.set(r, col, a);
        M.set(r + N, col + N, a);
        M.set(r + N, col, b);
        M.set(r, col + N, -b);
      }
    }
  }
  const values = Float64Array.from(new EigenvalueDecomposition(M, { assumeSymmetric: true }).realEigenvalues).sort();
  if (real) return values;
  const once = new Float64Array(N);
  for (let k = 0; k < N; k++) once[k] = values[2 * k]; // each eigenvalue appears twice in the embedding
  return once;
}

export function groundEnergyDense(p: PauliSum): number {
  return spectrumDense(p)[0];
}
