/** `vqe`: a hardware-efficient ansatz (ladder or alternating) on the CPU statevector, optimised, then read out. */
import { createRng } from '../random';
import { runVqeOnEncoding } from '../variational/vqe-run';
import { widestCircuit } from './circuit-qubits';
import { defineSolver } from './define';
import { choiceField, settingsObject } from './settings';
import { circuitQubits, commonFields, refuseWide, resolveOptimizer, solveVariational } from './variational-common';

const settings = settingsObject({
  ...commonFields,
  ansatz: choiceField(['ladder', 'alternating'] as const, 'ladder'),
  entangler: choiceField(['ring', 'line'] as const, 'ring'),
}).transform(resolveOptimizer);

export type VqeSettings = ReturnType<typeof vqeSolver.parseSettings>;

export const vqeSolver = defineSolver({
  name: 'vqe',
  label: 'VQE (simulated quantum circuit)',
  family: 'variational',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'No optimality guarantee: returns the best sampled answer of a variationally optimised circuit (ladder or alternating ansatz) on an exact CPU statevector; balance is checked, never assumed.',
  settings,
  qubits: circuitQubits,
  circuit: widestCircuit,
  refuses: refuseWide,
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    return solveVariational(problem, s, ctx, {
      spec: () => (s.ansatz === 'ladder' ? { ansatz: 'ladder', layers: s.layers, entangler: s.entangler } : { ansatz: 'qaoa', layers: s.layers }),
      run: (encoding, _warm, shouldStop, onIteration) => runVqeOnEncoding(encoding, {
        ansatz: s.ansatz, layers: s.layers, entangler: s.entangler, optimizer: s.optimizer, shots: s.shots,
        readoutShots: s.readoutShots, restarts: s.restarts, maxIterations: s.maxIterations, rng, shouldStop, onIteration,
        stateOptions: { maxQubits: s.maxQubits },
      }),
    }, null);
  },
});
