/**
 * Lowest eigenvalue of a PauliSum by restarted Lanczos, matrix-free (applyPauliSum), up to
 * n = 20. Each cycle builds at most `krylov` vectors with full reorthogonalisation (two Gram–Schmidt
 * passes, so the basis stays orthonormal to round-off), takes the lowest Ritz pair of the small
 * tridiagonal matrix (ml-matrix), and restarts from that Ritz vector until the residual
 * ‖H y − θ y‖ = β_m |s_m| is below tol·max(1, |θ|). The start vector is seeded-random so runs
 * are reproducible and almost surely overlap the ground state.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { createRng, type Rng } from '../random';
import { applyPauliSum, compilePauliSum } from '../operators/pauli';
import type { PauliSum } from '../operators/types';

export const LANCZOS_MAX_QUBITS = 20;

export interface LanczosOptions {
  rng?: Rng;
  /** Relative residual tolerance (default 1e-9: energy error ≈ residual²/gap, far below 1e-8). */
  tol?: number;
  /** Krylov vectors per cycle (default: as many as fit in ~512 MiB, 8…60). */
  krylov?: number;
  maxRestarts?: number;
}

export interface LanczosResult {
  energy: number;
  residual: number;
  matVecs: number;
  restarts: number;
  converged: boolean;
}

function dot(a: Float64Array, b: Float64Array): [number, number] {
  let re = 0, im = 0;
  for (let i = 0; i < a.length; i += 2) {
    re += a[i] * b[i] + a[i + 1] * b[i + 1];
    im += a[i] * b[i + 1] - a[i + 1] * b[i];
  }
  return [re, im];
}
function norm(a: Float64Array): number {
  let t = 0;
  for (let i = 0; i < a.length; i++) t += a[i] * a[i];
  return Math.sqrt(t);
}
/** w −= (ov_re + i·ov_im)·v */
function subtract(w: Float64Array, v: Float64Array, ovRe: number, ovIm: number): void {
  for (let i = 0; i < w.length; i += 2) {
    const vr = v[i], vi = v[i + 1];
    w[i] -= ovRe * vr - ovIm * vi;
    w[i + 1] -= ovRe * vi + ovIm * vr;
  }
}

export function lanczosLowest(p: PauliSum, opts: LanczosOptions = {}): LanczosResult {
  const n = p.numQubits;
  if (n > LANCZOS_MAX_QUBITS) throw new RangeError(`Lanczos here stops at ${LANCZOS_MAX_QUBITS} qubits (got ${n})`);
  const H = compilePauliSum(p);
  const len = 2 * 2 ** n, dim = 2 ** n;
  const rng = opts.rng ?? createRng(1);
  const tol = opts.tol ?? 1e-9;
  const maxRestarts = opts.maxRestarts ?? 200;
  const fit = Math.floor(2 ** 29 / (8 * len));
  const m = Math.max(1, Math.min(dim, opts.krylov ?? Math.max(8, Math.min(60, fit))));
  const V: Float64Array[] = [];
  let start = new Float64Array(len);
  for (let i = 0; i < len; i++) start[i] = rng.normal();
  // Real operators keep real vectors real; start real so the Krylov space does too.
  if (H.real) for (let i = 1; i < len; i += 2) start[i] = 0;
  let matVecs = 0;
  let best = { energy: NaN, residual: Infinity };
  for (let restart = 0; restart <= maxRestarts; restart++) {
    const s0 = norm(start);
    for (let i = 0; i < len; i++) start[i] /= s0;
    V.length = 0;
    V.push(start);
    const alpha: number[] = [], beta: number[] = [];
    let w = new Float64Array(len);
    for (let j = 0; j < m; j++) {
      applyPauliSum(H, V[j], w);
      matVecs++;
      alpha.push(dot(V[j], w)[0]);
      for (let pass = 0; pass < 2; pass++) {
        for (let k = 0; k <= j; k++) {
          const [re, im] = dot(V[k], w);
          subtract(w, V[k], re, im);
        }
      }
      const b = norm(w);
      beta.push(b);
      if (j === m - 1 || b < 1e-13 * Math.max(1, Math.abs(alpha[j]))) break;
      for (let i = 0; i < len; i++) w[i] /= b;
      V.push(w);
      w = new Float64Array(len);
    }
    const k = alpha.length;
    const T = new Matrix(k, k);
    for (let i = 0; i < k; i++) {
      T.set(i, i, alpha[i]);
      if (i + 1 < k) {
        T.set(i, i + 1, beta[i]);
        T.set(i + 1, i, beta[i]);
      }
    }
    const eig = new EigenvalueDecomposition(T, { assumeSymmetric: true });
    const values = eig.realEigenvalues;
    let lo = 0;
    for (let i = 1; i < k; i++) if (values[i] < values[lo]) lo = i;
    const theta = values[lo];
    const y = eig.eigenvectorMatrix.getColumn(lo);
    const residual = Math.abs(beta[k - 1] * y[k - 1]);
    best = { energy: theta, residual };
    if (residual <= tol * Math.max(1, Math.abs(theta)) || k < m) {
      return { energy: theta, residual, matVecs, restarts: restart, converged: true };
    }
    const ritz = new Float64Array(len);
    for (let i = 0; i < k; i++) {
      const c = y[i], v = V[i];
      for (let t = 0; t < len; t++) ritz[t] += c * v[t];
    }
    start = ritz;
  }
  return { energy: best.energy, residual: best.residual, matVecs, restarts: maxRestarts, converged: false };
}

/** Ground energy (lowest eigenvalue); throws if Lanczos did not converge. */
export function groundEnergyLanczos(p: PauliSum, opts?: LanczosOptions): number {
  const r = lanczosLowest(p, opts);
  if (!r.converged) {
    throw new Error(`Lanczos did not converge after ${r.matVecs} products (residual ${r.residual.toExponential(2)}); raise maxRestarts or krylov`);
  }
  return r.energy;
}
