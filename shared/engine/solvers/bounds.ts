/** The proven bound attached by the orchestrator to every run (see classical/bounds.ts for the sources). */
import { computeBounds as computeClassicalBounds, type BoundOptions, type BoundReport } from '../classical/bounds';
import type { Problem } from '../problem/types';

export type { BoundOptions, BoundReport } from '../classical/bounds';

export function computeBounds(problem: Problem, opts: BoundOptions = {}): BoundReport {
  return computeClassicalBounds(problem, { denseLimit: 1500, ...opts });
}
