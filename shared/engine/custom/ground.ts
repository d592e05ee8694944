import { DENSE_MAX_QUBITS, groundEnergyDense } from '../linalg/dense';
import { groundEnergyLanczos, LANCZOS_MAX_QUBITS } from '../linalg/lanczos';
import { compilePauliSum } from '../operators/pauli';
import type { PauliSum } from '../operators/types';
import { createRng } from '../random';

export interface ExactGround {
  energy: number;
  /** How it was found, in words for reports. */
  method: string;
}

export const isDiagonal = (p: PauliSum): boolean => p.terms.every((t) => !/[XY]/.test(t.letters));

/**
 * The exact ground energy of a custom operator: a diagonal operator's smallest diagonal entry;
 * otherwise dense diagonalisation up to DENSE_MAX_QUBITS qubits and Lanczos (restarted, seeded)
 * up to LANCZOS_MAX_QUBITS; null beyond (too large for this machine).
 */
export function exactGround(p: PauliSum): ExactGround | null {
  if (isDiagonal(p) && p.numQubits <= 26) {
    const d = compilePauliSum(p).diagonal;
    let min = Infinity;
    for (let x = 0; x < d.length; x++) if (d[x] < min) min = d[x];
    return { energy: min, method: 'smallest diagonal entry (the operator has Z terms only)' };
  }
  if (p.numQubits <= DENSE_MAX_QUBITS) return { energy: groundEnergyDense(p), method: `dense diagonalisation (ml-matrix), ${2 ** p.numQubits} × ${2 ** p.numQubits}` };
  if (p.numQubits <= LANCZOS_MAX_QUBITS) return { energy: groundEnergyLanczos(p, { rng: createRng(1) }), method: 'restarted Lanczos (residual below 1e-9)' };
  return null;
}
