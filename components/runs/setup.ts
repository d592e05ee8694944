/**
 * The run-setup form's rules as pure functions: pins cycle on tap, what the create/preview body
 * looks like, and which advanced settings go to which solver. Kept out of the component so the
 * rules are testable and the component stays a layout.
 */
import type { ProblemKind } from '../../shared/engine/problem/types';
import type { CreateRunBody, RunProblem, SolverEntry } from './types';

export interface SetupState {
  kind: ProblemKind;
  k: number;
  /** Balance tolerance in percent of total depot weight, as typed. */
  tolerancePercent: string;
  pins: Record<string, number>;
  /** Chosen solvers; null = still the size-based defaults. */
  solvers: string[] | null;
  advanced: AdvancedSettings | null;
  /** Target standard error of the energy for the shot estimate, as typed ('' = the default 1 %). */
  precision: string;
}

export interface AdvancedSettings {
  layers: string;
  ansatz: 'ladder' | 'alternating';
  optimizer: string;
  shots: string;
  seed: string;
  timeLimitSeconds: string;
  /** Add the noise comparison to QAOA/VQE results (the solvers' `noise` setting; docs/runs.md, "Noise"). */
  noise: boolean;
}

export const DEFAULT_ADVANCED: AdvancedSettings = { layers: '2', ansatz: 'ladder', optimizer: 'auto', shots: '0', seed: '', timeLimitSeconds: '10', noise: false };

export const initialSetup = (): SetupState => ({ kind: 'maxcut', k: 3, tolerancePercent: '5', pins: {}, solvers: null, advanced: null, precision: '' });

/** Parts a depot can be pinned to for this question. */
export const partsOf = (kind: ProblemKind, k: number) => (kind === 'kway' ? k : 2);

/** Tap cycle: free → part 0 → part 1 → … → free. */
export function cyclePin(pins: Record<string, number>, depotId: string, parts: number): Record<string, number> {
  const next = { ...pins };
  const now = pins[depotId];
  if (now === undefined) next[depotId] = 0;
  else if (now + 1 < parts) next[depotId] = now + 1;
  else delete next[depotId];
  return next;
}

/** Drop pins that point past the last region (after k was lowered). */
export function prunePins(pins: Record<string, number>, parts: number): Record<string, number> {
  return Object.fromEntries(Object.entries(pins).filter(([, p]) => p < parts));
}

export function problemOf(s: SetupState): RunProblem {
  const parts = partsOf(s.kind, s.k);
  const pins = prunePins(s.pins, parts);
  const problem: RunProblem = { kind: s.kind };
  if (s.kind === 'kway') problem.k = s.k;
  if (s.kind !== 'maxcut') {
    const t = Number(s.tolerancePercent);
    problem.tolerance = Number.isFinite(t) && t >= 0 ? t / 100 : 0;
  }
  if (Object.keys(pins).length > 0) problem.pins = pins;
  return problem;
}

// Text that is not a number is left out of the body (setup-words.ts marks the field instead).
const num = (text: string) => (text.trim() === '' || !Number.isFinite(Number(text)) ? undefined : Number(text));

/** Settings per solver from the advanced panel: only variational solvers take layers/shots/optimizer. */
export function solverEntries(names: readonly string[], families: Record<string, string>, adv: AdvancedSettings | null): SolverEntry[] {
  return names.map((solver) => {
    if (!adv || families[solver] !== 'variational') return { solver };
    const settings: Record<string, unknown> = {};
    const layers = num(adv.layers);
    const shots = num(adv.shots);
    if (layers !== undefined && layers !== 2) settings.layers = layers;
    if (shots !== undefined && shots !== 0) settings.shots = shots;
    if (adv.optimizer !== 'auto') settings.optimizer = adv.optimizer;
    if (solver === 'vqe' && adv.ansatz !== 'ladder') settings.ansatz = adv.ansatz;
    if (adv.noise) settings.noise = true;
    return Object.keys(settings).length ? { solver, settings } : { solver };
  });
}

export function createBody(versionId: number, s: SetupState, names: readonly string[], families: Record<string, string>): CreateRunBody {
  const body: CreateRunBody = { versionId, problem: problemOf(s), solvers: solverEntries(names, families, s.advanced) };
  if (s.advanced) {
    const seed = num(s.advanced.seed);
    const limit = num(s.advanced.timeLimitSeconds);
    if (seed !== undefined) body.seed = seed;
    if (limit !== undefined && limit !== 10) body.timeLimitSeconds = limit;
  }
  return body;
}

/**
 * Every reason the run would not start, from the server's preview for exactly this body (its
 * blockers: settings, solver refusals, the role's rights, the plan's size rule), plus chosen solvers
 * the preview says refuse. Empty = Start may be pressed. While the preview for this body is not
 * there yet (loading, or still the previous body's), `pending` is true and Start stays disabled.
 */
export function startBlockers(
  preview: { blockers?: string[]; solvers: readonly { solver: string; label?: string; refusal?: string | null; allowed?: boolean }[] } | undefined,
  chosen: readonly string[],
  current: boolean,
): { pending: boolean; reasons: string[] } {
  if (chosen.length === 0) return { pending: false, reasons: ['Choose at least one solver.'] };
  if (!preview || !current) return { pending: true, reasons: [] };
  const reasons = [...(preview.blockers ?? [])];
  for (const s of preview.solvers) {
    if (!chosen.includes(s.solver)) continue;
    const said = `${s.solver} refuses this problem: ${s.refusal}`;
    if (s.refusal && !reasons.some((r) => r.includes(said))) reasons.push(said);
    if (s.allowed === false && !reasons.some((r) => r.includes('runs:advanced'))) reasons.push(`${s.label ?? s.solver}: changed settings need the analyst role (runs:advanced).`);
  }
  return { pending: false, reasons };
}

/**
 * Labels of the chosen solvers the preview says will not run. The API refuses the whole run when
 * any chosen solver refuses, so the start button names them instead of offering a run that fails.
 */
export function refusedChosen(solvers: readonly { solver: string; label?: string; refusal?: string | null }[], chosen: readonly string[]): string[] {
  return solvers.filter((x) => x.refusal && chosen.includes(x.solver)).map((x) => x.label ?? x.solver);
}
