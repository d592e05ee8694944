import { applyDiagonalPhase, applyProductLayer, applyQaoaLayer, type DiagonalLevels, ryMatrix, rzMatrix } from '../statevector/gates';
import type { StateOptions } from '../statevector/state';
import { resetToPlus, resetToZero } from './reset';
import type { Ansatz } from './types';

export interface QaoaAnsatzOptions {
  numQubits: number;
  layers: number;
  /**
   * Diagonal of the ENERGY operator H (the encoding's operator, ground state = best answer),
   * 2ⁿ values, or its DiagonalLevels. Built once per run and reused by every evaluation.
   */
  energyDiagonal: Float64Array | DiagonalLevels;
  /** Warm start (Egger et al. 2021): probability c_q that qubit q reads 1, per qubit. */
  warmStart?: { probabilities: ArrayLike<number>; epsilon?: number };
  stateOptions?: StateOptions;
}

/**
 * QAOA with p layers. Convention (used everywhere in the engine):
 *   |γ,β⟩ = Π_(ℓ=1…p) e^{−iβ_ℓ B} e^{−iγ_ℓ C} |+⟩ⁿ,   B = Σ_j X_j,   C = −H,
 * so for max-cut C = Σ w(1 − Z_u Z_v)/2 is the cut-value operator (Farhi, Goldstone, Gutmann,
 * arXiv:1411.4028 (2014); the convention of references.md) and maximising ⟨C⟩ is minimising ⟨H⟩.
 * e^{−iγC} = e^{+iγH} is applied as the diagonal phase of H with angle −γ.
 * Parameters: [γ_1 … γ_p, β_1 … β_p].
 *
 * Warm start (Egger, Mareček, Woerner, "Warm-starting quantum optimization", Quantum 5, 479
 * (2021); details from memory): initial state ⊗ R_Y(θ_q)|0⟩ with θ_q = 2·arcsin√c_q, c_q
 * clipped into [ε, 1 − ε], and mixer per qubit R_Y(θ_q) R_Z(2β) R_Y(−θ_q) = e^{−iβ M_q} with
 * M_q = R_Y(θ_q) Z R_Y(−θ_q), whose +1 eigenstate is the initial state. (The paper writes
 * R_Z(−2β) in its own sign convention; with c_q = ½ ours reduces exactly to standard QAOA.)
 */
export function createQaoaAnsatz(opts: QaoaAnsatzOptions): Ansatz {
  const { numQubits: n, layers: p, energyDiagonal } = opts;
  const names = [...Array.from({ length: p }, (_, l) => `γ${l + 1}`), ...Array.from({ length: p }, (_, l) => `β${l + 1}`)];
  let theta: Float64Array | null = null;
  let initial: Float64Array | null = null;
  if (opts.warmStart) {
    const eps = opts.warmStart.epsilon ?? 0.25;
    theta = new Float64Array(n);
    initial = new Float64Array(8 * n);
    for (let q = 0; q < n; q++) {
      const c = Math.min(1 - eps, Math.max(eps, opts.warmStart.probabilities[q]));
      theta[q] = 2 * Math.asin(Math.sqrt(c));
      initial.set(ryMatrix(theta[q]), 8 * q);
    }
  }
  const mixerMats = new Float64Array(8 * n);
  return {
    name: opts.warmStart ? 'qaoa-warm' : 'qaoa',
    numQubits: n,
    numParams: 2 * p,
    paramNames: names,
    gradientRule: names.map(() => 'difference' as const),
    prepare(params, into) {
      if (!theta || !initial) {
        const s = resetToPlus(n, into, opts.stateOptions);
        // Injected kernels (e.g. WebAssembly) when they hold this state; the JS kernels otherwise.
        const fast = opts.stateOptions?.kernels;
        for (let l = 0; l < p; l++) {
          if (!fast?.applyQaoaLayer(s, energyDiagonal, -params[l], params[p + l])) applyQaoaLayer(s, energyDiagonal, -params[l], params[p + l]);
        }
        return s;
      }
      const s = resetToZero(n, into, opts.stateOptions);
      applyProductLayer(s, initial);
      for (let l = 0; l < p; l++) {
        applyDiagonalPhase(s, energyDiagonal, -params[l]);
        const rz = rzMatrix(2 * params[p + l]);
        for (let q = 0; q < n; q++) mixerMats.set(product3(ryMatrix(theta[q]), rz, ryMatrix(-theta[q])), 8 * q);
        applyProductLayer(s, mixerMats);
      }
      return s;
    },
  };
}

/** a·b·c for 2×2 complex matrices (row-major interleaved). */
function product3(a: Float64Array, b: Float64Array, c: Float64Array): Float64Array {
  return mul(mul(a, b), c);
}
function mul(a: Float64Array, b: Float64Array): Float64Array {
  const out = new Float64Array(8);
  for (let r = 0; r < 2; r++) {
    for (let col = 0; col < 2; col++) {
      let re = 0, im = 0;
      for (let k = 0; k < 2; k++) {
        const ar = a[4 * r + 2 * k], ai = a[4 * r + 2 * k + 1], br = b[4 * k + 2 * col], bi = b[4 * k + 2 * col + 1];
        re += ar * br - ai * bi;
        im += ar * bi + ai * br;
      }
      out[4 * r + 2 * col] = re;
      out[4 * r + 2 * col + 1] = im;
    }
  }
  return out;
}
