import type { Deps } from '../deps';
import { badRequest } from '../lib/http-error';
import { getVersionDocument } from './networks';
import { buildCompactNetwork } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { Problem } from '../../shared/engine/problem/types';
import type { ProblemInput } from '../../shared/schemas/runs';
import { askSolver, getSolver, listSolvers } from '../../shared/engine/solvers/registry';
import { runLimits, runSizeRefusal } from '../../shared/plans';
import { defaultSolvers } from '../../shared/runs/default-solvers';
import { loadRunsConfig } from './queue-config';
import { planOf } from './runs/planning';

/** One solver's answer for this question with its default settings. */
export interface SolverAnswerView {
  name: string;
  /** Qubits it would simulate (0 for classical). */
  qubits: number;
  /** Why the solver, or the plan, refuses it; null when it can run. */
  refusal: string | null;
}

export interface SolverDefaults {
  defaults: string[];
  depots: number;
  lanes: number;
  /** Every solver that answers this kind of question, as it answered (the app shows these figures). */
  solvers: SolverAnswerView[];
}

/**
 * The default solver set for a question on one network version (the app's run setup reads it).
 * Every solver is asked with default settings; one that refuses, or that the plan's size rule
 * refuses, is never a default, and circuits stay within the plan's included qubits.
 */
export async function solverDefaultsFor(deps: Deps, organisationId: number, versionId: number, problem: ProblemInput): Promise<SolverDefaults> {
  const doc = await getVersionDocument(deps, organisationId, versionId);
  let bound: Problem;
  try {
    bound = bindProblem(buildCompactNetwork(doc), problem);
  } catch (err) {
    throw badRequest((err as Error).message);
  }
  const plan = await planOf(deps, organisationId);
  const limits = runLimits(plan);
  const seconds = Math.min(loadRunsConfig().RUN_DEFAULT_SECONDS, limits.maxSecondsPerSolver);
  const listing = listSolvers(problem.kind).map((s) => {
    const answer = askSolver(getSolver(s.name), bound, {});
    const planRefusal = runSizeRefusal(plan, { depots: bound.network.n, secondsPerSolver: seconds, solvers: [{ name: s.name, family: s.family, qubits: answer.qubits }] });
    return { ...s, qubits: answer.qubits, refusal: answer.refusal ?? planRefusal?.message ?? null };
  });
  const pinned = Array.from(bound.pins).filter((p) => p >= 0).length;
  const size = { kind: problem.kind, depots: bound.network.n, k: bound.k, pinned };
  const defaults = defaultSolvers(size, listing.map((s) => ({ ...s, refused: s.refusal !== null })), { maxQubits: limits.maxQubits });
  return { defaults, depots: bound.network.n, lanes: bound.network.m, solvers: listing.map((s) => ({ name: s.name, qubits: s.qubits, refusal: s.refusal })) };
}
