import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { CompactNetwork } from '../network/types';
import type { Rng } from '../random';

/**
 * Spectral pieces for bounds: the weighted Laplacian L = D − W as a sparse operator, a
 * Lanczos solver for its extreme eigenvalues, and a dense Cholesky test that certifies an
 * eigenvalue bound (λ·I − M ⪰ 0 ⇔ λmax(M) ≤ λ) so a Lanczos estimate can be trusted.
 */

/** out = (L + diag(shift))·x, L the weighted Laplacian (lane weights may be negative). */
export function laplacianApply(net: CompactNetwork, shift: Float64Array | null, x: Float64Array, out: Float64Array): void {
  const { n, adjStart, adjIndex, adjWeight } = net;
  for (let i = 0; i < n; i++) {
    let s = 0, deg = 0;
    for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
      deg += adjWeight[p];
      s += adjWeight[p] * x[adjIndex[p]];
    }
    out[i] = (deg + (shift ? shift[i] : 0)) * x[i] - s;
  }
}

export function denseLaplacian(net: CompactNetwork, shift: Float64Array | null): Matrix {
  const { n, m, laneFrom, laneTo, laneWeight } = net;
  const a = Matrix.zeros(n, n);
  for (let e = 0; e < m; e++) {
    const u = laneFrom[e], v = laneTo[e], w = laneWeight[e];
    a.set(u, v, a.get(u, v) - w);
    a.set(v, u, a.get(v, u) - w);
    a.set(u, u, a.get(u, u) + w);
    a.set(v, v, a.get(v, v) + w);
  }
  if (shift) for (let i = 0; i < n; i++) a.set(i, i, a.get(i, i) + shift[i]);
  return a;
}

/** Largest eigenvalue of a dense symmetric matrix (ml-matrix) and its eigenvector. */
export function denseTop(a: Matrix): { value: number; vector: Float64Array } {
  const eig = new EigenvalueDecomposition(a, { assumeSymmetric: true });
  const values = eig.realEigenvalues;
  let best = 0;
  for (let i = 1; i < values.length; i++) if (values[i] > values[best]) best = i;
  return { value: values[best], vector: Float64Array.from(eig.eigenvectorMatrix.getColumn(best)) };
}

/**
 * Largest eigenvalue of a symmetric operator by restarted Lanczos with full
 * re-orthogonalisation (common practice). `deflate`: keep iterates orthogonal to it (used to
 * work on 1⊥). Returns the Ritz value (a lower estimate of λmax), its vector and residual.
 */
export function lanczosTop(
  n: number,
  apply: (x: Float64Array, out: Float64Array) => void,
  rng: Rng,
  opts: { steps?: number; restarts?: number; tolerance?: number; start?: Float64Array | null; deflate?: Float64Array | null } = {},
): { value: number; vector: Float64Array; residual: number } {
  const steps = Math.min(n, opts.steps ?? 60);
  const restarts = opts.restarts ?? 4;
  const tol = opts.tolerance ?? 1e-9;
  const deflate = opts.deflate ?? null;
  const dot = (a: Float64Array, b: Float64Array): number => {
    let s = 0;
    for (let i = 0; i < n; i++) s += a[i] * b[i];
    return s;
  };
  const orthDeflate = (x: Float64Array): void => {
    if (!deflate) return;
    const c = dot(x, deflate) / dot(deflate, deflate);
    for (let i = 0; i < n; i++) x[i] -= c * deflate[i];
  };
  let start = new Float64Array(n);
  if (opts.start && opts.start.length === n) start.set(opts.start);
  else for (let i = 0; i < n; i++) start[i] = rng.normal();
  let value = -Infinity, residual = Infinity;
  const tmp = new Float64Array(n);
  for (let r = 0; r <= restarts; r++) {
    orthDeflate(start);
    let norm = Math.sqrt(dot(start, start));
    if (norm < 1e-300) { for (let i = 0; i < n; i++) start[i] = rng.normal(); orthDeflate(start); norm = Math.sqrt(dot(start, start)); }
    const Q: Float64Array[] = [];
    const alpha: number[] = [], beta: number[] = [];
    let q = start.map((x) => x / norm);
    for (let j = 0; j < steps; j++) {
      Q.push(q);
      apply(q, tmp);
      const w = Float64Array.from(tmp);
      const a = dot(w, q);
      alpha.push(a);
      // Full re-orthogonalisation (twice is enough, "twice is enough" rule — common practice).
      for (let pass = 0; pass < 2; pass++) for (const qi of Q) {
        const c = dot(w, qi);
        for (let i = 0; i < n; i++) w[i] -= c * qi[i];
      }
      orthDeflate(w);
      const b = Math.sqrt(dot(w, w));
      if (j === steps - 1 || b < 1e-12) break;
      beta.push(b);
      q = w.map((x) => x / b);
    }
    const k = alpha.length;
    const T = Matrix.zeros(k, k);
    for (let i = 0; i < k; i++) {
      T.set(i, i, alpha[i]);
      if (i + 1 < k) { T.set(i, i + 1, beta[i]); T.set(i + 1, i, beta[i]); }
    }
    const top = denseTop(T);
    const y = top.vector;
    const v = new Float64Array(n);
    for (let j = 0; j < k; j++) for (let i = 0; i < n; i++) v[i] += y[j] * Q[j][i];
    const vn = Math.sqrt(dot(v, v));
    for (let i = 0; i < n; i++) v[i] /= vn;
    apply(v, tmp);
    const rq = dot(v, tmp);
    let res = 0;
    for (let i = 0; i < n; i++) res += (tmp[i] - rq * v[i]) ** 2;
    value = rq;
    residual = Math.sqrt(res);
    start = v;
    if (residual <= tol * Math.max(1, Math.abs(rq)) || k < steps) break;
  }
  return { value, vector: start, residual };
}

/**
 * True when λ·I − A is positive definite (dense Cholesky), i.e. λmax(A) < λ. A failed
 * factorisation only means "not certified".
 */
export function certifiesUpper(a: Matrix, lambda: number): boolean {
  const n = a.rows;
  const L = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) L[i * n + j] = (i === j ? lambda : 0) - a.get(i, j);
  return choleskyInPlace(L, n);
}

/** Same test for λ·I − (L + diag(shift)), built straight from the lanes (no dense Matrix). */
export function certifiesLaplacianUpper(net: CompactNetwork, shift: Float64Array | null, lambda: number): boolean {
  const n = net.n;
  const L = new Float64Array(n * n);
  for (let i = 0; i < n; i++) L[i * n + i] = lambda - (shift ? shift[i] : 0);
  for (let e = 0; e < net.m; e++) {
    const u = net.laneFrom[e], v = net.laneTo[e], w = net.laneWeight[e];
    L[u * n + u] -= w;
    L[v * n + v] -= w;
    L[Math.max(u, v) * n + Math.min(u, v)] += w;
  }
  return choleskyInPlace(L, n);
}

/** Lower-triangular Cholesky in place; false when a pivot is not positive. */
function choleskyInPlace(L: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let d = L[j * n + j];
    for (let p = 0; p < j; p++) d -= L[j * n + p] * L[j * n + p];
    if (!(d > 0)) return false;
    const djj = Math.sqrt(d);
    L[j * n + j] = djj;
    for (let i = j + 1; i < n; i++) {
      let s = L[i * n + j];
      const ri = i * n, rj = j * n;
      for (let p = 0; p < j; p++) s -= L[ri + p] * L[rj + p];
      L[ri + j] = s / djj;
    }
  }
  return true;
}
