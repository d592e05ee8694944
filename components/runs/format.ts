/** How run figures are written everywhere in the app (scorecard, compare, report, CSV-free views). */

const DASH = '—';

/** Cut or crossing weight: integers as they are, others to 4 significant digits. */
export function formatValue(value: number | null | undefined): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return DASH;
  if (Number.isInteger(value)) return value.toLocaleString('en-GB');
  return Number(value.toPrecision(6)).toLocaleString('en-GB', { maximumFractionDigits: 4 });
}

/** Ratio to the best bound, three decimals ("1.000", "0.953"). */
export function formatRatio(ratio: number | null | undefined): string {
  if (ratio === null || ratio === undefined || !Number.isFinite(ratio)) return DASH;
  return ratio.toFixed(3);
}

/** Gap as a percentage with one decimal ("0 %", "4.7 %", "< 0.1 %"). */
export function formatGap(gap: number | null | undefined): string {
  if (gap === null || gap === undefined || !Number.isFinite(gap)) return DASH;
  if (gap <= 0) return '0 %';
  if (gap < 0.0005) return '< 0.1 %';
  return `${(gap * 100).toFixed(1)} %`;
}

/** Seconds as "0.42 s", "12.3 s", "2 min 05 s". */
export function formatSeconds(seconds: number | null | undefined): string {
  if (seconds === null || seconds === undefined || !Number.isFinite(seconds)) return DASH;
  if (seconds < 10) return `${seconds.toFixed(2)} s`;
  if (seconds < 60) return `${seconds.toFixed(1)} s`;
  const m = Math.floor(seconds / 60);
  const s = Math.round(seconds - m * 60);
  return `${m} min ${String(s).padStart(2, '0')} s`;
}

export function formatCount(n: number | null | undefined): string {
  if (n === null || n === undefined || !Number.isFinite(n)) return DASH;
  return Math.round(n).toLocaleString('en-GB');
}

/** Shots are meaningful only for sampled (variational) answers; 0 reads as a dash. */
export function formatShots(n: number | null | undefined): string {
  return n ? formatCount(n) : DASH;
}

export function formatPercent(fraction: number): string {
  return `${Math.round(Math.max(0, Math.min(1, fraction)) * 100)} %`;
}

export const KIND_LABELS = {
  maxcut: 'Separate conflicting depots',
  bisection: 'Two balanced regions',
  kway: 'k regions',
} as const;

export const KIND_HINTS = {
  maxcut: 'Put depots joined by heavy lanes on opposite sides (max-cut: the most lane weight crosses).',
  bisection: 'Split the depots into two regions of about equal weight with as little lane weight crossing as possible.',
  kway: 'Split the depots into k regions of about equal weight with as little lane weight crossing as possible.',
} as const;

export function questionLabel(problem: { kind: keyof typeof KIND_LABELS; k?: number }): string {
  return problem.kind === 'kway' ? `${problem.k ?? 3} regions` : KIND_LABELS[problem.kind];
}

/**
 * Names of a solver's final parameters. QAOA stores [γ₁ … γ_p, β₁ … β_p]
 * (shared/engine/ansatz/qaoa.ts); other circuits use rotation angles θ₀, θ₁, ….
 */
export function parameterNames(solver: string, count: number): string[] {
  if (solver === 'qaoa' && count % 2 === 0) {
    const p = count / 2;
    return Array.from({ length: count }, (_, i) => (i < p ? `γ${i + 1}` : `β${i - p + 1}`));
  }
  return Array.from({ length: count }, (_, i) => `θ${i}`);
}

/** A job's solver by its label: the registry listing (useSolverLabels), else the label the run came with, else the code. */
export const solverLabelOf = (labels: Record<string, string>, job: { solver: string; label?: string }) => labels[job.solver] ?? job.label ?? job.solver;
