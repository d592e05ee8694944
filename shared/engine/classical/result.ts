import { crossingWeight, isBalanced, respectsPins } from '../problem/evaluate';
import { gapOfKind, meets } from '../problem/compare';
import { senseOf } from '../problem/types';
import type { Problem } from '../problem/types';
import type { SolveResult } from '../solvers/types';

export interface ClassicalOutcome {
  assignment: ArrayLike<number>;
  /** Bound the solver itself proved (upper for maxcut, lower for min kinds), or null. */
  bound?: number | null;
  provenOptimal?: boolean;
  seconds: number;
  evaluations: number;
  notes?: string[];
}

/**
 * The one way classical solvers build a SolveResult: the value is recomputed from the
 * assignment with the shared crossingWeight, balance and pins are checked, never trusted.
 */
export function classicalResult(problem: Problem, outcome: ClassicalOutcome): SolveResult {
  const assignment = Array.from(outcome.assignment, (x) => x | 0);
  const value = crossingWeight(problem, assignment);
  const bound = outcome.bound ?? null;
  const notes = [...(outcome.notes ?? [])];
  const infeasible = !isBalanced(problem, assignment);
  if (!respectsPins(problem, assignment)) notes.push('assignment breaks a pinned depot (solver error)');
  return {
    value,
    assignment,
    bound,
    gap: infeasible ? null : gapOfKind(problem.kind, value, bound),
    // Proven when the solver says so or when its own bound meets the recomputed value.
    provenOptimal: ((outcome.provenOptimal ?? false) || meets(senseOf(problem.kind), value, bound)) && !infeasible,
    energy: null,
    expectation: null,
    params: null,
    seconds: outcome.seconds,
    evaluations: outcome.evaluations,
    shots: 0,
    ...(infeasible ? { infeasible: true } : {}),
    ...(notes.length > 0 ? { notes } : {}),
  };
}


/** Indices of free (unpinned) depots, in input order. */
export function freeDepots(pins: Int32Array): Int32Array {
  let count = 0;
  for (let i = 0; i < pins.length; i++) if (pins[i] < 0) count++;
  const out = new Int32Array(count);
  for (let i = 0, j = 0; i < pins.length; i++) if (pins[i] < 0) out[j++] = i;
  return out;
}

/** True when every lane weight is a whole number (bounds may then be rounded). */
export function integerLanes(problem: Problem): boolean {
  const w = problem.network.laneWeight;
  for (let e = 0; e < w.length; e++) if (!Number.isInteger(w[e])) return false;
  return true;
}
