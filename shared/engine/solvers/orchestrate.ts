/**
 * One solver run from a user's point of view: validate the settings, ask the solver whether it
 * takes the problem, run it, then check its answer independently — value recomputed with
 * crossingWeight, pins and balance checked, the bound taken from the solver and from the
 * classical bounds and kept only when consistent, gap and proof of optimality derived here.
 * Nothing a solver says about its own answer is passed on unchecked.
 */
import { withReference } from '../circuits/run-analysis';
import { encodeProblem, type EncodingOptions, type PenaltyTerm } from '../encodings';
import { groupQubitWise } from '../operators/grouping';
import { isingToPauliSum } from '../operators/pauli';
import { contradicts, gap as gapOf, meets, sameValue, tighter } from '../problem/compare';
import { crossingWeight, isBalanced, isFeasible, respectsPins } from '../problem/evaluate';
import { senseOf, type Problem, type Sense } from '../problem/types';
import { computeBounds } from './bounds';
import { getSolver, type AnySolverDefinition } from './registry';
import type { SolveContext, SolveResult, StageStep, TaskContext } from './types';

/** What a bound provider returns (shared/engine/solvers/bounds.ts computeBounds). */
export interface BoundReport {
  bound: number | null;
  source: string;
  details?: unknown;
}

/** Options the orchestrator gives the bound provider (a subset of classical BoundOptions). */
export interface BoundRequest {
  /** A feasible value found by the run, which aims bound tightening at it. */
  knownValue?: number | null;
  seed?: number;
}

export type BoundsProvider = (problem: Problem, opts?: BoundRequest) => BoundReport | Promise<BoundReport>;

/** Thrown when a solver does not take this problem (wrong kind, too many qubits, …). */
export class SolverRefusedError extends Error {
  constructor(public readonly solverName: string, public readonly reason: string) {
    super(`solver "${solverName}" refuses this problem: ${reason}`);
    this.name = 'SolverRefusedError';
  }
}

/** A checked run: the SolveResult fields plus who produced it and where the bound came from. */
export interface RunResult extends SolveResult {
  solver: string;
  sense: Sense;
  /** Which bound was kept ('solver', or the computeBounds source), null without a bound. */
  boundSource: string | null;
  notes: string[];
  /**
   * Seconds from the start until the returned value was first reached (from the solver's
   * progress reports, ~50 ms resolution); the whole solving time when it never reported it.
   */
  secondsToBest: number;
  /** True when the solver was stopped because it reached a value another solver proved optimal. */
  stoppedAtKnownOptimum?: boolean;
}

export interface RunOptions {
  /** Also ask computeBounds for a bound (default true). */
  bounds?: boolean;
}

/** A step of a staged solve as hosts see it: tasks to spread, or the checked result. */
export type StagedRunStep = Extract<StageStep, { kind: 'spread' }> | { kind: 'done'; result: RunResult };

export interface Orchestrator {
  solveProblem(problem: Problem, solverName: string, settings: unknown, ctx: SolveContext, options?: RunOptions): Promise<RunResult>;
  /** First stage of a staged solver (types.ts StagedSolve); set ctx.startedAt and keep it for the later stages. */
  startStaged(problem: Problem, solverName: string, settings: unknown, ctx: SolveContext, options?: RunOptions): Promise<StagedRunStep>;
  resumeStaged(problem: Problem, solverName: string, settings: unknown, state: unknown, answers: unknown[], ctx: SolveContext, options?: RunOptions): Promise<StagedRunStep>;
}

const close = sameValue;

/**
 * With integer lane weights every crossing weight is an integer, so an upper bound may be
 * rounded down and a lower bound up (common practice in branch and bound).
 */
function roundBound(problem: Problem, sense: Sense, bound: number): number {
  const w = problem.network.laneWeight;
  for (let e = 0; e < w.length; e++) if (!Number.isInteger(w[e])) return bound;
  return sense === 'max' ? Math.floor(bound + 1e-7) : Math.ceil(bound - 1e-7);
}

/** An orchestrator over any solver lookup and bound provider (tests pass their own). */
export function createOrchestrator(lookup: (name: string) => AnySolverDefinition, bounds: BoundsProvider): Orchestrator {
  /**
   * The independent check of a solver's answer: value recomputed, pins and balance, bounds kept
   * only when consistent, gap and optimality derived here.
   */
  async function check(problem: Problem, solver: AnySolverDefinition, raw: SolveResult, started: number, watch: ReturnType<typeof watchProgress>, ctx: SolveContext, options: RunOptions): Promise<RunResult> {
    const sense = senseOf(problem.kind);
    const solveSeconds = (Date.now() - started) / 1000;
    const notes: string[] = [...(raw.notes ?? [])];
    const { n } = problem.network;
    const assignment = Array.from(raw.assignment ?? []);
    if (assignment.length !== n || !assignment.every((a) => Number.isInteger(a) && a >= 0 && a < problem.k)) {
      throw new Error(`solver "${solver.name}" returned an invalid assignment (need ${n} entries in 0…${problem.k - 1}); this is a bug in the solver`);
    }

    const value = crossingWeight(problem, assignment);
    if (!(typeof raw.value === 'number' && close(raw.value, value))) {
      notes.push(`the solver reported value ${raw.value}; the recomputed value ${value} is shown`);
    }
    const pinsOk = respectsPins(problem, assignment);
    const balanced = isBalanced(problem, assignment);
    const infeasible = !pinsOk || !balanced;
    if (!pinsOk) notes.push('the assignment moves a pinned depot');
    if (!balanced) notes.push('the assignment breaks the balance rule');

    // Bounds: keep each candidate only if it does not contradict the feasible value found.
    const candidates: { bound: number; source: string }[] = [];
    if (typeof raw.bound === 'number' && Number.isFinite(raw.bound)) candidates.push({ bound: raw.bound, source: 'solver' });
    if (options.bounds !== false) {
      // A failed bound costs the run its gap, not its answer.
      try {
        const report = await bounds(problem, { knownValue: infeasible ? null : value, seed: ctx.seed });
        if (report.bound !== null && Number.isFinite(report.bound)) candidates.push({ bound: report.bound, source: report.source });
      } catch (e) {
        notes.push(`no classical bound: ${e instanceof Error ? e.message : String(e)}`);
      }
    }
    // Another solver of this run proved `known` optimal: it bounds this answer too.
    const known = watch.knownOptimum();
    if (known !== null) candidates.push({ bound: known, source: 'the optimum another solver of this run proved' });
    let bound: number | null = null, boundSource: string | null = null;
    for (const c of candidates) {
      const b = roundBound(problem, sense, c.bound);
      if (!infeasible && contradicts(sense, value, b)) {
        notes.push(`bound ${c.bound} from ${c.source} contradicts the value found (${value}) and was discarded`);
        continue;
      }
      if (bound === null || tighter(sense, b, bound)) {
        bound = b;
        boundSource = b === c.bound ? c.source : `${c.source}, rounded to integer weights`;
      }
    }
    const gap = infeasible ? null : gapOf(sense, value, bound);
    const provenOptimal = !infeasible && meets(sense, value, bound);
    if (raw.provenOptimal && !provenOptimal) notes.push('the solver claimed optimality but no bound confirms it');

    const result: RunResult = {
      solver: solver.name,
      sense,
      value,
      assignment,
      bound,
      boundSource,
      gap,
      provenOptimal,
      energy: raw.energy ?? null,
      expectation: raw.expectation ?? null,
      params: raw.params ? Array.from(raw.params) : null,
      seconds: solveSeconds,
      evaluations: raw.evaluations ?? 0,
      shots: raw.shots ?? 0,
      infeasible,
      notes,
      secondsToBest: watch.secondsToBest(value) ?? solveSeconds,
    };
    if (watch.stopped() && !infeasible && known !== null && close(value, known)) {
      result.stoppedAtKnownOptimum = true;
      notes.push('stopped early: it reached the value another solver of this run proved optimal, so searching on could not improve it');
    }
    if (raw.trace) result.trace = raw.trace;
    // Every sample says whether it is feasible (recomputed here), so lists and charts rank it the same way.
    if (raw.samples) result.samples = raw.samples.map((x) => ({ ...x, feasible: isFeasible(problem, x.assignment) }));
    if (raw.circuit) result.circuit = raw.circuit;
    if (raw.circuitSpec) result.circuitSpec = raw.circuitSpec;
    if (raw.refinement) result.refinement = raw.refinement;
    if (raw.recursion) result.recursion = raw.recursion;
    if (raw.decomposition) result.decomposition = raw.decomposition;
    if (raw.deviceTime) result.deviceTime = raw.deviceTime;
    // Noise ratios against the run's bound (else its value), known only here.
    if (raw.noise) result.noise = withReference(raw.noise, problem.kind, bound !== null ? { value: bound, what: `the bound (${boundSource})` } : { value, what: 'the value found by this solver' });
    return result;
  }

  /** The solver, its parsed settings and its staged form, or why it cannot run in stages. */
  function stagedOf(problem: Problem, solverName: string, settingsInput: unknown) {
    const solver = lookup(solverName);
    const settings = solver.parseSettings(settingsInput ?? {});
    const reason = solver.refuses(problem, settings);
    if (reason !== null) throw new SolverRefusedError(solver.name, reason);
    if (!solver.staged) throw new Error(`solver "${solver.name}" does not run in stages`);
    return { solver, settings, staged: solver.staged };
  }

  /** A spread step as it is, a done step checked like any answer (its time counts from ctx.startedAt). */
  async function checkedStep(problem: Problem, solver: AnySolverDefinition, step: StageStep, ctx: SolveContext, options: RunOptions): Promise<StagedRunStep> {
    if (step.kind === 'spread') return step;
    const started = ctx.startedAt ?? Date.now();
    return { kind: 'done', result: await check(problem, solver, step.result, started, watchProgress(ctx, senseOf(problem.kind), false, started), ctx, options) };
  }

  return {
    async solveProblem(problem, solverName, settingsInput, ctx, options = {}) {
      const solver = lookup(solverName);
      const settings = solver.parseSettings(settingsInput ?? {});
      const reason = solver.refuses(problem, settings);
      if (reason !== null) throw new SolverRefusedError(solver.name, reason);

      const started = Date.now();
      const sense = senseOf(problem.kind);
      const watch = watchProgress(ctx, sense, solver.family === 'heuristic', started);
      const raw = await solver.solve(problem, settings, watch.ctx);
      return check(problem, solver, raw, started, watch, ctx, options);
    },
    async startStaged(problem, solverName, settingsInput, ctx, options = {}) {
      const { solver, settings, staged } = stagedOf(problem, solverName, settingsInput);
      return checkedStep(problem, solver, staged.start(problem, settings, ctx), ctx, options);
    },
    async resumeStaged(problem, solverName, settingsInput, state, answers, ctx, options = {}) {
      const { solver, settings, staged } = stagedOf(problem, solverName, settingsInput);
      return checkedStep(problem, solver, staged.resume(problem, settings, state, answers, ctx), ctx, options);
    },
  };
}

/**
 * Wraps the context a solver gets: records when each better value was first reported (time to
 * best), and — for heuristics — raises the stop flag once the reported best equals a value
 * another solver of the run has proven optimal. The caller's own cancel still stops it as before.
 */
function watchProgress(ctx: SolveContext, sense: Sense, stopAtOptimum: boolean, started: number) {
  const firstSeen: { value: number; seconds: number }[] = [];
  let best: number | null = null;
  let stop = false;
  const knownOptimum = () => {
    const v = ctx.knownOptimum?.() ?? null;
    return v !== null && Number.isFinite(v) ? v : null;
  };
  const cancel = { get cancelled() { return stop || ctx.cancel?.cancelled === true; } };
  const onProgress = (p: Parameters<NonNullable<SolveContext['onProgress']>>[0]) => {
    if (typeof p.bestValue === 'number' && Number.isFinite(p.bestValue) && (best === null || (sense === 'max' ? p.bestValue > best : p.bestValue < best))) {
      best = p.bestValue;
      firstSeen.push({ value: best, seconds: (Date.now() - started) / 1000 });
    }
    if (stopAtOptimum && best !== null) {
      const known = knownOptimum();
      if (known !== null && close(best, known)) stop = true;
    }
    ctx.onProgress?.(p);
  };
  return {
    ctx: { ...ctx, cancel, onProgress } as SolveContext,
    knownOptimum,
    stopped: () => stop,
    secondsToBest: (value: number): number | null => firstSeen.find((f) => close(f.value, value))?.seconds ?? null,
  };
}

const defaultOrchestrator = createOrchestrator(getSolver, computeBounds as BoundsProvider);

export const startStaged: Orchestrator['startStaged'] = (...args) => defaultOrchestrator.startStaged(...args);
export const resumeStaged: Orchestrator['resumeStaged'] = (...args) => defaultOrchestrator.resumeStaged(...args);

/** One task of a staged solver's stage (answers are plain JSON, like the tasks). */
export function runStagedTask(solverName: string, task: unknown, ctx: TaskContext): unknown {
  const solver = getSolver(solverName);
  if (!solver.staged) throw new Error(`solver "${solver.name}" does not run in stages`);
  return solver.staged.runTask(task, ctx);
}

/** Whether a registered solver can run in stages (the worker asks before planning a spread). */
export const runsInStages = (solverName: string): boolean => getSolver(solverName).staged !== undefined;

/** Runs a registered solver on a problem and returns the independently checked result. */
export function solveProblem(problem: Problem, solverName: string, settings: unknown, ctx: SolveContext, options?: RunOptions): Promise<RunResult> {
  return defaultOrchestrator.solveProblem(problem, solverName, settings, ctx, options);
}

/** What `spinyard inspect` and the UI show about the cost operator of a problem. */
export interface EncodingSummary {
  method: string;
  qubits: number;
  depotQubits: number;
  slackQubits: number;
  /** Non-zero Pauli terms besides the identity (Z_i and Z_iZ_j). */
  pauliTerms: number;
  linearTerms: number;
  quadraticTerms: number;
  /** Coefficient of the identity. */
  offset: number;
  penalties: PenaltyTerm[];
  rule: string;
  approximate: boolean;
  /** Qubit-wise commuting measurement groups (every term of an Ising operator is a Z-string). */
  commutingGroups: number;
  /** How the groups were found: the operators module's greedy grouping, or the diagonal argument. */
  groupMethod: string;
  /** Σ|c_k| over the non-identity terms (sets the state-independent shot budget). */
  coefficientNorm: number;
  /** Target standard error of the energy estimate the shot budget is for. */
  precision: number;
  /** Shots that reach `precision` in any state: ⌈(Σ|c_k|)²/ε²⌉. */
  shots: number;
  shotRule: string;
  /**
   * The largest terms by |coefficient| (at most LISTED_TERMS), so every screen lists the operator
   * this summary counts — for k regions the first split a solver simulates, not the one-hot form.
   */
  largestTerms: Array<{ qubits: number[]; coeff: number }>;
}

/** Terms an encoding summary lists. */
export const LISTED_TERMS = 40;

export interface DescribeOptions extends EncodingOptions {
  /** Target standard error ε of the energy; default 1 % of the total |lane weight|. */
  precision?: number;
}

/** Up to this many terms the groups are counted by operators/grouping (its cost is O(T²·n)). */
export const MAX_GROUPED_TERMS = 2000;

/** Above this many estimated Pauli terms the operator is not built (memory, not physics). */
export const MAX_DESCRIBED_TERMS = 5_000_000;

/** Rough size of the operator before building it: penalties square sums over all depots. */
export function estimatedPauliTerms(problem: Problem): number {
  const { n, m } = problem.network;
  if (problem.kind === 'maxcut') return n + m;
  if (problem.kind === 'bisection') return n + m + ((n + 8) * (n + 7)) / 2;
  const k = problem.k;
  return n * k + m * k + (n * k * (k - 1)) / 2 + (k * (n + 6) * (n + 5)) / 2;
}

/**
 * The encoding of a problem as the variational solvers would use it: qubits, terms, offset,
 * penalty weights with their rule, measurement groups and a shot budget. Shots use the
 * state-independent bound Var(Ê) ≤ (Σ|c_k|)²/S for one commuting group (textbook; allocation
 * usually credited to Wecker, Hastings, Troyer, PRA 92, 042303 (2015)).
 */
export function describeEncoding(problem: Problem, opts: DescribeOptions = {}): EncodingSummary {
  const estimate = estimatedPauliTerms(problem);
  if (estimate > MAX_DESCRIBED_TERMS) {
    throw new Error(`the ${problem.kind} operator would have about ${Math.round(estimate).toLocaleString('en')} Pauli terms (limit ${MAX_DESCRIBED_TERMS.toLocaleString('en')}); use a smaller network`);
  }
  const enc = encodeProblem(problem, opts);
  const op = enc.operator;
  let linearTerms = 0, quadraticTerms = 0, norm = 0;
  for (let q = 0; q < op.numQubits; q++) if (op.linear[q] !== 0) { linearTerms++; norm += Math.abs(op.linear[q]); }
  for (let t = 0; t < op.quadCoeff.length; t++) if (op.quadCoeff[t] !== 0) { quadraticTerms++; norm += Math.abs(op.quadCoeff[t]); }
  let totalAbs = 0;
  for (const w of problem.network.laneWeight) totalAbs += Math.abs(w);
  const precision = opts.precision ?? 0.01 * Math.max(totalAbs, 1e-12);
  if (!(precision > 0) || !Number.isFinite(precision)) throw new Error(`precision must be a positive number (got ${opts.precision})`);
  const shots = norm === 0 ? 0 : Math.ceil((norm / precision) ** 2 - 1e-9);
  const terms = linearTerms + quadraticTerms;
  const listed: Array<{ qubits: number[]; coeff: number }> = [];
  for (let q = 0; q < op.numQubits; q++) if (op.linear[q] !== 0) listed.push({ qubits: [q], coeff: op.linear[q] });
  for (let t = 0; t < op.quadCoeff.length; t++) if (op.quadCoeff[t] !== 0) listed.push({ qubits: [op.quadI[t], op.quadJ[t]], coeff: op.quadCoeff[t] });
  listed.sort((a, b) => Math.abs(b.coeff) - Math.abs(a.coeff));
  const grouped = terms > 0 && terms <= MAX_GROUPED_TERMS;
  const commutingGroups = grouped ? groupQubitWise(isingToPauliSum(op)).groups.length : terms > 0 ? 1 : 0;
  return {
    method: enc.method,
    qubits: enc.numQubits,
    depotQubits: enc.depotQubits,
    slackQubits: enc.numQubits - enc.depotQubits,
    pauliTerms: linearTerms + quadraticTerms,
    linearTerms,
    quadraticTerms,
    offset: op.offset,
    penalties: enc.penalties,
    rule: enc.rule,
    approximate: enc.approximate,
    commutingGroups,
    groupMethod: grouped ? 'qubit-wise commuting groups (greedy colouring, operators/grouping.ts)' : 'all terms are Z-strings, which commute qubit-wise: one group',
    coefficientNorm: norm,
    precision,
    shots,
    largestTerms: listed.slice(0, LISTED_TERMS),
    shotRule: `one Z-basis measurement per shot gives every term; S = ⌈(Σ|c_k|)²/ε²⌉ = ⌈(${fmt(norm)}/${fmt(precision)})²⌉ bounds the standard error by ε in any state`,
  };
}

const fmt = (x: number) => (Number.isInteger(x) ? String(x) : x.toPrecision(6));
