import type { Deps } from '../deps';
import { badRequest } from '../lib/http-error';
import { getVersionDocument } from './networks';
import { buildCompactNetwork } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { ProblemInput } from '../../shared/schemas/runs';
import { listSolvers } from '../../shared/engine/solvers/registry';
import { qubitsFor } from '../../shared/engine/solvers/orchestrate';
import { defaultSolvers } from '../../shared/runs/default-solvers';

export interface SolverDefaults {
  defaults: string[];
  depots: number;
  lanes: number;
  /** Qubits of the direct encoding, or null when it would be too large to build. */
  qubits: number | null;
}

/** The default solver set for a question on one network version (the app's run setup reads it). */
export async function solverDefaultsFor(deps: Deps, organisationId: number, versionId: number, problem: ProblemInput): Promise<SolverDefaults> {
  const doc = await getVersionDocument(deps, organisationId, versionId);
  let bound;
  try {
    bound = bindProblem(buildCompactNetwork(doc), problem);
  } catch (err) {
    throw badRequest((err as Error).message);
  }
  const qubits = qubitsFor(bound);
  const pinned = Array.from(bound.pins).filter((p) => p >= 0).length;
  const size = { kind: problem.kind, depots: bound.network.n, k: bound.k, pinned, qubits };
  return { defaults: defaultSolvers(size, listSolvers()), depots: bound.network.n, lanes: bound.network.m, qubits };
}
