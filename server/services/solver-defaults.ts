import type { Deps } from '../deps';
import { badRequest } from '../lib/http-error';
import { getVersionDocument } from './networks';
import { buildCompactNetwork } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { Problem } from '../../shared/engine/problem/types';
import type { ProblemInput } from '../../shared/schemas/runs';
import { getSolver, listSolvers } from '../../shared/engine/solvers/registry';
import { qubitsFor } from '../../shared/engine/solvers/orchestrate';
import { defaultSolvers } from '../../shared/runs/default-solvers';

export interface SolverDefaults {
  defaults: string[];
  depots: number;
  lanes: number;
  /** Qubits of the direct encoding, or null when it would be too large to build. */
  qubits: number | null;
  /** Qubits the circuit solvers need with their default strategy (k-way: its first bisection). */
  circuitQubits: number | null;
}

/** A solver that would refuse the problem with default settings is never a default. */
function accepts(name: string, problem: Problem): boolean {
  try {
    const d = getSolver(name);
    return d.refuses(problem, d.parseSettings({})) === null;
  } catch {
    return false;
  }
}

/** The default solver set for a question on one network version (the app's run setup reads it). */
export async function solverDefaultsFor(deps: Deps, organisationId: number, versionId: number, problem: ProblemInput): Promise<SolverDefaults> {
  const doc = await getVersionDocument(deps, organisationId, versionId);
  let bound: Problem;
  try {
    bound = bindProblem(buildCompactNetwork(doc), problem);
  } catch (err) {
    throw badRequest((err as Error).message);
  }
  const qubits = qubitsFor(bound);
  // The variational solvers split k regions by recursive bisection by default, so their circuits
  // are as wide as the first bisection, not the one-hot k-way operator.
  const circuitQubits = problem.kind === 'kway' ? qubitsFor(bindProblem(bound.network, { kind: 'bisection', tolerance: problem.tolerance })) : qubits;
  const pinned = Array.from(bound.pins).filter((p) => p >= 0).length;
  const size = { kind: problem.kind, depots: bound.network.n, k: bound.k, pinned, qubits: circuitQubits };
  const defaults = defaultSolvers(size, listSolvers()).filter((name) => accepts(name, bound));
  return { defaults, depots: bound.network.n, lanes: bound.network.m, qubits, circuitQubits };
}
