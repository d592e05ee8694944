import { countedObjective, type Estimate, type MinimizeOptions, type MinimizeResult, type Objective, type OptimizerTracePoint, type StopReason } from './types';

export interface NelderMeadOptions extends MinimizeOptions {
  /** Initial simplex edge per coordinate (angles: a fraction of a radian). Default 0.25. */
  step?: number | Float64Array;
  /** Stop when the simplex's value spread and edge length both fall below these. */
  fTolerance?: number;
  xTolerance?: number;
}

/**
 * Derivative-free downhill simplex (Nelder & Mead, Comput. J. 7:308 (1965)) with the
 * dimension-adaptive coefficients of Gao & Han, Comput. Optim. Appl. 51:259 (2012):
 * reflection 1, expansion 1 + 2/n, contraction 3/4 − 1/(2n), shrink 1 − 1/n — the classical
 * values stall in more than a few dimensions, which QAOA with p ≥ 3 already has.
 */
export function minimizeNelderMead(f: Objective, x0: ArrayLike<number>, opts: NelderMeadOptions = {}): MinimizeResult {
  const n = x0.length;
  const maxIterations = opts.maxIterations ?? 200 * n;
  const maxEvaluations = opts.maxEvaluations ?? Infinity;
  const fTol = opts.fTolerance ?? 1e-10, xTol = opts.xTolerance ?? 1e-8;
  const alpha = 1, beta = 1 + 2 / n, gamma = 0.75 - 1 / (2 * n), delta = 1 - 1 / n;
  const { evaluate, state } = countedObjective(f);
  const simplex: Float64Array[] = [];
  const values: Estimate[] = [];
  const start = Float64Array.from(x0);
  simplex.push(start);
  values.push(evaluate(start));
  for (let i = 0; i < n; i++) {
    const v = start.slice();
    const h = typeof opts.step === 'number' || opts.step === undefined ? (opts.step ?? 0.25) : opts.step[i];
    v[i] += h;
    simplex.push(v);
    values.push(evaluate(v));
  }
  const trace: OptimizerTracePoint[] = [];
  let iteration = 0;
  let reason: StopReason = 'maxIterations';
  const centroid = new Float64Array(n);
  const along = (t: number) => {
    // centroid + t·(centroid − worst)
    const worst = simplex[n];
    const p = new Float64Array(n);
    for (let j = 0; j < n; j++) p[j] = centroid[j] + t * (centroid[j] - worst[j]);
    return p;
  };
  while (iteration < maxIterations) {
    const order = values.map((_, i) => i).sort((a, b) => values[a].value - values[b].value);
    const s2 = order.map((i) => simplex[i]), v2 = order.map((i) => values[i]);
    for (let i = 0; i <= n; i++) { simplex[i] = s2[i]; values[i] = v2[i]; }
    iteration++;
    trace.push({ iteration, energy: values[0].value, stdError: values[0].stdError, evaluations: state.evaluations });
    if (opts.onIteration?.(iteration, values[0].value, values[0].stdError, simplex[0]) === false) { reason = 'stopped'; break; }
    let size = 0;
    for (let i = 1; i <= n; i++) for (let j = 0; j < n; j++) size = Math.max(size, Math.abs(simplex[i][j] - simplex[0][j]));
    if (values[n].value - values[0].value <= fTol && size <= xTol) { reason = 'converged'; break; }
    if (state.evaluations >= maxEvaluations) { reason = 'maxEvaluations'; break; }
    if (opts.shouldStop?.()) { reason = 'stopped'; break; }

    centroid.fill(0);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) centroid[j] += simplex[i][j] / n;
    const xr = along(alpha), fr = evaluate(xr);
    if (fr.value < values[0].value) {
      const xe = along(alpha * beta), fe = evaluate(xe);
      if (fe.value < fr.value) { simplex[n] = xe; values[n] = fe; } else { simplex[n] = xr; values[n] = fr; }
    } else if (fr.value < values[n - 1].value) {
      simplex[n] = xr; values[n] = fr;
    } else {
      const outside = fr.value < values[n].value;
      const xc = along(outside ? alpha * gamma : -gamma), fc = evaluate(xc);
      if (fc.value < (outside ? fr.value : values[n].value)) { simplex[n] = xc; values[n] = fc; }
      else {
        for (let i = 1; i <= n; i++) {
          for (let j = 0; j < n; j++) simplex[i][j] = simplex[0][j] + delta * (simplex[i][j] - simplex[0][j]);
          values[i] = evaluate(simplex[i]);
        }
      }
    }
  }
  let best = 0;
  for (let i = 1; i <= n; i++) if (values[i].value < values[best].value) best = i;
  return { x: simplex[best].slice(), fx: values[best].value, stdError: values[best].stdError, evaluations: state.evaluations, iterations: iteration, trace, reason };
}
