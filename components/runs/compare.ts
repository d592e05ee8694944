/**
 * The compare table as data: one column per run, one row per figure, with each run's best
 * answer from its own scorecard (so each run is judged by its own question's sense).
 */
import { buildScorecard } from './scorecard';
import type { RunDetail } from './types';

export interface CompareColumn {
  runId: number;
  question: RunDetail['problem'];
  network: string;
  versionId: number;
  solvers: { solver: string; value: number | null; ratio: number | null; gap: number | null; provenOptimal: boolean; seconds: number | null; settings: Record<string, unknown> }[];
  bestValue: number | null;
  bestSolver: string | null;
  bound: number | null;
}

export function compareColumns(runs: readonly RunDetail[], labels: Record<string, string> = {}): CompareColumn[] {
  return runs.map((run) => {
    const card = buildScorecard(run, labels);
    const best = card.rows.find((r) => r.jobId === card.bestJobId) ?? null;
    return {
      runId: run.id,
      question: run.problem,
      network: run.networkName ?? `network ${run.networkId}`,
      versionId: run.versionId,
      solvers: card.rows.map((row, i) => ({ solver: row.label, value: row.value, ratio: row.ratio, gap: row.gap, provenOptimal: row.provenOptimal, seconds: row.seconds, settings: run.jobs[i].settings ?? {} })),
      bestValue: best?.value ?? null,
      bestSolver: best?.label ?? null,
      bound: card.bound,
    };
  });
}

/** Same question (kind, k, tolerance, pins) on every run: values are then directly comparable. */
export function sameQuestion(runs: readonly RunDetail[]): boolean {
  const key = (r: RunDetail) => JSON.stringify([r.problem.kind, r.problem.k ?? null, r.problem.tolerance ?? 0, Object.entries(r.problem.pins ?? {}).sort()]);
  return runs.every((r) => key(r) === key(runs[0]));
}
