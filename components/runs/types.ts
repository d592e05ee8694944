/**
 * What the runs API answers, as the app reads it. The run, job and result shapes are the solve
 * service's (shared/schemas/runs.ts); the preview and solver-listing shapes are written here from
 * its contract and kept loose where the service may add fields.
 */
import type { ProblemKind } from '../../shared/engine/problem/types';
import type { CreateRunBody, JobResultView, JobStatus, JobView, PreviewBody, ProblemInput, RunListItem, RunStatus, RunView, SolverEntry } from '../../shared/schemas/runs';

export type { CreateRunBody, JobStatus, PreviewBody, RunListItem, RunStatus, SolverEntry };
export type RunDetail = RunView;
export type RunJob = JobView;
export type JobResult = JobResultView;
export type RunProblem = ProblemInput;
export type RunTracePoint = NonNullable<JobResultView['trace']>[number];
export type RunSample = NonNullable<JobResultView['samples']>[number];

/** Just what the scorecard reads of a run (fixed data in tests, RunView in the app). */
export interface ScorableRun {
  problem: Pick<ProblemInput, 'kind'>;
  jobs: Array<Pick<JobView, 'id' | 'solver' | 'status' | 'result' | 'error'> & { label?: string }>;
  /** A run-wide proven bound, when the service computes one beyond the jobs' own. */
  bound?: number | null;
}

export interface EncodingPenalty {
  name: string;
  weight: number;
  rule: string;
}

/** orchestrate's describeEncoding, as the preview returns it. */
export interface EncodingView {
  method: string;
  qubits: number;
  depotQubits?: number;
  slackQubits?: number;
  pauliTerms: number;
  linearTerms?: number;
  quadraticTerms?: number;
  offset: number;
  penalties: EncodingPenalty[];
  rule: string;
  approximate?: boolean;
  commutingGroups: number;
  coefficientNorm?: number;
  precision: number;
  shots: number;
  shotRule?: string;
  /** The largest terms of this operator (Z on `qubits`), largest |coeff| first. */
  largestTerms?: Array<{ qubits: number[]; coeff: number }>;
}

export interface PreviewSolver {
  solver: string;
  label?: string;
  family?: string;
  refusal?: string | null;
  /** Whether the current role may start this entry with its settings (non-default needs runs:advanced). */
  allowed?: boolean;
  qubits?: number | null;
  /** QAOA/VQE: qubits and gate counts per layout of the circuit this entry will run (what its finished job reports). */
  circuit?: NonNullable<JobResultView['circuit']> | null;
  /** Why no circuit is counted, when so. */
  circuitNote?: string | null;
  /** Seconds, or the service's {atMost, note} budget. */
  estimatedSeconds?: number | { atMost: number; note?: string } | null;
}

export interface Price {
  amount: number;
  currency: string;
  label?: string;
  /** What the price is made of (billing's priceOfRun), when given. */
  lines?: { label: string; amount: number }[];
}

/** POST /api/runs/preview (server/services/runs.ts previewRun). */
export interface RunPreview {
  depots?: number;
  lanes?: number;
  encoding: EncodingView | null;
  /** Why no encoding summary could be built (too large), when so. */
  encodingNote?: string | null;
  /** The plan limit this run would exceed, in words, when so. */
  limitProblem?: string | null;
  /** Which circuit the encoding summary describes (k regions: the first split of the recursive bisection). */
  circuit?: string;
  /** Every reason the API would not start this run (fields, refusals, rights, plan size); empty = startable. */
  blockers?: string[];
  /** Role may not set these (seed, time limit, non-default settings), in words. */
  forbidden?: string | null;
  /** Settings errors per field, when some entry's settings are out of range. */
  fields?: Record<string, string[]> | null;
  plan?: { id: string; label: string; limits?: { maxQubits?: number } } | null;
  solvers: PreviewSolver[];
  estimatedSeconds?: number | null;
  /** Present only for paid runs (billing). */
  price?: Price | null;
  /** Billing's quote: whether the organisation's credits cover the price, in words (server/services/pricing.ts). */
  quote?: { affordable: boolean; note: string; balance: { amount: number; currency: string }; refusal?: string | null; ceiling?: { amount: number; currency: string } } | null;
}

/** A solver as the app lists it (the registry's listing). */
export interface SolverOption {
  name: string;
  label: string;
  family: 'exact' | 'bound' | 'heuristic' | 'variational';
  kinds: ProblemKind[];
  guarantee: string;
}
