/**
 * The cost operator as a diagonal: H(x) for every basis state, built once per problem and reused
 * by every QAOA layer (Lykov et al., SC-W 2023, arXiv:2309.04841: precompute the cost diagonal).
 */
import type { IsingOperator } from '../operators/types';
import { checkQubitCount, type StateOptions, type StateVector } from './state';

/**
 * diag[x] = offset + Σ h_i s_i + Σ J_ij s_i s_j with s_i = 1 − 2·bit_i(x).
 * Built by doubling: flipping qubit q from s=+1 to −1 on every x < 2^q changes the energy by
 * −2(h_q + Σ_{j>q} J_qj) − 2·Σ_{j<q} J_qj s_j(x), and that last sum is itself built by doubling
 * over the lower qubits, so the whole diagonal costs O(2ⁿ + terms) rather than O(2ⁿ·terms).
 */
export function isingDiagonal(op: IsingOperator, opts?: StateOptions): Float64Array {
  const n = op.numQubits;
  checkQubitCount(n, opts);
  const dim = 2 ** n;
  // Couplings per qubit split into lower and upper partners.
  const lowerOf: { j: number; c: number }[][] = Array.from({ length: n }, () => []);
  const upperSum = new Float64Array(n);
  let allPlus = op.offset;
  for (let i = 0; i < n; i++) allPlus += op.linear[i];
  for (let t = 0; t < op.quadCoeff.length; t++) {
    const i = op.quadI[t], j = op.quadJ[t], c = op.quadCoeff[t];
    if (i === j || i < 0 || j < 0 || i >= n || j >= n) {
      throw new RangeError(`quadratic term ${t} couples qubits ${i} and ${j}; need two different qubits in 0…${n - 1}`);
    }
    const lo = Math.min(i, j), hi = Math.max(i, j);
    lowerOf[hi].push({ j: lo, c });
    upperSum[lo] += c;
    allPlus += c;
  }
  const diag = new Float64Array(dim);
  diag[0] = allPlus;
  const lowerField = new Float64Array(dim >>> 1 || 1); // Σ_{j<q} J_qj s_j(x) for x < 2^q
  for (let q = 0; q < n; q++) {
    const size = 1 << q;
    lowerField[0] = 0;
    for (const { c } of lowerOf[q]) lowerField[0] += c;
    // Doubling over the lower qubits j: setting bit j flips s_j, changing the field by −2J_qj.
    let filled = 1;
    const coeffByBit = new Float64Array(q);
    for (const { j, c } of lowerOf[q]) coeffByBit[j] += c;
    for (let j = 0; j < q; j++) {
      const d = -2 * coeffByBit[j];
      for (let x = 0; x < filled; x++) lowerField[x + filled] = lowerField[x] + d;
      filled *= 2;
    }
    const shift = -2 * (op.linear[q] + upperSum[q]);
    for (let x = 0; x < size; x++) diag[x + size] = diag[x] + shift - 2 * lowerField[x];
  }
  return diag;
}

/** ⟨ψ|diag|ψ⟩ = Σ |amp_x|² diag[x]. */
export function expectationOfDiagonal(s: StateVector, diag: Float64Array): number {
  const a = s.amps;
  if (diag.length !== a.length >> 1) throw new RangeError(`diagonal has ${diag.length} entries, state needs ${a.length >> 1}`);
  let e = 0;
  for (let x = 0, i = 0; x < diag.length; x++, i += 2) e += (a[i] * a[i] + a[i + 1] * a[i + 1]) * diag[x];
  return e;
}
