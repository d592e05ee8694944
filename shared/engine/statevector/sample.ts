/**
 * Measurement in the computational basis: draw shots from |ψ|².
 * Sorted uniforms swept against the running cumulative probability: O(2ⁿ + m log m) time and
 * O(m) extra memory (no 2ⁿ cumulative table), reproducible from the seeded Rng.
 */
import type { Rng } from '../random';
import type { StateVector } from './state';

/** Basis index → count, `shots` draws in total. */
export function sampleBasisStates(s: StateVector, shots: number, rng: Rng): Map<number, number> {
  const counts = new Map<number, number>();
  const indices = sampleBasisIndices(s, shots, rng);
  for (let k = 0; k < indices.length; k++) counts.set(indices[k], (counts.get(indices[k]) ?? 0) + 1);
  return counts;
}

/** The shots as basis indices in ascending order (length shots). */
export function sampleBasisIndices(s: StateVector, shots: number, rng: Rng): Uint32Array {
  if (!Number.isInteger(shots) || shots < 0) throw new RangeError(`shots must be a non-negative integer, got ${shots}`);
  const a = s.amps;
  const dim = a.length >> 1;
  // Normalise by the actual total so round-off drift in the norm never biases the last state.
  let total = 0;
  for (let i = 0; i < a.length; i++) total += a[i] * a[i];
  if (!(total > 0)) throw new RangeError('cannot sample from a zero state');
  const u = new Float64Array(shots);
  for (let k = 0; k < shots; k++) u[k] = rng.next() * total;
  u.sort();
  const out = new Uint32Array(shots);
  let cum = 0;
  let x = -1;
  let lastNonZero = 0;
  for (let k = 0; k < shots; k++) {
    while (cum <= u[k] && x < dim - 1) {
      x++;
      const p = a[2 * x] * a[2 * x] + a[2 * x + 1] * a[2 * x + 1];
      if (p > 0) lastNonZero = x;
      cum += p;
    }
    // If round-off leaves u above the final cumulative sum, take the last state with weight.
    out[k] = cum > u[k] ? x : lastNonZero;
  }
  return out;
}
