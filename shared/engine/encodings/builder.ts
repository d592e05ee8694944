import type { IsingOperator } from '../operators/types';
import type { Qubo } from './types';

/**
 * Reference to a variable in a builder: ≥ 0 is a qubit/bit index; the two negative codes are
 * pinned values, substituted while terms are added (this is how pinned depots remove qubits).
 * PINNED_BIT0 ⇔ bit 0 ⇔ spin +1; PINNED_BIT1 ⇔ bit 1 ⇔ spin −1.
 */
export type VarRef = number;
export const PINNED_BIT0 = -1;
export const PINNED_BIT1 = -2;

export const pinnedRef = (bit: number): VarRef => (bit === 0 ? PINNED_BIT0 : PINNED_BIT1);
const spinOfPinned = (ref: VarRef) => (ref === PINNED_BIT0 ? 1 : -1);
const bitOfPinned = (ref: VarRef) => (ref === PINNED_BIT0 ? 0 : 1);

/** Accumulates quadratic terms keyed by (i<j) and emits parallel typed arrays. */
function createPairTable() {
  const table = new Map<number, number>();
  let stride = 1;
  return {
    setStride(n: number) { stride = Math.max(1, n); },
    add(i: number, j: number, c: number) {
      if (i > j) [i, j] = [j, i];
      const key = i * stride + j;
      table.set(key, (table.get(key) ?? 0) + c);
    },
    emit() {
      const keys = [...table.keys()].filter((k) => table.get(k) !== 0).sort((a, b) => a - b);
      const quadI = new Int32Array(keys.length), quadJ = new Int32Array(keys.length), quadCoeff = new Float64Array(keys.length);
      keys.forEach((k, t) => { quadI[t] = Math.floor(k / stride); quadJ[t] = k % stride; quadCoeff[t] = table.get(k)!; });
      return { quadI, quadJ, quadCoeff };
    },
  };
}

/** Builder for H(s) = offset + Σ h_i s_i + Σ J_ij s_i s_j with s_i = ±1. */
export function createIsingBuilder(numQubits: number) {
  let offset = 0;
  const linear = new Float64Array(numQubits);
  const pairs = createPairTable();
  pairs.setStride(numQubits);
  const builder = {
    constant(c: number) { offset += c; },
    /** c·s_a */
    z(a: VarRef, c: number) {
      if (a >= 0) linear[a] += c;
      else offset += c * spinOfPinned(a);
    },
    /** c·s_a·s_b (s_a² = 1 when a = b) */
    zz(a: VarRef, b: VarRef, c: number) {
      if (a < 0 && b < 0) offset += c * spinOfPinned(a) * spinOfPinned(b);
      else if (a < 0) linear[b] += c * spinOfPinned(a);
      else if (b < 0) linear[a] += c * spinOfPinned(b);
      else if (a === b) offset += c;
      else pairs.add(a, b, c);
    },
    /** weight·(c + Σ a_t s_(ref_t))² expanded into Ising terms. */
    square(refs: ArrayLike<VarRef>, coeffs: ArrayLike<number>, c: number, weight: number) {
      offset += weight * c * c;
      for (let t = 0; t < refs.length; t++) {
        builder.z(refs[t], 2 * weight * c * coeffs[t]);
        builder.zz(refs[t], refs[t], weight * coeffs[t] * coeffs[t]);
        for (let u = t + 1; u < refs.length; u++) builder.zz(refs[t], refs[u], 2 * weight * coeffs[t] * coeffs[u]);
      }
    },
    build(): IsingOperator {
      return { numQubits, offset, linear: linear.slice(), ...pairs.emit() };
    },
  };
  return builder;
}

/** Builder for E(x) = offset + Σ c_i x_i + Σ Q_ij x_i x_j with x_i ∈ {0,1}. */
export function createQuboBuilder(numVars: number) {
  let offset = 0;
  const linear = new Float64Array(numVars);
  const pairs = createPairTable();
  pairs.setStride(numVars);
  const builder = {
    constant(c: number) { offset += c; },
    /** c·x_a */
    x(a: VarRef, c: number) {
      if (a >= 0) linear[a] += c;
      else offset += c * bitOfPinned(a);
    },
    /** c·x_a·x_b (x_a² = x_a when a = b) */
    xx(a: VarRef, b: VarRef, c: number) {
      if (a < 0 && b < 0) offset += c * bitOfPinned(a) * bitOfPinned(b);
      else if (a < 0) linear[b] += c * bitOfPinned(a);
      else if (b < 0) linear[a] += c * bitOfPinned(b);
      else if (a === b) linear[a] += c;
      else pairs.add(a, b, c);
    },
    /** weight·(c + Σ a_t x_(ref_t))² expanded into QUBO terms. */
    square(refs: ArrayLike<VarRef>, coeffs: ArrayLike<number>, c: number, weight: number) {
      offset += weight * c * c;
      for (let t = 0; t < refs.length; t++) {
        builder.x(refs[t], 2 * weight * c * coeffs[t]);
        builder.xx(refs[t], refs[t], weight * coeffs[t] * coeffs[t]);
        for (let u = t + 1; u < refs.length; u++) builder.xx(refs[t], refs[u], 2 * weight * coeffs[t] * coeffs[u]);
      }
    },
    build(): Qubo {
      return { numVars, offset, linear: linear.slice(), ...pairs.emit() };
    },
  };
  return builder;
}
