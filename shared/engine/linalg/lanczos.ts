/**
 * Lowest eigenvalue of a PauliSum by thick-restart Lanczos, matrix-free (applyPauliSum), up to
 * n = 20.
 *
 * Each cycle extends an orthonormal basis to `krylov` vectors, orthogonalising every new vector
 * against the whole basis (classical Gram–Schmidt with a second pass when the first removed most
 * of the norm, the DGKS test — so no spurious copies of eigenvalues appear). The projected matrix
 * T = Vᵀ H V is real symmetric (tridiagonal plus the arrow left by restarts); its eigenpairs come
 * from ml-matrix. The residual of the lowest Ritz pair is ‖H y − θ y‖ = |β·s_last|; when it is above
 * tol·max(1, |θ|) the cycle restarts from the `keep` lowest Ritz vectors plus the last Lanczos
 * vector (Wu & Simon's thick restart, SIAM J. Matrix Anal. Appl. 22 (2000) [memory]) — keeping
 * several Ritz vectors is what lets near-degenerate ground states (ordered spin chains) converge.
 * Real operators run on real vectors (half the memory). The start vector is seeded-random.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { createRng, type Rng } from '../random';
import { applyCompiledReal, applyPauliSum, compilePauliSum } from '../operators/pauli';
import type { PauliSum } from '../operators/types';

export const LANCZOS_MAX_QUBITS = 20;

export interface LanczosOptions {
  rng?: Rng;
  /** Relative residual tolerance (default 1e-9; the energy error is about residual²/gap). */
  tol?: number;
  /** Basis vectors per cycle (default: what fits in ~256 MiB, 12…60). */
  krylov?: number;
  /** Ritz vectors kept at a restart (default min(10, krylov/2)). */
  keep?: number;
  maxRestarts?: number;
}

export interface LanczosResult {
  energy: number;
  residual: number;
  matVecs: number;
  restarts: number;
  converged: boolean;
}

/** Vector arithmetic on either real (complex = false) or interleaved complex arrays. */
function makeOps(complex: boolean) {
  const dot = (a: Float64Array, b: Float64Array): [number, number] => {
    let re = 0, im = 0;
    if (!complex) {
      for (let i = 0; i < a.length; i++) re += a[i] * b[i];
      return [re, 0];
    }
    for (let i = 0; i < a.length; i += 2) {
      re += a[i] * b[i] + a[i + 1] * b[i + 1];
      im += a[i] * b[i + 1] - a[i + 1] * b[i];
    }
    return [re, im];
  };
  /** w −= (re + i·im)·v */
  const axpy = (w: Float64Array, v: Float64Array, re: number, im: number): void => {
    if (!complex) {
      for (let i = 0; i < w.length; i++) w[i] -= re * v[i];
      return;
    }
    for (let i = 0; i < w.length; i += 2) {
      const vr = v[i], vi = v[i + 1];
      w[i] -= re * vr - im * vi;
      w[i + 1] -= re * vi + im * vr;
    }
  };
  const norm = (a: Float64Array): number => {
    let t = 0;
    for (let i = 0; i < a.length; i++) t += a[i] * a[i];
    return Math.sqrt(t);
  };
  return { dot, axpy, norm };
}

export function lanczosLowest(p: PauliSum, opts: LanczosOptions = {}): LanczosResult {
  const n = p.numQubits;
  if (n > LANCZOS_MAX_QUBITS) throw new RangeError(`Lanczos here stops at ${LANCZOS_MAX_QUBITS} qubits (got ${n})`);
  const H = compilePauliSum(p);
  const complex = !H.real;
  const dim = 2 ** n, len = complex ? 2 * dim : dim;
  const apply = complex
    ? (x: Float64Array, y: Float64Array) => applyPauliSum(H, x, y)
    : (x: Float64Array, y: Float64Array) => applyCompiledReal(H, x, y);
  const { dot, axpy, norm } = makeOps(complex);
  const rng = opts.rng ?? createRng(1);
  const tol = opts.tol ?? 1e-9;
  const maxRestarts = opts.maxRestarts ?? 500;
  const fit = Math.floor(2 ** 28 / (8 * len));
  const m = Math.max(2, Math.min(dim, opts.krylov ?? Math.max(12, Math.min(60, fit))));
  const keep = Math.max(1, Math.min(m - 1, opts.keep ?? Math.min(10, Math.floor(m / 2))));

  // Basis V[0…m−1] (+ one spare), projected matrix T (m×m, row-major).
  const V: Float64Array[] = [];
  const start = new Float64Array(len);
  for (let i = 0; i < len; i++) start[i] = rng.normal();
  const s0 = norm(start);
  for (let i = 0; i < len; i++) start[i] /= s0;
  V.push(start);
  let T = new Float64Array(m * m);
  let filled = 0; // columns of T already known (the kept Ritz part after a restart)
  let matVecs = 0;
  let last = { energy: NaN, residual: Infinity };

  for (let restart = 0; restart <= maxRestarts; restart++) {
    let size = m;
    let beta = 0;
    let w = new Float64Array(len);
    for (let j = filled; j < m; j++) {
      apply(V[j], w);
      matVecs++;
      for (let pass = 0; pass < 2; pass++) {
        const before = norm(w);
        for (let i = 0; i <= j; i++) {
          const [re, im] = dot(V[i], w);
          axpy(w, V[i], re, im);
          if (pass === 0) T[i * m + j] = re;
          else T[i * m + j] += re;
        }
        if (norm(w) > 0.7 * before) break; // DGKS: one pass was enough
      }
      // Symmetrise: T's upper column j from the overlaps, mirror into row j.
      for (let i = 0; i < j; i++) T[j * m + i] = T[i * m + j];
      beta = norm(w);
      if (beta < 1e-13 * Math.max(1, Math.abs(T[j * m + j]))) {
        size = j + 1; // invariant subspace: T's eigenvalues are exact eigenvalues of H
        break;
      }
      for (let i = 0; i < len; i++) w[i] /= beta;
      if (j + 1 < m) T[(j + 1) * m + j] = T[j * m + j + 1] = beta;
      V[j + 1] = w;
      w = new Float64Array(len);
    }
    const Ts = new Matrix(size, size);
    for (let r = 0; r < size; r++) for (let c = 0; c < size; c++) Ts.set(r, c, T[r * m + c]);
    const eig = new EigenvalueDecomposition(Ts, { assumeSymmetric: true });
    const order = eig.realEigenvalues.map((v, i) => [v, i]).sort((a, b) => a[0] - b[0]).map((e) => e[1]);
    const Y = eig.eigenvectorMatrix;
    const theta = eig.realEigenvalues[order[0]];
    const residual = size < m ? 0 : Math.abs(beta * Y.get(size - 1, order[0]));
    last = { energy: theta, residual };
    if (residual <= tol * Math.max(1, Math.abs(theta))) {
      return { energy: theta, residual, matVecs, restarts: restart, converged: true };
    }
    // Thick restart: basis ← [Ritz vectors of the `keep` lowest values, last Lanczos vector].
    const ritz: Float64Array[] = [];
    const coupling: number[] = [];
    for (let k = 0; k < keep; k++) {
      const col = order[k];
      const u = new Float64Array(len);
      for (let i = 0; i < size; i++) {
        const c = Y.get(i, col);
        const v = V[i];
        for (let t = 0; t < len; t++) u[t] += c * v[t];
      }
      ritz.push(u);
      coupling.push(beta * Y.get(size - 1, col));
    }
    const next = V[size];
    V.length = 0;
    V.push(...ritz, next);
    T = new Float64Array(m * m);
    for (let k = 0; k < keep; k++) {
      T[k * m + k] = eig.realEigenvalues[order[k]];
      T[k * m + keep] = T[keep * m + k] = coupling[k];
    }
    filled = keep;
  }
  return { energy: last.energy, residual: last.residual, matVecs, restarts: maxRestarts, converged: false };
}

/** Ground energy (lowest eigenvalue); throws if Lanczos did not converge. */
export function groundEnergyLanczos(p: PauliSum, opts?: LanczosOptions): number {
  const r = lanczosLowest(p, opts);
  if (!r.converged) {
    throw new Error(`Lanczos did not converge after ${r.matVecs} products (residual ${r.residual.toExponential(2)}); raise maxRestarts or krylov`);
  }
  return r.energy;
}
