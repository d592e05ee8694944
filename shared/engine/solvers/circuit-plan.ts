/**
 * The one rule "problem + settings → circuit" of the QAOA/VQE solvers: which operator the circuit
 * acts on (the direct encoding, or the first split of a recursive k-way run), which ansatz with
 * which layers, and whether a warm start shapes it. The run (solveVariational) writes its result's
 * `circuitSpec` with `specOf`; the preview before launch asks `plannedCircuit` — so the resources
 * shown in the run setup are the ones the finished run reports (tests/unit/circuits/plan.test.ts).
 */
import { circuitOf, encodingOf, type CircuitSpec } from '../circuits/of-run';
import { circuitSummary, type CircuitSummary } from '../circuits/summary';
import type { Encoding } from '../encodings/types';
import type { Problem } from '../problem/types';

/** The settings that choose the operator (both circuit solvers have them). */
export interface CircuitChoice {
  kwayStrategy: 'recursive' | 'onehot';
  penaltyRule: 'lucas' | 'dominant';
}

/** What a solver's own settings decide about its circuit, given the operator and a warm start. */
export type AnsatzOf = (encoding: Encoding, warm: ArrayLike<number> | null) => Omit<CircuitSpec, 'encoding' | 'penaltyRule'>;

/** k regions by recursive bisection simulate the first split; everything else the direct encoding. */
export const encodingChoice = (problem: Problem, s: CircuitChoice): CircuitSpec['encoding'] =>
  (problem.kind === 'kway' && s.kwayStrategy === 'recursive' ? 'first-split' : 'direct');

/** The spec of a circuit on `encoding` (the run's result carries it; OpenQASM and noise rebuild from it). */
export function specOf(ansatz: AnsatzOf, s: CircuitChoice, which: CircuitSpec['encoding'], encoding: Encoding, warm: ArrayLike<number> | null): CircuitSpec {
  return { ...ansatz(encoding, warm), encoding: which, penaltyRule: s.penaltyRule };
}

export interface PlannedCircuit {
  spec: CircuitSpec;
  /** Qubits and gate counts per layout: what the finished run's `circuit` will say. */
  summary: CircuitSummary;
}

/**
 * The circuit a run with these settings will simulate, before it runs; null when every depot is
 * pinned (no circuit). `warmStart` is the solver's own warm-start rule (a direct encoding only, as
 * in the run); the warm-start angles depend on its answer but the gate counts do not.
 */
export function plannedCircuit(problem: Problem, s: CircuitChoice, ansatz: AnsatzOf, warmStart: (() => { warm: ArrayLike<number> | null }) | null): PlannedCircuit | null {
  const which = encodingChoice(problem, s);
  const encoding = encodingOf(problem, { encoding: which, penaltyRule: s.penaltyRule });
  if (encoding.numQubits === 0) return null;
  const warm = which === 'direct' && warmStart ? warmStart().warm : null;
  const spec = specOf(ansatz, s, which, encoding, warm);
  return { spec, summary: circuitSummary(circuitOf(encoding, spec)) };
}
