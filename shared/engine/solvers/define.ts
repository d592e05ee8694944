/**
 * `defineSolver`: the one way to make a solver. A solver file states its name, label, family,
 * problem kinds, guarantee, settings schema (zod), what it refuses, how many qubits it simulates
 * and how it solves; the factory adds the shared parts (settings parsing with field messages, the
 * kind check, 0 qubits for classical solvers) so no caller re-derives them.
 */
import type { ZodType } from 'zod';
import type { Problem, ProblemKind } from '../problem/types';
import type { PlannedCircuit } from './circuit-plan';
import { parseSettingsWith } from './settings';
import type { CircuitTarget, SolveContext, SolveResult, SolverDefinition, SolverFamily, StagedSolve } from './types';

export interface SolverSpec<Settings> {
  name: string;
  label: string;
  family: SolverFamily;
  kinds: ProblemKind[];
  guarantee: string;
  settings: ZodType<Settings>;
  /** What to use instead for a kind this solver does not answer (ends the kind refusal). */
  otherwise?: string;
  /** Required for variational solvers (classical ones simulate nothing: 0). */
  qubits?: (problem: Problem, settings: Settings) => number;
  /** The widest circuit as a problem to encode (variational solvers with one fixed circuit). */
  circuit?: (problem: Problem, settings: Settings) => CircuitTarget | null;
  /** The circuit a run will simulate, for the preview (circuit-plan.ts; the run follows the same rule). */
  plannedCircuit?: (problem: Problem, settings: Settings, seed: number) => PlannedCircuit | null;
  /** Refusals beyond the problem kind (the factory checks the kind first). */
  refuses?: (problem: Problem, settings: Settings) => string | null;
  solve: (problem: Problem, settings: Settings, ctx: SolveContext) => Promise<SolveResult>;
  /** The same solve in stages of independent tasks (types.ts StagedSolve), for hosts that spread them. */
  staged?: StagedSolve<Settings>;
}

export const KIND_WORDS: Record<ProblemKind, string> = { maxcut: 'max-cut', bisection: 'balanced bisection', kway: 'k-way (k regions)' };

export function defineSolver<Settings>(spec: SolverSpec<Settings>): SolverDefinition<Settings> {
  if (spec.family === 'variational' && !spec.qubits) throw new Error(`solver "${spec.name}" is variational and must say how many qubits it simulates`);
  const qubits = spec.qubits ?? (() => 0);
  return Object.freeze({
    name: spec.name,
    label: spec.label,
    family: spec.family,
    kinds: [...spec.kinds],
    guarantee: spec.guarantee,
    settingsSchema: spec.settings,
    parseSettings: (input: unknown) => parseSettingsWith(spec.settings, input),
    qubits: (problem: Problem, settings: Settings) => (spec.kinds.includes(problem.kind) ? qubits(problem, settings) : 0),
    circuit: (problem: Problem, settings: Settings) => (spec.kinds.includes(problem.kind) && spec.circuit ? spec.circuit(problem, settings) : null),
    plannedCircuit: (problem: Problem, settings: Settings, seed: number) => (spec.kinds.includes(problem.kind) && spec.plannedCircuit ? spec.plannedCircuit(problem, settings, seed) : null),
    refuses(problem: Problem, settings: Settings): string | null {
      if (!spec.kinds.includes(problem.kind)) {
        return `${spec.name} handles ${spec.kinds.map((k) => KIND_WORDS[k]).join(' and ')}, not ${KIND_WORDS[problem.kind]}${spec.otherwise ? `; use ${spec.otherwise}` : ''}`;
      }
      return spec.refuses?.(problem, settings) ?? null;
    },
    solve: spec.solve,
    ...(spec.staged ? { staged: spec.staged } : {}),
  });
}
