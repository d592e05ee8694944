/**
 * One solver run from a user's point of view: validate the settings, ask the solver whether it
 * takes the problem, run it, then check its answer independently — value recomputed with
 * crossingWeight, pins and balance checked, the bound taken from the solver and from the
 * classical bounds and kept only when consistent, gap and proof of optimality derived here.
 * Nothing a solver says about its own answer is passed on unchecked.
 */
import { crossingWeight, gapOf, isBalanced, respectsPins } from '../problem/evaluate';
import { senseOf, type Problem, type Sense } from '../problem/types';
import { computeBounds } from './classical';
import { getSolver, type AnySolverDefinition } from './registry';
import type { SolveContext, SolveResult } from './types';

/** What a bound provider returns (shared/engine/solvers/classical.ts computeBounds). */
export interface BoundReport {
  bound: number | null;
  source: string;
  details?: unknown;
}

export type BoundsProvider = (problem: Problem, opts?: { timeLimitSeconds?: number }) => BoundReport | Promise<BoundReport>;

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
}

export interface RunOptions {
  /** Also ask computeBounds for a bound (default true). */
  bounds?: boolean;
  /** Time given to computeBounds (default: min(10 s, a fifth of the solve budget)). */
  boundTimeLimitSeconds?: number;
}

export interface Orchestrator {
  solveProblem(problem: Problem, solverName: string, settings: unknown, ctx: SolveContext, options?: RunOptions): Promise<RunResult>;
}

/** Relative tolerance for "the bound meets the value". */
export const OPTIMALITY_TOLERANCE = 1e-9;

const close = (a: number, b: number) => Math.abs(a - b) <= OPTIMALITY_TOLERANCE * Math.max(1, Math.abs(a), Math.abs(b));

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
  return {
    async solveProblem(problem, solverName, settingsInput, ctx, options = {}) {
      const solver = lookup(solverName);
      if (!solver.kinds.includes(problem.kind)) {
        throw new SolverRefusedError(solver.name, `it answers ${solver.kinds.join(', ')}, not ${problem.kind}`);
      }
      const settings = solver.parseSettings(settingsInput ?? {});
      const reason = solver.refuses(problem, settings);
      if (reason !== null) throw new SolverRefusedError(solver.name, reason);

      const started = Date.now();
      const raw = await solver.solve(problem, settings, ctx);
      const solveSeconds = (Date.now() - started) / 1000;
      const notes: string[] = [...(raw.notes ?? [])];
      const { n } = problem.network;
      const assignment = Array.from(raw.assignment ?? []);
      if (assignment.length !== n || !assignment.every((a) => Number.isInteger(a) && a >= 0 && a < problem.k)) {
        throw new Error(`solver "${solver.name}" returned an invalid assignment (need ${n} entries in 0…${problem.k - 1}); this is a bug in the solver`);
      }

      const sense = senseOf(problem.kind);
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
        const limit = options.boundTimeLimitSeconds ?? Math.min(10, Math.max(0.5, ctx.timeLimitSeconds / 5));
        const report = await bounds(problem, { timeLimitSeconds: limit });
        if (report.bound !== null && Number.isFinite(report.bound)) candidates.push({ bound: report.bound, source: report.source });
      }
      let bound: number | null = null, boundSource: string | null = null;
      for (const c of candidates) {
        const b = roundBound(problem, sense, c.bound);
        const contradicts = !infeasible && (sense === 'max' ? b < value && !close(b, value) : b > value && !close(b, value));
        if (contradicts) {
          notes.push(`bound ${c.bound} from ${c.source} contradicts the value found (${value}) and was discarded`);
          continue;
        }
        if (bound === null || (sense === 'max' ? b < bound : b > bound)) {
          bound = b;
          boundSource = b === c.bound ? c.source : `${c.source}, rounded to integer weights`;
        }
      }
      const gap = infeasible ? null : gapOf(problem.kind, value, bound);
      const provenOptimal = !infeasible && bound !== null && close(bound, value);
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
      };
      if (raw.trace) result.trace = raw.trace;
      if (raw.samples) result.samples = raw.samples;
      return result;
    },
  };
}

const defaultOrchestrator = createOrchestrator(getSolver, computeBounds as BoundsProvider);

/** Runs a registered solver on a problem and returns the independently checked result. */
export function solveProblem(problem: Problem, solverName: string, settings: unknown, ctx: SolveContext, options?: RunOptions): Promise<RunResult> {
  return defaultOrchestrator.solveProblem(problem, solverName, settings, ctx, options);
}
