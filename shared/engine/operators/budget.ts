/**
 * Shots needed for a target standard error ε of the energy (references.md "Shot noise";
 * allocation usually credited to Wecker, Hastings, Troyer, Phys. Rev. A 92, 042303 (2015)):
 *   Var(Ê) = Σ_g Var(H_g)/s_g.
 * Uniform: s_g = s for all g  ⇒  s = Σ_g Var(H_g)/ε², total G·s.
 * Weighted: s_g ∝ √Var(H_g)   ⇒  s_g = √Var(H_g)·(Σ_h √Var(H_h))/ε², total (Σ_g √Var(H_g))²/ε²,
 * never more than uniform (Cauchy–Schwarz). Without a state the variances are replaced by the
 * state-independent bound Var(H_g) ≤ (Σ_{k∈g}|c_k|)² (Popoviciu: the group's readings lie in
 * [−Σ|c_k|, Σ|c_k|]). Every group gets at least MIN_SHOTS (the estimator needs a sample variance).
 */
import type { StateVector } from '../statevector/state';
import { groupQubitWise, type QubitWiseGroups } from './grouping';
import { rotateToBasis, supportMask } from './estimate';
import { parity } from './pauli';
import type { PauliSum } from './types';

export const MIN_SHOTS = 2;

export interface ShotBudget {
  uniform: { perGroup: number; total: number };
  weighted: { perGroup: number[]; total: number };
  groups: number;
  /** Per group: the variance used (exact for the state, or the bound). */
  variances: number[];
  rule: string;
}

/** Exact Var_ψ(H_g) of one group's weighted sum: rotate into its basis, read the distribution. */
export function groupVariance(s: StateVector, p: PauliSum, members: number[], basis: string): number {
  const rotated = rotateToBasis(s, basis);
  const a = rotated.amps, dim = a.length >> 1;
  const masks = members.map((k) => supportMask(p.terms[k].letters));
  const coeffs = members.map((k) => p.terms[k].coeff);
  let m1 = 0, m2 = 0;
  for (let x = 0; x < dim; x++) {
    const prob = a[2 * x] * a[2 * x] + a[2 * x + 1] * a[2 * x + 1];
    if (prob === 0) continue;
    let v = 0;
    for (let j = 0; j < masks.length; j++) v += parity(x & masks[j]) ? -coeffs[j] : coeffs[j];
    m1 += prob * v;
    m2 += prob * v * v;
  }
  return Math.max(0, m2 - m1 * m1);
}

export function planShotBudget(
  p: PauliSum,
  targetStdError: number,
  opts?: { state?: StateVector; grouping?: QubitWiseGroups },
): ShotBudget {
  if (!(targetStdError > 0) || !Number.isFinite(targetStdError)) {
    throw new RangeError(`target standard error must be a positive number, got ${targetStdError}`);
  }
  const grouping = opts?.grouping ?? groupQubitWise(p);
  const G = grouping.groups.length;
  const state = opts?.state;
  const variances = grouping.groups.map((members, g) => {
    if (state) return groupVariance(state, p, members, grouping.basis[g]);
    let s = 0;
    for (const k of members) s += Math.abs(p.terms[k].coeff);
    return s * s;
  });
  const eps2 = targetStdError * targetStdError;
  let sumVar = 0, sumSd = 0;
  for (const v of variances) {
    sumVar += v;
    sumSd += Math.sqrt(v);
  }
  const perGroup = Math.max(MIN_SHOTS, Math.ceil(sumVar / eps2 - 1e-9));
  const uniform = { perGroup, total: perGroup * G };
  let weightedPer = variances.map((v) => Math.max(MIN_SHOTS, Math.ceil((Math.sqrt(v) * sumSd) / eps2 - 1e-9)));
  let weightedTotal = weightedPer.reduce((t, s) => t + s, 0);
  // Rounding up each group can cost up to one shot per group; never plan more than uniform.
  if (weightedTotal > uniform.total) {
    weightedPer = variances.map(() => perGroup);
    weightedTotal = uniform.total;
  }
  const source = state ? 'exact group variances of the given state' : 'the state-independent bound Var(H_g) ≤ (Σ_{k∈g}|c_k|)²';
  return {
    uniform,
    weighted: { perGroup: weightedPer, total: weightedTotal },
    groups: G,
    variances,
    rule: `Var(Ê) = Σ_g Var(H_g)/s_g over ${G} qubit-wise commuting group(s), with ${source}; uniform s = ΣVar/ε², weighted s_g ∝ √Var(H_g) (total (Σ√Var)²/ε²), at least ${MIN_SHOTS} shots per group`,
  };
}
