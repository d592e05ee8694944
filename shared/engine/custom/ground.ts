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
 * Above this many qubits the ground energy comes from Lanczos, not the dense matrix (which works
 * to DENSE_MAX_QUBITS): measured in one run on the shared 2-core machine, dense took 6.4 s at 8
 * qubits, 11 s at 9 and 105 s at 10, Lanczos 0.4 s, 0.4 s and 1.2 s, same energies — and an app
 * operator run has its time limit + 30 s before it is stopped (server/services/operators.ts).
 */
export const GROUND_DENSE_MAX_QUBITS = 8;

/**
 * The exact ground energy of a custom operator: a diagonal operator's smallest diagonal entry;
 * otherwise dense diagonalisation up to GROUND_DENSE_MAX_QUBITS qubits and Lanczos (restarted,
 * seeded) up to LANCZOS_MAX_QUBITS; null beyond (too large for this machine).
 */
export function exactGround(p: PauliSum): ExactGround | null {
  if (isDiagonal(p) && p.numQubits <= 26) {
    const d = compilePauliSum(p).diagonal;
    let min = Infinity;
    for (let x = 0; x < d.length; x++) if (d[x] < min) min = d[x];
    return { energy: min, method: 'smallest diagonal entry (the operator has Z terms only)' };
  }
  if (p.numQubits <= Math.min(GROUND_DENSE_MAX_QUBITS, DENSE_MAX_QUBITS)) return { energy: groundEnergyDense(p), method: `dense diagonalisation (ml-matrix), ${2 ** p.numQubits} × ${2 ** p.numQubits}` };
  if (p.numQubits <= LANCZOS_MAX_QUBITS) return { energy: groundEnergyLanczos(p, { rng: createRng(1) }), method: 'restarted Lanczos (residual below 1e-9)' };
  return null;
}
