import { countedObjective, type MinimizeOptions, type MinimizeResult, type Objective, type OptimizerTracePoint, type StopReason } from './types';

export interface AdamOptions extends MinimizeOptions {
  /** ∇f at x; each call may spend objective evaluations (parameter shift, finite differences). */
  gradient: (x: Float64Array) => Float64Array;
  /** Evaluations one gradient call costs (for the evaluation count). */
  evaluationsPerGradient?: number;
  learningRate?: number;
  beta1?: number;
  beta2?: number;
  epsilon?: number;
  /** Stop when the step's largest component falls below this. Default 1e-9. */
  stepTolerance?: number;
}

/**
 * Adam (Kingma & Ba, "Adam: a method for stochastic optimization", ICLR 2015) with bias-corrected
 * first and second moment estimates; defaults β₁ = 0.9, β₂ = 0.999, ε = 1e-8 from the paper.
 * The objective is evaluated once per iteration for the trace and the best point.
 */
export function minimizeAdam(f: Objective, x0: ArrayLike<number>, opts: AdamOptions): MinimizeResult {
  const n = x0.length;
  const maxIterations = opts.maxIterations ?? 500;
  const maxEvaluations = opts.maxEvaluations ?? Infinity;
  const lr = opts.learningRate ?? 0.05, b1 = opts.beta1 ?? 0.9, b2 = opts.beta2 ?? 0.999, eps = opts.epsilon ?? 1e-8;
  const perGradient = opts.evaluationsPerGradient ?? 2 * n;
  const { evaluate, state } = countedObjective(f);
  const x = Float64Array.from(x0);
  const m = new Float64Array(n), v = new Float64Array(n);
  const trace: OptimizerTracePoint[] = [];
  let reason: StopReason = 'maxIterations';
  let iteration = 0;
  let gradientEvaluations = 0;
  for (let t = 1; t <= maxIterations; t++) {
    if (state.evaluations + gradientEvaluations + perGradient + 1 > maxEvaluations) { reason = 'maxEvaluations'; break; }
    const e = evaluate(x.slice());
    const g = opts.gradient(x);
    gradientEvaluations += perGradient;
    let largest = 0;
    for (let j = 0; j < n; j++) {
      m[j] = b1 * m[j] + (1 - b1) * g[j];
      v[j] = b2 * v[j] + (1 - b2) * g[j] * g[j];
      const step = (lr * (m[j] / (1 - b1 ** t))) / (Math.sqrt(v[j] / (1 - b2 ** t)) + eps);
      x[j] -= step;
      largest = Math.max(largest, Math.abs(step));
    }
    iteration = t;
    trace.push({ iteration, energy: e.value, stdError: e.stdError, evaluations: state.evaluations + gradientEvaluations });
    if (opts.onIteration?.(iteration, e.value, e.stdError, x) === false) { reason = 'stopped'; break; }
    if (largest < (opts.stepTolerance ?? 1e-9)) { reason = 'converged'; break; }
    if (opts.shouldStop?.()) { reason = 'stopped'; break; } // checked after the step: one iteration always runs
  }
  evaluate(x.slice());
  return { x: state.bestX ?? x.slice(), fx: state.best.value, stdError: state.best.stdError, evaluations: state.evaluations + gradientEvaluations, iterations: iteration, trace, reason };
}
