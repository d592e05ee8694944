import type { ZodType } from 'zod';
import type { LayerBackend } from '../statevector/backend';
import type { CircuitSpec } from '../circuits/of-run';
import type { NoiseReport, RunDeviceTime } from '../circuits/run-analysis';
import type { CircuitSummary } from '../circuits/summary';
import type { PlannedCircuit } from './circuit-plan';
import type { EncodingOptions } from '../encodings';
import type { Problem, ProblemKind } from '../problem/types';
import type { RqaoaRoundEntry } from '../variational/rqaoa-log';

/** A circuit a solver simulates: the problem it encodes and the encoding options, in words. */
export interface CircuitTarget {
  problem: Problem;
  options: EncodingOptions;
  what: string;
}

/** Progress reported while a solver runs (published by workers, printed by the CLI). */
export interface SolveProgress {
  /** Share of the time or iteration budget used, 0…1. */
  fraction: number;
  iteration?: number;
  /** Best business value found so far (cut weight or crossing weight). */
  bestValue?: number;
  /** Current energy estimate and its standard error (variational solvers). */
  energy?: number;
  stdError?: number;
}

export interface TracePoint {
  iteration: number;
  energy: number;
  stdError?: number;
  bestValue?: number;
  seconds: number;
  /** Variational solvers: the optimizer start (restart) of this point, 0 for the first. */
  start?: number;
}

export interface SampledAssignment {
  /** Assignment per depot in input order. */
  assignment: number[];
  count: number;
  value: number;
  /** Pins respected and balance rule met (problem/compare.ts ranks feasible samples first). */
  feasible: boolean;
}

/** What every solver returns; field names match `spinyard solve --json`. */
export interface SolveResult {
  /** Business value of `assignment`: cut weight (maxcut) or crossing weight (bisection, kway). */
  value: number;
  /** Side 0/1 or region 0…k−1 per depot, in input order. */
  assignment: number[];
  /** Proven bound on the optimum (upper for maxcut, lower for min problems), or null. */
  bound: number | null;
  /** (bound − value)/bound for max, (value − bound)/value for min; null without a bound. */
  gap: number | null;
  provenOptimal: boolean;
  /** Final energy of the cost operator (variational), or null. */
  energy: number | null;
  /** Exact expected business value at the final parameters (variational), or null. */
  expectation: number | null;
  params: number[] | null;
  seconds: number;
  evaluations: number;
  shots: number;
  trace?: TracePoint[];
  samples?: SampledAssignment[];
  /** True when the assignment violates the balance rule (reported, never hidden). */
  infeasible?: boolean;
  /**
   * Whether classical local search refined a variational answer (a setting), with the value
   * before it, so a variational result is never credited with the classical polish.
   */
  refinement?: { applied: boolean; unrefinedValue: number; unrefinedInfeasible: boolean; moves: number };
  /** Recursive QAOA: rounds, depots solved exactly at the end, and the eliminations in order. */
  recursion?: RecursionReport;
  /** qaoa-blocks: the blocks (count, sizes, block per depot) and the merge method. */
  decomposition?: DecompositionReport;
  notes?: string[];
  /** Variational runs: qubits and gate counts per qubit layout (docs/runs.md, "Circuit resources"). */
  circuit?: CircuitSummary;
  /** Variational runs: what rebuilds the circuit from the problem (OpenQASM, noise). */
  circuitSpec?: CircuitSpec;
  /** Variational runs: time on a device per layout under the default assumptions. */
  deviceTime?: RunDeviceTime;
  /** Variational runs with `noise: true`: noiseless vs noisy energy, expected value and ratio. */
  noise?: NoiseReport;
}

/** Cooperative cancellation: solvers check it between iterations. */
export interface CancelToken {
  readonly cancelled: boolean;
}

export interface SolveContext {
  seed: number;
  timeLimitSeconds: number;
  cancel?: CancelToken;
  onProgress?: (progress: SolveProgress) => void;
  /**
   * A value another solver of the same run has proven optimal, when one has (else null). The
   * orchestrator stops a heuristic that reaches it: searching on cannot find anything better.
   */
  knownOptimum?: () => number | null;
  /** Faster statevector kernels the host loaded (server/CLI: WebAssembly); JS kernels without. */
  stateKernels?: LayerBackend;
  /** Epoch ms the solve began; a staged solve resumed in another process counts its time from it. */
  startedAt?: number;
}

export type SolverFamily = 'exact' | 'bound' | 'heuristic' | 'variational';

/**
 * A solver as the rest of Spinyard sees it. Built only by `defineSolver` (define.ts), so every
 * solver answers the same questions the same way: run creation, the preview, prices, plan
 * refusals, size-based defaults, the CLI and `/api/solvers` all ask it.
 */
export interface SolverDefinition<Settings = Record<string, unknown>> {
  name: string;
  /** Plain-words label for the UI; "-style" where our version simplifies a published method. */
  label: string;
  family: SolverFamily;
  kinds: ProblemKind[];
  /** What the solver guarantees, in one sentence (README, UI and CLI read this). */
  guarantee: string;
  /** The settings schema (zod; the same object validates in the app, the API, the worker and the CLI). */
  settingsSchema: ZodType<Settings>;
  /** Parse and default the settings; throws a SettingsError with field messages on bad input. */
  parseSettings(input: unknown): Settings;
  /**
   * Qubits of the widest circuit the solver would simulate on this problem with these settings
   * (k-way QAOA/VQE: the first split of the recursive bisection; qaoa-blocks: one block); 0 for
   * classical solvers. The one qubit count: prices, plan limits, defaults and the app read it.
   */
  qubits(problem: Problem, settings: Settings): number;
  /**
   * The widest circuit as a problem and encoding options (the preview's encoding summary
   * describes it), or null when the solver simulates no single fixed circuit (classical; blocks).
   */
  circuit(problem: Problem, settings: Settings): CircuitTarget | null;
  /**
   * The circuit a run with these settings will simulate and its resources per layout, before it
   * runs (the run setup's summary); null for solvers without one fixed circuit (classical, blocks,
   * recursive QAOA) or when nothing is left to simulate. `seed` only moves warm-start angles.
   */
  plannedCircuit(problem: Problem, settings: Settings, seed: number): PlannedCircuit | null;
  /** Null when the solver can take the problem, else the reason it refuses (wrong kind, too large, …). */
  refuses(problem: Problem, settings: Settings): string | null;
  solve(problem: Problem, settings: Settings, ctx: SolveContext): Promise<SolveResult>;
  /** Solvers whose heavy work splits into independent tasks: the same solve in stages. */
  staged?: StagedSolve<Settings>;
}

/** One elimination of recursive QAOA as the run screen shows it. */
export interface RecursionStep {
  round: number;
  depot: string;
  /** The depot it follows, or null when its side was fixed. */
  follows: string | null;
  /** +1 same side as `follows` (side 0 when fixed), −1 the other. */
  sign: 1 | -1;
  correlation: number;
}

export interface RecursionReport {
  rounds: number;
  remainder: number;
  /** Eliminations in order (at most the first 2,000; `eliminationsTotal` counts all). */
  eliminations: RecursionStep[];
  eliminationsTotal: number;
  /** Per round: depots eliminated, correlations used (variational/rqaoa-log.ts; ≤ 120 entries, merged above). */
  roundLog?: RqaoaRoundEntry[];
}

/** qaoa-blocks: how the network was cut into blocks and how the blocks were oriented. */
export interface DecompositionReport {
  blocks: number;
  /** Depots per block, in block order. */
  sizes: number[];
  /** Block of each depot, in input order (the run screen colours the drawing by it). */
  blockOf: number[];
  /** Widest block circuit (qubits). */
  largestQubits: number;
  /** How block orientations were chosen (decompose.ts). */
  merge: 'single' | 'exact' | 'rqaoa' | 'blocks' | 'local';
}

/**
 * A step of a staged solve: either the answer, or independent tasks (plain JSON) that may run
 * in any order and any process, after which the solve resumes from `state` with their answers.
 */
export type StageStep =
  | { kind: 'spread'; state: unknown; tasks: unknown[]; progress: { from: number; to: number } }
  | { kind: 'done'; result: SolveResult };

/** What a task runner gives a task: the stop rule (time limit, cancel) and the host's kernels. */
export interface TaskContext {
  shouldStop(): boolean;
  stateKernels?: LayerBackend;
}

/**
 * A solver whose heavy work splits into independent tasks (qaoa-blocks): the host may run the
 * tasks itself (what `solve` does) or spread them over workers (server/workers/spread-job.ts).
 * Same stages, same seeds per task: the same answer either way.
 */
export interface StagedSolve<Settings> {
  start(problem: Problem, settings: Settings, ctx: SolveContext): StageStep;
  resume(problem: Problem, settings: Settings, state: unknown, answers: unknown[], ctx: SolveContext): StageStep;
  runTask(task: unknown, ctx: TaskContext): unknown;
}
