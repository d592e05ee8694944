/**
 * What the runs API answers (the solve service's contract, docs/runs-service.md), as the app
 * reads it. Field names match the CLI's `--json` output. Kept loose where the service may add
 * fields: the app only relies on what is listed here.
 */
import type { ProblemKind } from '../../shared/engine/problem/types';

export type JobStatus = 'queued' | 'running' | 'succeeded' | 'failed' | 'cancelled';
export type RunStatus = JobStatus | 'awaiting_payment' | string;

export interface RunTracePoint {
  iteration: number;
  energy: number;
  stdError?: number;
  bestValue?: number;
  seconds: number;
}

export interface RunSample {
  /** Side or region per depot, in the version's depot order. */
  assignment: number[];
  count: number;
  value: number;
}

export interface JobResult {
  value: number;
  assignment: number[];
  bound: number | null;
  gap: number | null;
  energy: number | null;
  expectation: number | null;
  params: number[] | null;
  seconds: number;
  evaluations: number;
  shots: number;
  provenOptimal: boolean;
  trace?: RunTracePoint[];
  samples?: RunSample[];
  infeasible?: boolean;
  notes?: string[];
  /** Where the bound came from, when the service says (e.g. "spectral", "exact"). */
  boundSource?: string;
}

/** Live progress of a job while it runs (the service's SolveProgress). */
export interface JobProgressDetail {
  iteration?: number;
  bestValue?: number;
  energy?: number;
  stdError?: number;
}

export interface RunJob {
  id: number;
  solver: string;
  /** Plain-words label when the service sends one. */
  label?: string;
  status: JobStatus;
  /** 0…1 share of the budget used. */
  progress: number;
  settings?: Record<string, unknown>;
  result: JobResult | null;
  error: string | null;
  /** Latest live figures (best value so far, energy ± standard error) when the service sends them. */
  live?: JobProgressDetail | null;
  /** Convergence trace so far while running (finished jobs keep it in result.trace). */
  trace?: RunTracePoint[];
  startedAt?: string | null;
  finishedAt?: string | null;
}

export interface RunProblem {
  kind: ProblemKind;
  k?: number;
  pins?: Record<string, number>;
  tolerance?: number;
}

export interface RunDetail {
  id: number;
  status: RunStatus;
  problem: RunProblem;
  networkId: number;
  versionId: number;
  networkName?: string;
  versionNumber?: number;
  createdAt: string;
  createdBy?: number | null;
  jobs: RunJob[];
  /** Depots in the version's order, when the service includes them (for CSV-like views). */
  depots?: { id: string; name?: string; weight?: number }[];
  /** The best proven bound over all jobs and bound providers, when the service computes one. */
  bound?: number | null;
}

export interface RunListItem {
  id: number;
  status: RunStatus;
  problem: RunProblem;
  networkId: number;
  versionId: number;
  networkName?: string;
  versionNumber?: number;
  createdAt: string;
  solvers?: string[];
  jobs?: Pick<RunJob, 'solver' | 'status' | 'progress'>[];
}

export interface SolverEntry {
  solver: string;
  settings?: Record<string, unknown>;
}

export interface CreateRunBody {
  versionId: number;
  problem: RunProblem;
  solvers: SolverEntry[];
}

export interface PreviewBody extends CreateRunBody {
  /** Target standard error of the energy the shot budget is for. */
  precision?: number;
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
}

export interface PreviewSolver {
  solver: string;
  refusal?: string | null;
  estimatedSeconds?: number | null;
}

export interface Price {
  amount: number;
  currency: string;
  label?: string;
}

export interface RunPreview {
  encoding: EncodingView | null;
  /** Why no encoding could be built (too large), when so. */
  encodingError?: string | null;
  solvers: PreviewSolver[];
  estimatedSeconds?: number | null;
  price?: Price | null;
}

/** A solver as the app lists it (the registry's listing). */
export interface SolverOption {
  name: string;
  label: string;
  family: 'exact' | 'bound' | 'heuristic' | 'variational';
  kinds: ProblemKind[];
  guarantee: string;
}
