import { applyCnot, applyCz, applySingleQubit, applyX, H_MATRIX, rxMatrix, ryMatrix, rzMatrix } from '../statevector/gates';
import type { StateVector } from '../statevector/state';
import { angleValue, type Gate } from './types';

/** Applies one gate of a gate list (physical qubits = state qubits). */
export function applyGate(s: StateVector, g: Gate, params: ArrayLike<number>): void {
  switch (g.name) {
    case 'h': applySingleQubit(s, g.qubits[0], H_MATRIX); return;
    case 'x': applyX(s, g.qubits[0]); return;
    case 'rx': applySingleQubit(s, g.qubits[0], rxMatrix(angleValue(g.angle!, params))); return;
    case 'ry': applySingleQubit(s, g.qubits[0], ryMatrix(angleValue(g.angle!, params))); return;
    case 'rz': applySingleQubit(s, g.qubits[0], rzMatrix(angleValue(g.angle!, params))); return;
    case 'cx': applyCnot(s, g.qubits[0], g.qubits[1]); return;
    case 'cz': applyCz(s, g.qubits[0], g.qubits[1]); return;
  }
}

const Y_MATRIX = Float64Array.of(0, 0, 0, -1, 0, 1, 0, 0);
const Z_MATRIX = Float64Array.of(1, 0, 0, 0, 0, 0, -1, 0);

/** Pauli letter 0 = I, 1 = X, 2 = Y, 3 = Z on qubit q. */
export function applyPauli(s: StateVector, q: number, letter: number): void {
  if (letter === 1) applyX(s, q);
  else if (letter === 2) applySingleQubit(s, q, Y_MATRIX);
  else if (letter === 3) applySingleQubit(s, q, Z_MATRIX);
}
