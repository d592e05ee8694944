import { createLadderAnsatz } from '../ansatz/ladder';
import { createQaoaAnsatz } from '../ansatz/qaoa';
import { estimateByShots } from '../operators/estimate';
import { groupQubitWise } from '../operators/grouping';
import { compilePauliSum, exactExpectation } from '../operators/pauli';
import type { PauliSum } from '../operators/types';
import type { Estimate } from '../optimizers/types';
import type { StateVector } from '../statevector/state';
import type { VariationalOutcome } from './qaoa-run';
import { ladderStart, runVqeLoop, type VqeCommonOptions } from './vqe-run';

/**
 * VQE on a custom operator (any PauliSum, e.g. a spin model). Ansätze:
 * - 'ladder' (hardware-efficient, ansatz/ladder.ts), from |0…0⟩ with the first rung at R_Y(π/2);
 * - 'alternating': e^{−iβ_ℓ ΣX} e^{+iγ_ℓ D} layers from |+⟩ⁿ with D the operator's Z-only part
 *   (the QAOA circuit with free angles; a "Hamiltonian variational" ansatz that respects the
 *   symmetries of transverse-field models).
 * Energy: exact ⟨ψ|H|ψ⟩ when shots = 0, else qubit-wise commuting groups measured with
 * ⌈shots/groups⌉ shots each (operators/estimate.ts). No decoding: samples stay empty.
 */
export function runVqeOnPauli(operator: PauliSum, opts: VqeCommonOptions): VariationalOutcome {
  const n = operator.numQubits;
  const compiled = compilePauliSum(operator); // once per run
  const grouping = groupQubitWise(operator);
  const ansatz = opts.ansatz === 'alternating'
    ? createQaoaAnsatz({ numQubits: n, layers: opts.layers, energyDiagonal: compiled.diagonal, stateOptions: opts.stateOptions })
    : createLadderAnsatz({ numQubits: n, layers: opts.layers, entangler: opts.entangler, stateOptions: opts.stateOptions });
  const first = opts.initialParams ?? (opts.ansatz === 'alternating'
    ? Float64Array.from({ length: 2 * opts.layers }, () => 0.3)
    : ladderStart(n, opts.layers, opts.rng));
  const groups = grouping.groups.length;
  const perGroup = Math.max(2, Math.ceil(opts.shots / Math.max(1, groups)));
  const estimate = opts.shots > 0
    ? (s: StateVector): Estimate => {
        const e = estimateByShots(s, operator, { shotsPerGroup: perGroup, rng: opts.rng, grouping });
        return { value: e.mean, stdError: e.stdError };
      }
    : (s: StateVector): Estimate => ({ value: exactExpectation(s, compiled), stdError: 0 });
  const { loop, trace, energy } = runVqeLoop(ansatz, estimate, (s) => exactExpectation(s, compiled), first, opts);
  return {
    params: Array.from(loop.x),
    paramNames: ansatz.paramNames,
    energy,
    objective: loop.fx,
    stdError: loop.stdError,
    expectation: null,
    evaluations: loop.evaluations,
    iterations: loop.iterations,
    restarts: loop.restarts,
    shotsUsed: opts.shots > 0 ? loop.evaluations * perGroup * groups : 0,
    trace,
    samples: [],
    best: null,
    feasibleShare: null,
    stopped: loop.reason === 'stopped',
  };
}
