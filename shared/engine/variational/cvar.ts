import type { Estimate } from '../optimizers/types';
import type { Rng } from '../random';
import { sampleBasisIndices } from '../statevector/sample';
import type { StateVector } from '../statevector/state';
import { createDiagonalEstimator } from './estimate';

/**
 * CVaR objective (Barkoutsos, Nannicini, Robert, Tavernelli & Woerner, "Improving Variational
 * Quantum Optimization using CVaR", Quantum 4, 256 (2020)): the mean energy of the best α share
 * of the measurement outcomes instead of the mean of all. α = 1 is the plain expectation; small
 * α rewards states that put weight on good answers even while their mean is poor.
 *
 * Exact (shots = 0): with the basis states ordered by energy once, CVaR_α(ψ) =
 * (1/α)·[Σ_(x below the α-quantile) |ψ_x|² E_x + (α − mass below)·E_quantile].
 * With shots: the mean of the ⌈α·shots⌉ lowest sampled energies, standard error of that mean.
 */
export function createCvarEstimator(diag: Float64Array, alpha: number, shots: number, rng: Rng): (s: StateVector) => Estimate {
  if (!(alpha > 0 && alpha <= 1)) throw new RangeError(`cvarAlpha must lie in (0, 1] (got ${alpha})`);
  if (shots > 0) {
    const keep = Math.max(1, Math.ceil(alpha * shots));
    return (s) => {
      const xs = sampleBasisIndices(s, shots, rng);
      const e = Float64Array.from(xs, (x) => diag[x]).sort().subarray(0, keep);
      let sum = 0, sq = 0;
      for (let k = 0; k < e.length; k++) { sum += e[k]; sq += e[k] * e[k]; }
      const mean = sum / keep;
      const variance = keep > 1 ? Math.max(0, (sq - keep * mean * mean) / (keep - 1)) : 0;
      return { value: mean, stdError: Math.sqrt(variance / keep) };
    };
  }
  // Distinct energies in increasing order and each state's rank among them (built once).
  const sorted = Float64Array.from(new Set(diag)).sort();
  const rankOf = new Map<number, number>();
  sorted.forEach((v, r) => rankOf.set(v, r));
  const rank = Uint32Array.from(diag, (v) => rankOf.get(v)!);
  const mass = new Float64Array(sorted.length);
  return (s) => {
    mass.fill(0);
    const a = s.amps;
    for (let x = 0, i = 0; x < rank.length; x++, i += 2) mass[rank[x]] += a[i] * a[i] + a[i + 1] * a[i + 1];
    let left = alpha, sum = 0;
    for (let r = 0; r < sorted.length && left > 0; r++) {
      const take = Math.min(left, mass[r]);
      sum += take * sorted[r];
      left -= take;
    }
    if (left > 1e-12) sum += left * sorted[sorted.length - 1]; // rounding: total mass just below 1
    return { value: sum / alpha, stdError: 0 };
  };
}

/** The objective a run minimises: CVaR_α when α < 1, else the plain (exact or sampled) energy. */
export function objectiveEstimator(diag: Float64Array, shots: number, rng: Rng, cvarAlpha?: number): (s: StateVector) => Estimate {
  return cvarAlpha !== undefined && cvarAlpha < 1 ? createCvarEstimator(diag, cvarAlpha, shots, rng) : createDiagonalEstimator(diag, shots, rng);
}
