/**
 * Which solvers a new run starts with, chosen from the question's size — one function so the
 * API, the app and the CLI agree. Pure: it reads only the listing it is given, where each solver
 * has already answered for this problem (SolverDefinition.qubits / refuses, and the plan's size
 * rule), so it never offers a solver that does not exist, refuses, or that the plan refuses.
 */
import type { ProblemKind } from '../engine/problem/types';

export interface ProblemSize {
  kind: ProblemKind;
  /** Number of depots. */
  depots: number;
  /** Regions for kway (2 otherwise). */
  k?: number;
  /** Depots already pinned to a side or region (exact enumeration skips them). */
  pinned?: number;
}

/** What the choice needs from a listing, plus each solver's answer for this problem (default settings). */
export interface ListedSolver {
  name: string;
  family: 'exact' | 'bound' | 'heuristic' | 'variational';
  kinds: readonly ProblemKind[];
  /** Qubits the solver says it would simulate here (0 or absent for classical). */
  qubits?: number;
  /** True when the solver or the plan refuses this problem. */
  refused?: boolean;
}

export interface DefaultOptions {
  /** Most qubits a default variational solver may simulate (the plan's included qubits). */
  maxQubits?: number;
}

/** Exact enumeration is offered up to this many assignments (k^free depots): seconds on one core. */
export const EXACT_MAX_ASSIGNMENTS = 2 ** 24;
/** Variational solvers are offered up to this many qubits: a 2²⁰-amplitude state is 16 MiB and
 * each layer pass takes milliseconds, so an optimisation finishes in an interactive wait. */
export const VARIATIONAL_MAX_QUBITS = 20;

/** Strongest classical heuristic first, per question (tabu for max-cut, FM refinement for balanced splits). */
const HEURISTIC_PREFERENCE: Record<ProblemKind, string[]> = {
  maxcut: ['tabu', 'best', 'anneal', 'greedy'],
  bisection: ['fm', 'best', 'tabu', 'anneal', 'greedy'],
  kway: ['fm', 'best', 'anneal', 'greedy'],
};
const DECOMPOSITION_NAMES = ['qaoa-blocks', 'decomposed'];
/** Variational solvers built for networks beyond the statevector limit, proposed together there. */
const LARGE_VARIATIONAL_NAMES = ['rqaoa'];

/** log₂ of the assignments exact enumeration would walk: free depots × log₂ k. */
export function exactLog2Assignments(size: ProblemSize): number {
  const k = size.kind === 'kway' ? Math.max(2, size.k ?? 2) : 2;
  const free = Math.max(0, size.depots - (size.pinned ?? 0));
  // One side is fixed by symmetry when nothing is pinned; keep the estimate conservative and ignore that.
  return free * Math.log2(k);
}

/**
 * The default solver names for a question of this size, in the order the scorecard shows them:
 * exact (when small enough), the strongest classical heuristic, then QAOA and VQE when the
 * qubits each says it simulates fit — or, when they do not (above the statevector limit), the
 * large-network variational solvers: recursive QAOA and the decomposition solver, each when it
 * takes the problem and its own widest circuit fits.
 */
export function defaultSolvers(size: ProblemSize, listing: readonly ListedSolver[], opts: DefaultOptions = {}): string[] {
  const find = (name: string) => listing.find((s) => s.name === name && s.kinds.includes(size.kind) && !s.refused);
  const offered = (name: string) => find(name) !== undefined;
  const qubitLimit = Math.min(VARIATIONAL_MAX_QUBITS, opts.maxQubits ?? Infinity);
  const fits = (name: string) => (find(name)?.qubits ?? 0) <= qubitLimit;
  const picks: string[] = [];
  if (offered('exact') && exactLog2Assignments(size) <= Math.log2(EXACT_MAX_ASSIGNMENTS)) picks.push('exact');
  const heuristic = HEURISTIC_PREFERENCE[size.kind].find(offered);
  if (heuristic) picks.push(heuristic);
  const circuits = ['qaoa', 'vqe'].filter((name) => offered(name) && fits(name));
  if (circuits.length > 0) picks.push(...circuits);
  else {
    picks.push(...LARGE_VARIATIONAL_NAMES.filter((name) => offered(name) && fits(name)));
    const decomposition = DECOMPOSITION_NAMES.find((name) => offered(name) && fits(name));
    if (decomposition) picks.push(decomposition);
  }
  return picks;
}
