/** `qaoa`: a p-layer QAOA circuit on the CPU statevector, optimised, then read out (k regions: recursive bisection by default). */
import { warmProbabilities } from '../circuits/warm';
import { createRng } from '../random';
import { runQaoa } from '../variational/qaoa-run';
import { plannedCircuit, type AnsatzOf } from './circuit-plan';
import { widestCircuit } from './circuit-qubits';
import { defineSolver } from './define';
import { booleanField, numberField, settingsObject } from './settings';
import { circuitQubits, commonFields, refuseWide, resolveOptimizer, solveVariational, warmStartFrom } from './variational-common';

const settings = settingsObject({
  ...commonFields,
  warmStart: booleanField(false),
  warmStartEpsilon: numberField(0.25, 0, 0.5),
}).transform(resolveOptimizer);

export type QaoaSettings = ReturnType<typeof qaoaSolver.parseSettings>;

/** QAOA's circuit: p layers, warm-started from the classical answer when there is one. */
const qaoaAnsatz = (s: { layers: number; warmStartEpsilon: number }): AnsatzOf => (encoding, warm) =>
  ({ ansatz: 'qaoa', layers: s.layers, ...(warm ? { warmStart: { probabilities: warmProbabilities(encoding, warm), epsilon: s.warmStartEpsilon } } : {}) });

export const qaoaSolver = defineSolver({
  name: 'qaoa',
  label: 'QAOA (simulated quantum circuit)',
  family: 'variational',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'No optimality guarantee: returns the best sampled answer of an optimised p-layer QAOA circuit on an exact CPU statevector; balance is checked, never assumed.',
  settings,
  qubits: circuitQubits,
  circuit: widestCircuit,
  // The same warm-start call as solve (its first use of the seeded generator).
  plannedCircuit: (problem, s, seed) => plannedCircuit(problem, s, qaoaAnsatz(s), s.warmStart ? () => warmStartFrom(problem, createRng(seed)) : null),
  refuses: refuseWide,
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    return solveVariational(problem, s, ctx, {
      spec: qaoaAnsatz(s),
      run: (encoding, warm, shouldStop, onIteration) => runQaoa({
        encoding, layers: s.layers, optimizer: s.optimizer, shots: s.shots, readoutShots: s.readoutShots,
        restarts: s.restarts, maxIterations: s.maxIterations, rng, shouldStop, onIteration,
        warmStart: warm ? { assignment: warm, epsilon: s.warmStartEpsilon } : undefined,
        stateOptions: { maxQubits: s.maxQubits, kernels: ctx.stateKernels }, cvarAlpha: s.cvarAlpha,
      }),
    }, s.warmStart ? () => warmStartFrom(problem, rng) : null);
  },
});
