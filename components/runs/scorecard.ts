/**
 * The scorecard's figures, as a pure function of a run: per solver the value, the ratio to the
 * best proven bound, the gap, optimality, time, evaluations and shots, and which answer is best.
 * The sense comes from the question: max-cut wants the highest cut; bisection and k-way want the
 * lowest crossing weight among balanced answers (an unbalanced answer is shown, never best).
 */
import { better, bestOf, gapOfKind, tighter } from '../../shared/engine/problem/compare';
import { senseOf, type Sense } from '../../shared/engine/problem/types';
import { solverLabelOf } from './format';
import type { JobStatus, ScorableRun } from './types';

export interface ScoreRow {
  jobId: number;
  solver: string;
  label: string;
  status: JobStatus;
  value: number | null;
  /** Tightest proven bound over the whole run (same for every row). */
  bound: number | null;
  /** value/bound for max, bound/value for min: 1 is optimal, lower is worse. */
  ratio: number | null;
  /** Certified gap against the best bound (problem/compare.ts gap; null for an infeasible answer). */
  gap: number | null;
  provenOptimal: boolean;
  balanced: boolean;
  seconds: number | null;
  /** When the answer's value was first reached (older results: the whole time). */
  secondsToBest: number | null;
  evaluations: number | null;
  shots: number | null;
  isBest: boolean;
  error: string | null;
}

export interface Scorecard {
  sense: Sense;
  rows: ScoreRow[];
  bound: number | null;
  /** Job id of the first best row, or null when no job has a usable answer yet. */
  bestJobId: number | null;
}

/** The tightest proven bound: the lowest upper bound (max) or the highest lower bound (min). */
export function bestBound(run: ScorableRun): number | null {
  const sense = senseOf(run.problem.kind);
  const bounds: number[] = [];
  if (typeof run.bound === 'number' && Number.isFinite(run.bound)) bounds.push(run.bound);
  for (const job of run.jobs) {
    const r = job.status === 'succeeded' ? job.result : null;
    if (!r) continue;
    if (typeof r.bound === 'number' && Number.isFinite(r.bound)) bounds.push(r.bound);
    // A proven optimum bounds every other answer (only balanced ones count for min questions).
    if (r.provenOptimal && !r.infeasible) bounds.push(r.value);
  }
  if (bounds.length === 0) return null;
  return bounds.reduce((a, b) => (tighter(sense, b, a) ? b : a));
}

/**
 * A bound that says nothing: for a split, "the crossing weight is at least 0" holds for every
 * answer, so a ratio of 0 and a gap of 100 % against it would read as a bad answer rather than as
 * a missing proof. Such rows show no ratio or gap; the bound line says why.
 */
export const trivialBound = (sense: Sense, bound: number | null): boolean => sense === 'min' && bound !== null && bound <= 0;

/** Certified gap of a value to the bound as the screens show it: none against a trivial bound. */
export function gapToBound(kind: ScorableRun['problem']['kind'], value: number, bound: number | null): number | null {
  if (bound !== null && trivialBound(senseOf(kind), bound) && value > bound) return null;
  return gapOfKind(kind, value, bound);
}

/** Ratio of a value to the bound, oriented so that 1 is optimal for both senses. */
export function ratioToBound(sense: Sense, value: number, bound: number | null): number | null {
  if (bound === null || !Number.isFinite(bound)) return null;
  if (trivialBound(sense, bound) && value > bound) return null;
  if (sense === 'max') {
    if (bound <= 0) return value >= bound ? 1 : null;
    return value / bound;
  }
  if (value <= 0) return value <= bound ? 1 : null;
  return bound / value;
}

export function buildScorecard(run: ScorableRun, labels: Record<string, string> = {}): Scorecard {
  const kind = run.problem.kind;
  const sense = senseOf(kind);
  const bound = bestBound(run);
  const rows: ScoreRow[] = run.jobs.map((job) => {
    const r = job.status === 'succeeded' ? job.result : null;
    const balanced = !r?.infeasible;
    return {
      jobId: job.id,
      solver: job.solver,
      label: solverLabelOf(labels, job),
      status: job.status,
      value: r ? r.value : null,
      bound,
      ratio: r ? ratioToBound(sense, r.value, bound) : null,
      gap: r && !r.infeasible ? gapToBound(kind, r.value, bound) : null,
      provenOptimal: !!r?.provenOptimal,
      balanced,
      seconds: r ? r.seconds : null,
      secondsToBest: r ? (r.secondsToBest ?? r.seconds) : null,
      evaluations: r ? r.evaluations : null,
      shots: r ? r.shots : null,
      isBest: false,
      error: job.error,
    };
  });
  // problem/compare.ts decides; an answer that breaks the pins or the balance rule is shown, never best.
  const rank = (row: ScoreRow) => ({ value: row.value as number, feasible: row.balanced });
  const candidates = rows.filter((row) => row.value !== null && row.balanced);
  const top = bestOf(sense, candidates, rank);
  for (const row of candidates) if (top && !better(sense, rank(top), rank(row))) row.isBest = true;
  const bestJobId = top?.jobId ?? null;
  return { sense, rows, bound, bestJobId };
}
