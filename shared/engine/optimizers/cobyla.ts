import { countedObjective, type Estimate, type MinimizeOptions, type MinimizeResult, type Objective, type OptimizerTracePoint, type StopReason } from './types';

export interface CobylaOptions extends MinimizeOptions {
  /** Initial trust-region radius (initial simplex edge). Default 0.5. */
  rhoBegin?: number;
  /** Final radius: the method stops when a step of this size no longer helps. Default 1e-6. */
  rhoEnd?: number;
}

/**
 * Derivative-free trust-region search with linear interpolation models, in the manner of
 * Powell's COBYLA ("A direct search optimization method that models the objective and
 * constraint functions by linear interpolation", in Advances in Optimization and Numerical
 * Analysis, Kluwer 1994), here without constraints: the n + 1 simplex vertices interpolate a
 * linear model, the step minimises it on the ball of radius ρ, the new point replaces the
 * vertex that best keeps the simplex volume, geometry steps repair a degenerate simplex
 * (Powell's tests: every edge ≤ 2.1ρ, every vertex ≥ 0.25ρ from its opposite face), and ρ is
 * halved when the model stops predicting progress. A simplified reading of the paper, not a
 * line-by-line port.
 */
export function minimizeCobyla(f: Objective, x0: ArrayLike<number>, opts: CobylaOptions = {}): MinimizeResult {
  const n = x0.length;
  const rhoEnd = opts.rhoEnd ?? 1e-6;
  let rho = Math.max(opts.rhoBegin ?? 0.5, rhoEnd);
  const maxIterations = opts.maxIterations ?? 500 * n;
  const maxEvaluations = opts.maxEvaluations ?? Infinity;
  const { evaluate, state } = countedObjective(f);
  const sim: Float64Array[] = [Float64Array.from(x0)];
  const val: Estimate[] = [evaluate(sim[0])];
  for (let i = 0; i < n; i++) {
    const v = sim[0].slice();
    v[i] += rho;
    sim.push(v);
    val.push(evaluate(v));
  }
  const trace: OptimizerTracePoint[] = [];
  let reason: StopReason = 'maxIterations';
  let iteration = 0;
  const edge = (k: number) => sim[k + 1].map((v, j) => v - sim[0][j]);
  const norm = (v: Float64Array) => Math.sqrt(v.reduce((s, x) => s + x * x, 0));

  while (iteration < maxIterations) {
    // Best vertex first.
    let best = 0;
    for (let i = 1; i <= n; i++) if (val[i].value < val[best].value) best = i;
    if (best !== 0) { [sim[0], sim[best]] = [sim[best], sim[0]]; [val[0], val[best]] = [val[best], val[0]]; }
    iteration++;
    trace.push({ iteration, energy: val[0].value, stdError: val[0].stdError, evaluations: state.evaluations });
    if (opts.onIteration?.(iteration, val[0].value, val[0].stdError, sim[0]) === false) { reason = 'stopped'; break; }
    if (state.evaluations >= maxEvaluations) { reason = 'maxEvaluations'; break; }
    if (opts.shouldStop?.()) { reason = 'stopped'; break; }

    const D = Array.from({ length: n }, (_, k) => edge(k)); // rows: edges from the best vertex
    const inv = invert(D); // columns: directions normal to the faces opposite each vertex
    const repair = inv ? geometryCheck(D, inv, rho, norm) : worstEdge(D, norm);
    if (repair >= 0) {
      // Geometry step: move the offending vertex to distance ρ along its face normal.
      const k = repair;
      const dir = inv ? column(inv, k) : unit(n, k);
      const g = inv ? modelGradient(inv, val) : null;
      const sign = g && dot(g, dir) > 0 ? -1 : 1;
      const scale = (sign * rho) / Math.max(norm(dir), 1e-300);
      const p = sim[0].map((v, j) => v + scale * dir[j]);
      sim[k + 1] = p;
      val[k + 1] = evaluate(p);
      continue;
    }
    const g = modelGradient(inv!, val);
    const gn = norm(g);
    if (!(gn > 1e-300)) {
      if (rho <= rhoEnd) { reason = 'converged'; break; }
      rho = Math.max(rho / 2, rhoEnd);
      continue;
    }
    const d = g.map((v) => (-rho * v) / gn);
    const trial = sim[0].map((v, j) => v + d[j]);
    const ft = evaluate(trial);
    const predicted = rho * gn, actual = val[0].value - ft.value;
    if (actual > 0) {
      // λ = D^{−T} d: replacing vertex k scales the simplex volume by |λ_k|; keep it largest.
      let k = 0, bestScale = -1;
      for (let c = 0; c < n; c++) {
        let lambda = 0;
        for (let j = 0; j < n; j++) lambda += inv![j][c] * d[j];
        if (Math.abs(lambda) > bestScale) { bestScale = Math.abs(lambda); k = c; }
      }
      sim[k + 1] = trial;
      val[k + 1] = ft;
      if (actual >= 0.1 * predicted) continue;
    }
    if (rho <= rhoEnd) { reason = 'converged'; break; }
    rho = Math.max(rho / 2, rhoEnd);
  }
  let best = 0;
  for (let i = 1; i <= n; i++) if (val[i].value < val[best].value) best = i;
  return { x: sim[best].slice(), fx: val[best].value, stdError: val[best].stdError, evaluations: state.evaluations, iterations: iteration, trace, reason };
}

/** ∇ of the interpolating linear model: D·g = f_i − f_0, so g = D^{−1}·Δf. */
function modelGradient(inv: number[][], val: Estimate[]): Float64Array {
  const n = inv.length;
  const g = new Float64Array(n);
  for (let j = 0; j < n; j++) for (let k = 0; k < n; k++) g[j] += inv[j][k] * (val[k + 1].value - val[0].value);
  return g;
}

/** Index of the vertex (0-based edge) that most violates Powell's geometry tests, or −1. */
function geometryCheck(D: Float64Array[], inv: number[][], rho: number, norm: (v: Float64Array) => number): number {
  const n = D.length;
  let worst = -1, worstScore = 1;
  for (let k = 0; k < n; k++) {
    const len = norm(D[k]) / (2.1 * rho); // > 1: edge too long
    const faceDistance = 1 / Math.max(norm(column(inv, k)), 1e-300);
    const flat = (0.25 * rho) / faceDistance; // > 1: vertex too close to its opposite face
    const score = Math.max(len, flat);
    if (score > worstScore) { worstScore = score; worst = k; }
  }
  return worst;
}

function worstEdge(D: Float64Array[], norm: (v: Float64Array) => number): number {
  let k = 0;
  for (let i = 1; i < D.length; i++) if (norm(D[i]) > norm(D[k])) k = i;
  return k;
}

const column = (m: number[][], k: number) => Float64Array.from(m, (row) => row[k]);
const dot = (a: Float64Array, b: Float64Array) => a.reduce((s, v, i) => s + v * b[i], 0);
const unit = (n: number, k: number) => { const e = new Float64Array(n); e[k] = 1; return e; };

/** Inverse by Gauss–Jordan with partial pivoting; null when (numerically) singular. */
function invert(rows: Float64Array[]): number[][] | null {
  const n = rows.length;
  const a = rows.map((r, i) => [...Array.from(r), ...Array.from({ length: n }, (_, j) => (i === j ? 1 : 0))]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(a[r][c]) > Math.abs(a[p][c])) p = r;
    if (Math.abs(a[p][c]) < 1e-14) return null;
    [a[c], a[p]] = [a[p], a[c]];
    const pivot = a[c][c];
    for (let j = 0; j < 2 * n; j++) a[c][j] /= pivot;
    for (let r = 0; r < n; r++) {
      if (r === c) continue;
      const factor = a[r][c];
      if (factor !== 0) for (let j = 0; j < 2 * n; j++) a[r][j] -= factor * a[c][j];
    }
  }
  return a.map((r) => r.slice(n));
}
