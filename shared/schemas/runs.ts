import { DEPOT_ID_MAX } from '../engine/network/limits';
import type { CircuitSpec } from '../engine/circuits/of-run';
import type { NoiseReport, RunDeviceTime } from '../engine/circuits/run-analysis';
import type { CircuitSummary } from '../engine/circuits/summary';
import type { DecompositionReport } from '../engine/solvers/types';
import type { RqaoaRoundEntry } from '../engine/variational/rqaoa-log';
import { z } from 'zod';
import { MAX_REGIONS } from '../engine/problem/limits';

/**
 * Shapes of the runs API (solve service), shared by the server (validation) and the app.
 * A run = one immutable network version + one problem + a list of solver entries; each entry is
 * one job on the queue. Result field names match `spinyard solve --json`.
 */

export const JOB_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export type JobStatus = (typeof JOB_STATUSES)[number];

/**
 * Run status, derived from its jobs (see deriveRunStatus); `awaiting_payment` is a run created
 * held (billing) whose jobs are not on the queue yet; `partial` = some jobs succeeded, others
 * failed or were cancelled.
 */
export const RUN_STATUSES = ['awaiting_payment', 'queued', 'running', 'succeeded', 'partial', 'failed', 'cancelled'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export const FINISHED_JOB_STATUSES: readonly JobStatus[] = ['succeeded', 'failed', 'cancelled'];

/** The one rule from job statuses to the run's status. */
export function deriveRunStatus(jobs: readonly JobStatus[], held: boolean): RunStatus {
  if (held) return 'awaiting_payment';
  if (jobs.includes('running')) return 'running';
  if (jobs.includes('queued')) return 'queued';
  if (jobs.length > 0 && jobs.every((s) => s === 'succeeded')) return 'succeeded';
  if (jobs.includes('succeeded')) return 'partial';
  if (jobs.includes('failed')) return 'failed';
  return 'cancelled';
}

/**
 * How long a run has taken (or took), in seconds: from its release to the queue — at creation,
 * at payment for a paid run, at a retry — to its end or `now`. Time spent waiting for payment is
 * not the run's time; null while it waits. (Rows from before `releasedAt` existed count from
 * creation.) Never negative: browser and server clocks differ a little.
 */
export function runSeconds(
  run: { status: RunStatus; createdAt: string | Date; releasedAt: string | Date | null; finishedAt: string | Date | null },
  now: number,
): number | null {
  if (run.status === 'awaiting_payment') return null;
  const ms = (d: string | Date) => (typeof d === 'string' ? Date.parse(d) : d.getTime());
  const from = ms(run.releasedAt ?? run.createdAt);
  const to = run.finishedAt ? ms(run.finishedAt) : now;
  return Math.max(0, (to - from) / 1000);
}

export const MAX_SOLVERS_PER_RUN = 8;

export const ProblemInputSchema = z.object({
  kind: z.enum(['maxcut', 'bisection', 'kway'], { error: 'choose maxcut, bisection or kway' }),
  k: z.number().int('k must be a whole number').min(2).max(MAX_REGIONS, `k may be at most ${MAX_REGIONS} regions`).optional(),
  /** Depot id → side (0/1) or region (0…k−1). */
  pins: z.record(z.string().min(1).max(DEPOT_ID_MAX), z.number().int('a pin is a side or region number').min(0).max(MAX_REGIONS - 1)).optional(),
  tolerance: z.number().min(0, 'tolerance must be ≥ 0').lt(1, 'tolerance must be below 1 (a share of total depot weight)').optional(),
});
export type ProblemInput = z.infer<typeof ProblemInputSchema>;

export const SolverEntrySchema = z.object({
  solver: z.string().trim().min(1, 'name a solver').max(40),
  settings: z.record(z.string(), z.unknown()).optional(),
});
export type SolverEntry = z.infer<typeof SolverEntrySchema>;

export const CreateRunBodySchema = z.object({
  versionId: z.number({ error: 'give the network version id (a number)' }).int().positive(),
  problem: ProblemInputSchema,
  solvers: z.array(SolverEntrySchema).min(1, 'choose at least one solver').max(MAX_SOLVERS_PER_RUN, `a run holds at most ${MAX_SOLVERS_PER_RUN} solvers`),
  /** Seconds each solver may spend (the plan caps it); default 10. */
  timeLimitSeconds: z.number().positive('the time limit must be positive').max(3600).optional(),
  seed: z.number().int().min(0).max(2 ** 31 - 1).optional(),
});
export type CreateRunBody = z.infer<typeof CreateRunBodySchema>;

export const PreviewBodySchema = CreateRunBodySchema.extend({
  /** Target standard error of the energy estimate for the shot budget. */
  precision: z.number().positive().optional(),
});
export type PreviewBody = z.infer<typeof PreviewBodySchema>;

export const RunListQuerySchema = z.object({
  networkId: z.coerce.number().int().positive().optional(),
  status: z.enum(RUN_STATUSES).optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
});
export type RunListQuery = z.infer<typeof RunListQuerySchema>;

export const RunIdParamsSchema = z.object({ id: z.coerce.number().int().positive() });

/** Live progress of one job (worker → row + pub/sub). */
export interface JobProgress {
  fraction: number;
  iteration?: number;
  bestValue?: number;
  energy?: number;
  stdError?: number;
}

export interface JobResultView {
  value: number;
  assignment: number[];
  bound: number | null;
  boundSource?: string | null;
  gap: number | null;
  energy: number | null;
  expectation: number | null;
  params: number[] | null;
  seconds: number;
  evaluations: number;
  shots: number;
  provenOptimal: boolean;
  infeasible?: boolean;
  /** Seconds until the returned value was first reached (older results lack it). */
  secondsToBest?: number;
  /** Stopped because it reached a value another solver of the run proved optimal. */
  stoppedAtKnownOptimum?: boolean;
  trace?: { iteration: number; energy: number; stdError?: number; bestValue?: number; seconds: number; /** optimizer start (restart), 0 first */ start?: number }[];
  samples?: { assignment: number[]; count: number; value: number }[];
  notes?: string[];
  /** Variational jobs: qubits and gate counts per layout (docs/runs.md, "Circuit resources"). */
  circuit?: CircuitSummary;
  /** Variational jobs: what rebuilds the circuit (OpenQASM export, noise). */
  circuitSpec?: CircuitSpec;
  /** Whether classical local search refined a variational answer, and the value before it. */
  refinement?: { applied: boolean; unrefinedValue: number; unrefinedInfeasible: boolean; moves: number };
  /** Recursive QAOA (rqaoa): rounds, exact remainder, eliminations (depot, the depot it follows, sign, correlation). */
  recursion?: { rounds: number; remainder: number; eliminationsTotal: number; eliminations: { round: number; depot: string; follows: string | null; sign: 1 | -1; correlation: number }[]; roundLog?: RqaoaRoundEntry[] };
  /** qaoa-blocks: block count, sizes, block of each depot, merge method. */
  decomposition?: DecompositionReport;
  /** Variational jobs: time on a device per layout under the default assumptions. */
  deviceTime?: RunDeviceTime;
  /** Variational jobs started with `noise: true`: noiseless vs noisy values. */
  noise?: NoiseReport;
}

export interface JobView {
  id: number;
  position: number;
  solver: string;
  label: string;
  family: string;
  settings: Record<string, unknown>;
  status: JobStatus;
  progress: number;
  live: JobProgress | null;
  attempt: number;
  queuedAt: string | null;
  startedAt: string | null;
  finishedAt: string | null;
  result: JobResultView | null;
  error: string | null;
}

/**
 * The best balanced answer found for the same question on the same network version by any run of
 * the organisation (this one included; server/services/runs/best-known.ts). Not a certified optimum
 * unless `provenOptimal`.
 */
export interface BestKnownView {
  value: number;
  runId: number;
  solver: string;
  provenOptimal: boolean;
  /** Runs asked the same question on this version (this one included). */
  runsCompared: number;
}

export interface RunView {
  id: number;
  status: RunStatus;
  problem: ProblemInput;
  networkId: number;
  versionId: number;
  networkName: string | null;
  depotCount: number;
  timeLimitSeconds: number;
  seed: number;
  createdBy: number | null;
  createdAt: string;
  /** Last handed to the queue (creation, payment, retry); null while awaiting payment for the first time. */
  releasedAt: string | null;
  finishedAt: string | null;
  jobs: JobView[];
  /** Best known answer to this question on this network version (null before any answer). */
  bestKnown?: BestKnownView | null;
}

export interface RunListItem {
  id: number;
  status: RunStatus;
  problem: ProblemInput;
  networkId: number;
  versionId: number;
  networkName: string | null;
  depotCount: number;
  solvers: string[];
  createdAt: string;
  finishedAt: string | null;
}
