import type { Rng } from '../random';

/** A (possibly noisy) objective value: shot-based estimates carry their standard error. */
export interface Estimate {
  value: number;
  stdError: number;
}

/** Objective over a parameter vector; plain numbers mean exact values (stdError 0). */
export type Objective = (x: Float64Array) => number | Estimate;

export const asEstimate = (v: number | Estimate): Estimate => (typeof v === 'number' ? { value: v, stdError: 0 } : v);

export interface OptimizerTracePoint {
  iteration: number;
  /** Objective at the iterate reported for this iteration (best simplex vertex, SPSA iterate, …). */
  energy: number;
  stdError: number;
  evaluations: number;
}

export interface MinimizeOptions {
  maxIterations?: number;
  maxEvaluations?: number;
  /** Called once per iteration; return false to stop early. */
  onIteration?: (iteration: number, energy: number, stdError: number, params: Float64Array) => void | boolean;
  /** Cooperative stop (cancel token, time limit), checked between iterations. */
  shouldStop?: () => boolean;
  /** Needed by stochastic methods (SPSA perturbations); every draw comes from it. */
  rng?: Rng;
}

export type StopReason = 'converged' | 'maxIterations' | 'maxEvaluations' | 'stopped';

/** What every optimizer returns: best point found, its value, counts and the trace. */
export interface MinimizeResult {
  x: Float64Array;
  fx: number;
  stdError: number;
  evaluations: number;
  iterations: number;
  trace: OptimizerTracePoint[];
  reason: StopReason;
}

/** Counts evaluations and remembers the best point ever evaluated. */
export function countedObjective(f: Objective) {
  const state = { evaluations: 0, bestX: null as Float64Array | null, best: { value: Infinity, stdError: 0 } as Estimate };
  const evaluate = (x: Float64Array): Estimate => {
    state.evaluations++;
    const e = asEstimate(f(x));
    if (e.value < state.best.value) { state.best = e; state.bestX = x.slice(); }
    return e;
  };
  return { evaluate, state };
}
