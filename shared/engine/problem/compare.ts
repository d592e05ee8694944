/**
 * "Which answer is better" — the one rule, used by the solvers, the orchestrator, the run
 * services (best job, downloads), the scorecard, the sample list and the histogram:
 *   1. a feasible answer (pins kept, balance rule met) beats an infeasible one;
 *   2. then the larger value for max-cut ('max'), the smaller crossing weight otherwise ('min').
 * `meets` says when a value reaches a proven bound, `gap` how far it is from it.
 * Pure functions on plain numbers, so the browser and the engine share them.
 */
import { senseOf, type ProblemKind, type Sense } from './types';

export type { Sense };
export { senseOf };

/** What the rule needs from an answer, a sample or a job result. */
export interface Ranked {
  value: number;
  feasible: boolean;
}

/** Relative tolerance for "equal" values and "the bound meets the value". */
export const VALUE_TOLERANCE = 1e-9;

const scale = (a: number, b: number) => Math.max(1, Math.abs(a), Math.abs(b));

/** |a − b| within the relative tolerance. */
export const sameValue = (a: number, b: number): boolean => Math.abs(a - b) <= VALUE_TOLERANCE * scale(a, b);

/** True when `a` is strictly better than `b` (feasibility first, then value in the problem's sense). */
export function better(sense: Sense, a: Ranked, b: Ranked): boolean {
  if (a.feasible !== b.feasible) return a.feasible;
  if (sameValue(a.value, b.value)) return false;
  return sense === 'max' ? a.value > b.value : a.value < b.value;
}

/** The best item by `better` (the earliest of equals), or null for an empty list. */
export function bestOf<T>(sense: Sense, items: readonly T[], rank: (item: T) => Ranked): T | null {
  let best: T | null = null;
  let bestRank: Ranked | null = null;
  for (const item of items) {
    const r = rank(item);
    if (bestRank === null || better(sense, r, bestRank)) {
      best = item;
      bestRank = r;
    }
  }
  return best;
}

/** True when `value` reaches the proven `bound` (within the tolerance): the answer is then optimal. */
export function meets(sense: Sense, value: number, bound: number | null | undefined): boolean {
  if (bound === null || bound === undefined || !Number.isFinite(bound)) return false;
  if (sameValue(value, bound)) return true;
  return sense === 'max' ? value >= bound : value <= bound;
}

/** True when a claimed bound is contradicted by a feasible value (the value lies beyond it). */
export function contradicts(sense: Sense, value: number, bound: number): boolean {
  return !sameValue(value, bound) && (sense === 'max' ? value > bound : value < bound);
}

/** The tighter of two bounds (smaller upper bound for 'max', larger lower bound for 'min'). */
export const tighter = (sense: Sense, a: number, b: number): boolean => (sense === 'max' ? a < b : a > b);

/**
 * Relative gap between a feasible value and a proven bound: (bound − value)/bound for 'max',
 * (value − bound)/value for 'min'; 0 when they meet. Null without a bound, for a bound the value
 * contradicts (then it was no bound) and where the ratio is undefined (denominator ≤ 0 and apart).
 */
export function gap(sense: Sense, value: number, bound: number | null | undefined): number | null {
  if (bound === null || bound === undefined || !Number.isFinite(bound)) return null;
  if (sameValue(value, bound)) return 0;
  if (contradicts(sense, value, bound)) return null;
  const denominator = sense === 'max' ? bound : value;
  if (denominator <= 0) return null;
  return Math.abs(bound - value) / denominator;
}

/** gap() by problem kind (what the result types carry). */
export const gapOfKind = (kind: ProblemKind, value: number, bound: number | null | undefined): number | null => gap(senseOf(kind), value, bound);
