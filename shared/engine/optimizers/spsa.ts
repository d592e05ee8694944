import { countedObjective, type MinimizeOptions, type MinimizeResult, type Objective, type OptimizerTracePoint, type StopReason } from './types';

export interface SpsaOptions extends MinimizeOptions {
  /** Gain numerators; `a` defaults to the calibrated value (see below). */
  a?: number;
  c?: number;
  /** Stability constant A; Spall 1998 suggests ~10 % of the iterations. */
  stability?: number;
  alpha?: number;
  gamma?: number;
  /** Wanted size of the first parameter step, used to calibrate a. Default 0.2. */
  firstStep?: number;
  /** Gradient samples used for calibration. Default 10. */
  calibrationSamples?: number;
}

/**
 * Simultaneous perturbation stochastic approximation (Spall, IEEE TAC 37:332 (1992);
 * "Implementation of the simultaneous perturbation algorithm", Johns Hopkins APL Tech. Dig.
 * 19:482 (1998)): two evaluations per iteration whatever the dimension, robust to shot noise.
 * Gains a_k = a/(k + 1 + A)^0.602, c_k = c/(k + 1)^0.101. Calibration (Spall 1998): a is set
 * so that the first step moves parameters by about `firstStep`, from the mean magnitude of a
 * few gradient estimates at x0. Returns the best evaluated point (the iterate is noisy).
 */
export function minimizeSpsa(f: Objective, x0: ArrayLike<number>, opts: SpsaOptions = {}): MinimizeResult {
  const rng = opts.rng;
  if (!rng) throw new Error('SPSA needs opts.rng (a seeded generator from shared/engine/random.ts) for its perturbations');
  const n = x0.length;
  const maxIterations = opts.maxIterations ?? 300;
  const maxEvaluations = opts.maxEvaluations ?? Infinity;
  const alpha = opts.alpha ?? 0.602, gamma = opts.gamma ?? 0.101;
  const A = opts.stability ?? 0.1 * maxIterations;
  const c = opts.c ?? 0.1;
  const { evaluate, state } = countedObjective(f);
  const x = Float64Array.from(x0);
  const delta = new Float64Array(n);
  const plus = new Float64Array(n), minus = new Float64Array(n);

  const gradientMagnitude = (ck: number): number => {
    for (let j = 0; j < n; j++) {
      delta[j] = rng.next() < 0.5 ? -1 : 1;
      plus[j] = x[j] + ck * delta[j];
      minus[j] = x[j] - ck * delta[j];
    }
    const diff = evaluate(plus).value - evaluate(minus).value;
    return diff / (2 * ck);
  };

  let a = opts.a;
  if (a === undefined) {
    const samples = opts.calibrationSamples ?? 10;
    let mean = 0;
    for (let s = 0; s < samples; s++) mean += Math.abs(gradientMagnitude(c)) / samples;
    a = ((opts.firstStep ?? 0.2) * (A + 1) ** alpha) / Math.max(mean, 1e-12);
  }

  const trace: OptimizerTracePoint[] = [];
  let reason: StopReason = 'maxIterations';
  let iteration = 0;
  for (let k = 0; k < maxIterations; k++) {
    if (state.evaluations + 2 > maxEvaluations) { reason = 'maxEvaluations'; break; }
    const ak = a / (k + 1 + A) ** alpha;
    const ck = c / (k + 1) ** gamma;
    const g = gradientMagnitude(ck); // the gradient estimate is g·Δ_j / ... with Δ_j = ±1: g/Δ_j = g·Δ_j
    for (let j = 0; j < n; j++) x[j] -= ak * g * delta[j];
    iteration = k + 1;
    const best = state.best;
    trace.push({ iteration, energy: best.value, stdError: best.stdError, evaluations: state.evaluations });
    if (opts.onIteration?.(iteration, best.value, best.stdError, x) === false) { reason = 'stopped'; break; }
    if (opts.shouldStop?.()) { reason = 'stopped'; break; } // checked after the step: one iteration always runs
  }
  // One look at the final iterate too: on smooth objectives it is usually the best point.
  evaluate(x.slice());
  const bestX = state.bestX ?? x.slice();
  return { x: bestX, fx: state.best.value, stdError: state.best.stdError, evaluations: state.evaluations, iterations: iteration, trace, reason };
}
