import { circuitSummary, type CircuitSummary } from '../circuits/summary';
import type { LogicalCircuit } from '../circuits/types';
import type { PauliSum } from '../operators/types';
import type { OptimizerName } from '../variational/optimize';
import { runVqeOnPauli } from '../variational/vqe-pauli';
import type { VariationalTracePoint } from '../variational/qaoa-run';
import { createRng } from '../random';
import { operatorCircuit } from './circuit';
import { exactGround, isDiagonal, type ExactGround } from './ground';

export interface OperatorSolveOptions {
  /** 'qaoa' needs a diagonal operator and runs the alternating circuit from |+⟩ⁿ (QAOA's). */
  solver: 'vqe' | 'qaoa';
  ansatz: 'ladder' | 'alternating';
  layers: number;
  entangler: 'line' | 'ring';
  optimizer: OptimizerName;
  shots: number;
  restarts: number;
  maxIterations: number;
  seed: number;
  timeLimitSeconds: number;
  cancelled?: () => boolean;
}

export interface OperatorSolveResult {
  solver: 'vqe' | 'qaoa';
  ansatz: 'ladder' | 'alternating';
  qubits: number;
  terms: number;
  diagonal: boolean;
  /** Exact ⟨H⟩ at the optimised parameters (statevector). */
  energy: number;
  exact: ExactGround | null;
  /** energy − exact ground energy (≥ 0 by the variational principle), and relative to |exact|. */
  gap: number | null;
  relativeGap: number | null;
  params: number[];
  paramNames: string[];
  evaluations: number;
  shots: number;
  seconds: number;
  stopped: boolean;
  trace: VariationalTracePoint[];
  circuit: CircuitSummary | null;
  /** Why no circuit counts are given (higher-order Z terms), when so. */
  circuitNote: string | null;
}

export class OperatorRefusal extends Error {
  constructor(message: string) { super(message); this.name = 'OperatorRefusal'; }
}

/** Largest custom operator a run simulates (a 20-qubit state is 16 MiB; one run per request). */
export const OPERATOR_RUN_MAX_QUBITS = 20;

/**
 * A variational run on a custom operator next to its exact ground energy (docs/runs.md,
 * "Operators of your own"): VQE (ladder or alternating ansatz) or, for a diagonal operator, QAOA.
 */
export function solveOperator(p: PauliSum, o: OperatorSolveOptions): OperatorSolveResult {
  const diagonal = isDiagonal(p);
  if (o.solver === 'qaoa' && !diagonal) throw new OperatorRefusal('QAOA needs a diagonal operator (Z terms only); this one has X or Y terms — use VQE');
  if (p.numQubits > OPERATOR_RUN_MAX_QUBITS) throw new OperatorRefusal(`${p.numQubits} qubits is above the ${OPERATOR_RUN_MAX_QUBITS} a custom-operator run simulates`);
  const ansatz = o.solver === 'qaoa' ? 'alternating' : o.ansatz;
  const start = performance.now();
  const elapsed = () => (performance.now() - start) / 1000;
  const out = runVqeOnPauli(p, {
    ansatz, layers: o.layers, entangler: o.entangler, optimizer: o.optimizer, shots: o.shots, restarts: o.restarts,
    maxIterations: o.maxIterations, rng: createRng(o.seed), shouldStop: () => elapsed() >= o.timeLimitSeconds || (o.cancelled?.() ?? false),
  });
  const exact = exactGround(p);
  const gap = exact ? out.energy - exact.energy : null;
  const built = operatorCircuit(p, ansatz, o.layers, o.entangler);
  const circuit: LogicalCircuit | null = 'circuit' in built ? built.circuit : null;
  return {
    solver: o.solver, ansatz, qubits: p.numQubits, terms: p.terms.length, diagonal,
    energy: out.energy, exact, gap, relativeGap: exact && gap !== null && exact.energy !== 0 ? gap / Math.abs(exact.energy) : null,
    params: out.params, paramNames: out.paramNames, evaluations: out.evaluations, shots: out.shotsUsed, seconds: elapsed(), stopped: out.stopped, trace: out.trace,
    circuit: circuit ? circuitSummary(circuit) : null,
    circuitNote: 'reason' in built ? built.reason : null,
  };
}
