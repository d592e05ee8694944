import { createPlusState, createZeroState, type StateOptions, type StateVector } from '../statevector/state';

/** Reuse `into` (same size) as |0…0⟩, or allocate one through the simulator's limit checks. */
export function resetToZero(numQubits: number, into: StateVector | undefined, opts?: StateOptions): StateVector {
  if (!into || into.numQubits !== numQubits) return createZeroState(numQubits, opts);
  into.amps.fill(0);
  into.amps[0] = 1;
  return into;
}

/** Reuse `into` as |+⟩ⁿ (all amplitudes 2^(−n/2)), or allocate one. */
export function resetToPlus(numQubits: number, into: StateVector | undefined, opts?: StateOptions): StateVector {
  if (!into || into.numQubits !== numQubits) return createPlusState(numQubits, opts);
  const a = into.amps, v = 1 / Math.sqrt(a.length >> 1);
  for (let i = 0; i < a.length; i += 2) { a[i] = v; a[i + 1] = 0; }
  return into;
}
