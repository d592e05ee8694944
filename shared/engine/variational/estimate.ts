import type { Estimate } from '../optimizers/types';
import type { Rng } from '../random';
import { expectationOfDiagonal } from '../statevector/diagonal';
import { sampleBasisIndices } from '../statevector/sample';
import type { StateVector } from '../statevector/state';

/**
 * Energy of a diagonal operator: exact ⟨ψ|H|ψ⟩ when shots = 0; otherwise the mean of H over
 * `shots` computational-basis samples, with standard error sd/√shots (one measurement group:
 * every term is Z-only).
 */
export function createDiagonalEstimator(diag: Float64Array, shots: number, rng: Rng): (s: StateVector) => Estimate {
  if (shots <= 0) return (s) => ({ value: expectationOfDiagonal(s, diag), stdError: 0 });
  return (s) => {
    const xs = sampleBasisIndices(s, shots, rng);
    let sum = 0, sq = 0;
    for (let k = 0; k < xs.length; k++) {
      const e = diag[xs[k]];
      sum += e;
      sq += e * e;
    }
    const mean = sum / shots;
    const variance = shots > 1 ? Math.max(0, (sq - shots * mean * mean) / (shots - 1)) : 0;
    return { value: mean, stdError: Math.sqrt(variance / shots) };
  };
}
