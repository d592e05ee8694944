import type { IsingOperator } from '../operators/types';
import type { Qubo } from './types';

/**
 * QUBO → Ising with x_i = (1 − s_i)/2 (bit 1 ⇔ spin −1, the engine's qubit convention).
 * c·x = c/2 − (c/2)s;  Q·x_i x_j = (Q/4)(1 − s_i − s_j + s_i s_j). Same energy on every state.
 */
export function quboToIsing(q: Qubo): IsingOperator {
  const linear = new Float64Array(q.numVars);
  let offset = q.offset;
  for (let i = 0; i < q.numVars; i++) {
    offset += q.linear[i] / 2;
    linear[i] -= q.linear[i] / 2;
  }
  for (let t = 0; t < q.quadCoeff.length; t++) {
    const c = q.quadCoeff[t] / 4;
    offset += c;
    linear[q.quadI[t]] -= c;
    linear[q.quadJ[t]] -= c;
  }
  return { numQubits: q.numVars, offset, linear, quadI: q.quadI.slice(), quadJ: q.quadJ.slice(), quadCoeff: q.quadCoeff.map((c) => c / 4) };
}

/** Ising → QUBO with s_i = 1 − 2x_i:  h·s = h − 2h·x;  J·s_i s_j = J(1 − 2x_i − 2x_j + 4x_i x_j). */
export function isingToQubo(op: IsingOperator): Qubo {
  const linear = new Float64Array(op.numQubits);
  let offset = op.offset;
  for (let i = 0; i < op.numQubits; i++) {
    offset += op.linear[i];
    linear[i] -= 2 * op.linear[i];
  }
  for (let t = 0; t < op.quadCoeff.length; t++) {
    const c = op.quadCoeff[t];
    offset += c;
    linear[op.quadI[t]] -= 2 * c;
    linear[op.quadJ[t]] -= 2 * c;
  }
  return { numVars: op.numQubits, offset, linear, quadI: op.quadI.slice(), quadJ: op.quadJ.slice(), quadCoeff: op.quadCoeff.map((c) => 4 * c) };
}

/** Bit i of a basis index, or entry i of a bit array. */
export const bitAt = (state: number | ArrayLike<number>, i: number): number =>
  typeof state === 'number' ? Math.floor(state / 2 ** i) % 2 : state[i];

/** H(x) of an Ising operator at one basis state (spin +1 ⇔ bit 0). O(n + terms). */
export function isingEnergyAt(op: IsingOperator, state: number | ArrayLike<number>): number {
  const spin = new Int8Array(op.numQubits);
  for (let i = 0; i < op.numQubits; i++) spin[i] = bitAt(state, i) ? -1 : 1;
  let e = op.offset;
  for (let i = 0; i < op.numQubits; i++) e += op.linear[i] * spin[i];
  for (let t = 0; t < op.quadCoeff.length; t++) e += op.quadCoeff[t] * spin[op.quadI[t]] * spin[op.quadJ[t]];
  return e;
}

/** E(x) of a QUBO at one assignment of bits. */
export function quboEnergyAt(q: Qubo, state: number | ArrayLike<number>): number {
  const x = new Uint8Array(q.numVars);
  for (let i = 0; i < q.numVars; i++) x[i] = bitAt(state, i);
  let e = q.offset;
  for (let i = 0; i < q.numVars; i++) e += q.linear[i] * x[i];
  for (let t = 0; t < q.quadCoeff.length; t++) e += q.quadCoeff[t] * x[q.quadI[t]] * x[q.quadJ[t]];
  return e;
}
