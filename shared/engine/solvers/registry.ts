/**
 * The solver registry: the one place mapping a solver name to its definition. The UI, the API,
 * the CLI and the README all read `listSolvers()`, so a solver exists for users exactly when it
 * is listed here.
 */
import type { ProblemKind } from '../problem/types';
import { classicalSolvers } from './classical';
import type { SolverDefinition } from './types';
import { variationalSolvers } from './variational';
import { qaoaBlocksSolver } from './decomposed';
import { rqaoaSolver } from './rqaoa';

// Settings types differ per solver; the registry only passes them through parseSettings.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type AnySolverDefinition = SolverDefinition<any>;

/** What listings show about a solver (plain data, safe to send to the browser). */
export interface SolverListing {
  name: string;
  label: string;
  family: SolverDefinition['family'];
  kinds: ProblemKind[];
  guarantee: string;
}

export class UnknownSolverError extends Error {
  constructor(public readonly solverName: string, public readonly validNames: string[]) {
    super(`unknown solver "${solverName}"; choose one of: ${validNames.join(', ')}`);
    this.name = 'UnknownSolverError';
  }
}

export interface SolverRegistry {
  /** The definition, or an UnknownSolverError listing the valid names. */
  getSolver(name: string): AnySolverDefinition;
  /** All solvers in registration order; `kind` keeps those that answer that question. */
  listSolvers(kind?: ProblemKind): SolverListing[];
  names: string[];
}

/** A registry over the given definitions; names must be unique. */
export function createRegistry(definitions: readonly AnySolverDefinition[]): SolverRegistry {
  const byName = new Map<string, AnySolverDefinition>();
  for (const d of definitions) {
    if (byName.has(d.name)) throw new Error(`two solvers are registered as "${d.name}"; names must be unique`);
    byName.set(d.name, d);
  }
  const names = [...byName.keys()];
  return {
    names,
    getSolver(name) {
      const d = byName.get(name);
      if (!d) throw new UnknownSolverError(name, names);
      return d;
    },
    listSolvers(kind) {
      return definitions
        .filter((d) => kind === undefined || d.kinds.includes(kind))
        .map((d) => ({ name: d.name, label: d.label, family: d.family, kinds: [...d.kinds], guarantee: d.guarantee }));
    },
  };
}

/** Every solver Spinyard offers: classical first (exact, bounds, heuristics), then variational. */
export const solverRegistry: SolverRegistry = createRegistry([...classicalSolvers, ...variationalSolvers, qaoaBlocksSolver, rqaoaSolver]);
export const getSolver = (name: string): AnySolverDefinition => solverRegistry.getSolver(name);
export const listSolvers = (kind?: ProblemKind): SolverListing[] => solverRegistry.listSolvers(kind);
