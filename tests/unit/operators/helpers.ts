/** Test helpers: an independent dense construction of Pauli strings by Kronecker products. */
import type { Rng } from '../../../shared/engine/random';
import type { PauliSum } from '../../../shared/engine/operators/types';
import { createZeroState, normSquared, type StateVector } from '../../../shared/engine/statevector/state';

type C = [number, number];
/** Textbook Pauli matrices (row-major, complex pairs). */
const PAULI: Record<string, C[]> = {
  I: [[1, 0], [0, 0], [0, 0], [1, 0]],
  X: [[0, 0], [1, 0], [1, 0], [0, 0]],
  Y: [[0, 0], [0, -1], [0, 1], [0, 0]],
  Z: [[1, 0], [0, 0], [0, 0], [-1, 0]],
};

/** Dense matrix of Σ c_k P_k + offset·I as re/im row-major arrays, built as ⊗ over qubits n−1 … 0. */
export function kroneckerMatrix(p: PauliSum): { re: Float64Array; im: Float64Array; dim: number } {
  const dim = 1 << p.numQubits;
  const re = new Float64Array(dim * dim), im = new Float64Array(dim * dim);
  for (let x = 0; x < dim; x++) re[x * dim + x] += p.offset;
  for (const t of p.terms) {
    // Entry (r, c) of P_{n−1} ⊗ … ⊗ P_0 is the product over qubits of P_q[bit_q(r), bit_q(c)].
    for (let r = 0; r < dim; r++) {
      for (let c = 0; c < dim; c++) {
        let ar = 1, ai = 0;
        for (let q = 0; q < p.numQubits && (ar !== 0 || ai !== 0); q++) {
          const [mr, mi] = PAULI[t.letters[q]][((r >> q) & 1) * 2 + ((c >> q) & 1)];
          const nr = ar * mr - ai * mi;
          ai = ar * mi + ai * mr;
          ar = nr;
        }
        re[r * dim + c] += t.coeff * ar;
        im[r * dim + c] += t.coeff * ai;
      }
    }
  }
  return { re, im, dim };
}

export function randomPauliSum(n: number, terms: number, rng: Rng, letters = 'IXYZ'): PauliSum {
  const out: PauliSum = { numQubits: n, offset: rng.normal(), terms: [] };
  for (let k = 0; k < terms; k++) {
    let s = '';
    for (let q = 0; q < n; q++) s += letters[rng.int(letters.length)];
    out.terms.push({ letters: s, coeff: rng.normal() });
  }
  return out;
}

export function randomState(n: number, rng: Rng): StateVector {
  const s = createZeroState(n);
  for (let i = 0; i < s.amps.length; i++) s.amps[i] = rng.normal();
  const norm = Math.sqrt(normSquared(s));
  for (let i = 0; i < s.amps.length; i++) s.amps[i] /= norm;
  return s;
}
