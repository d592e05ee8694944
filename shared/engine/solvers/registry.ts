/**
 * The solver registry: the one place mapping a solver name to its definition. The UI, the API,
 * the CLI, prices, plan limits and the README all read it, so a solver exists for users exactly
 * when it is listed here. Each solver lives in its own file, made by `defineSolver` (define.ts).
 */
import type { Problem, ProblemKind } from '../problem/types';
import { annealSolver } from './anneal';
import { bestSolver } from './best';
import { exactSolver } from './exact';
import { fmSolver } from './fm';
import { greedySolver } from './greedy';
import { gwSolver } from './gw';
import { milpSolver } from './milp';
import { qaoaSolver } from './qaoa';
import { qaoaBlocksSolver } from './qaoa-blocks';
import { tabuSolver } from './tabu';
import type { SolverDefinition } from './types';
import { rqaoaSolver } from './rqaoa';
import { vqeSolver } from './vqe';

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
  /** The settings with every default filled in (what a run without settings uses). */
  defaults: Record<string, unknown>;
}

/** What one solver says about one problem with given settings: its qubits and whether it refuses. */
export interface SolverAnswer {
  qubits: number;
  refusal: string | null;
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
        .map((d) => ({ name: d.name, label: d.label, family: d.family, kinds: [...d.kinds], guarantee: d.guarantee, defaults: d.parseSettings({}) }));
    },
  };
}

/** Every solver Spinyard offers: classical first (exact, bounds, heuristics), then variational. */
export const solverRegistry: SolverRegistry = createRegistry([
  exactSolver, milpSolver, greedySolver, tabuSolver, annealSolver, gwSolver, fmSolver, bestSolver,
  vqeSolver, qaoaSolver, qaoaBlocksSolver, rqaoaSolver,
]);
export const getSolver = (name: string): AnySolverDefinition => solverRegistry.getSolver(name);
export const listSolvers = (kind?: ProblemKind): SolverListing[] => solverRegistry.listSolvers(kind);

/** Ask one solver about one problem (settings as given; they are parsed here). */
export function askSolver(definition: AnySolverDefinition, problem: Problem, settings: unknown): SolverAnswer {
  const parsed = definition.parseSettings(settings ?? {});
  return { qubits: definition.qubits(problem, parsed), refusal: definition.refuses(problem, parsed) };
}
