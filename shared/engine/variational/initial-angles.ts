import type { IsingOperator } from '../operators/types';
import type { Rng } from '../random';

/**
 * Transferred fixed angles for unit-weight cut operators (our convention, references.md):
 * p = 1: γ = arctan(1/√2), β = π/8 (3-regular triangle-free optimum, references.md [computed]);
 * p = 2: Wurtz & Love, Phys. Rev. A 103, 042612 (2021) values in references.md;
 * p = 3: [memory] fixed-angle values for 3-regular graphs. Shaydulin et al., ACM TQC 4(3)
 * (2023) show one fixed vector per depth transfers across weighted graphs after rescaling γ.
 */
const FIXED: Record<number, { gamma: number[]; beta: number[] }> = {
  1: { gamma: [Math.atan(Math.SQRT1_2)], beta: [Math.PI / 8] },
  2: { gamma: [0.4878, 0.8978], beta: [0.5549, 0.2924] },
  3: { gamma: [0.4220, 0.7980, 0.9370], beta: [0.6090, 0.4590, 0.2350] },
};

/**
 * Weight scale of an energy operator: the root mean square of 2·J over its couplings (for
 * max-cut 2J = w, so unit-weight graphs have scale 1). Angles tuned for unit weights are
 * divided by it (common practice; Shaydulin et al. 2023 rescale γ the same way).
 */
export function couplingScale(op: IsingOperator): number {
  let s = 0;
  for (let t = 0; t < op.quadCoeff.length; t++) s += (2 * op.quadCoeff[t]) ** 2;
  if (op.quadCoeff.length > 0 && s > 0) return Math.sqrt(s / op.quadCoeff.length);
  let h = 0;
  for (let i = 0; i < op.numQubits; i++) h += (2 * op.linear[i]) ** 2;
  return h > 0 ? Math.sqrt(h / op.numQubits) : 1;
}

/**
 * Linear ramp (common practice; "annealing-like" schedule): γ rises and β falls over the
 * layers, γ_ℓ = Δγ·(ℓ − ½)/p, β_ℓ = Δβ·(1 − (ℓ − ½)/p). Parameters [γ…, β…].
 */
export function linearRampAngles(layers: number, scale = 1, deltaGamma = 0.75, deltaBeta = 0.75): Float64Array {
  const x = new Float64Array(2 * layers);
  for (let l = 0; l < layers; l++) {
    const f = (l + 0.5) / layers;
    x[l] = (deltaGamma * f) / scale;
    x[layers + l] = deltaBeta * (1 - f);
  }
  return x;
}

/** Fixed angles for p ≤ 3 (γ rescaled), the linear ramp beyond. */
export function transferredAngles(layers: number, scale = 1): Float64Array {
  const fixed = FIXED[layers];
  if (!fixed) return linearRampAngles(layers, scale);
  return Float64Array.from([...fixed.gamma.map((g) => g / scale), ...fixed.beta]);
}

/**
 * Starting points for restarts: the informed start first, then copies jittered by
 * `jitter`·(standard normal) so restarts explore nearby basins reproducibly.
 */
export function restartStarts(first: Float64Array, restarts: number, rng: Rng, jitter = 0.15): Float64Array[] {
  const starts = [first.slice()];
  for (let r = 1; r < restarts; r++) starts.push(first.map((v) => v + jitter * rng.normal() * Math.max(Math.abs(v), 0.1)));
  return starts;
}
