/**
 * `qaoa-blocks`: variational max-cut for networks beyond the statevector limit, by
 * decomposition into blocks of ≤ 20 depots, QAOA per block and a small orientation problem
 * over the blocks (Zhou, Du, Tian, Tao, arXiv:2205.11762 (2022); see variational/decompose.ts).
 */
import { parseNumberSettings, type NumberSchema } from '../classical/settings';
import { freeDepots } from '../classical/result';
import { crossingWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createRng } from '../random';
import { decomposeBisection, decomposeMaxcut } from '../variational/decompose';
import type { SolverDefinition, TracePoint } from './types';

const schema = {
  blockSize: { default: 14, min: 2, max: 20, integer: true },
  layers: { default: 2, min: 1, max: 6, integer: true },
  shots: { default: 0, min: 0, max: 100_000, integer: true },
  readoutShots: { default: 1024, min: 1, max: 100_000, integer: true },
  restarts: { default: 1, min: 1, max: 10, integer: true },
  maxIterations: { default: 150, min: 1, max: 5000, integer: true },
  mergeExactLimit: { default: 16, min: 1, max: 20, integer: true },
  rounds: { default: 3, min: 0, max: 20, integer: true },
} satisfies NumberSchema;

export type QaoaBlocksSettings = { [K in keyof typeof schema]: number };

export const qaoaBlocksSolver: SolverDefinition<QaoaBlocksSettings> & { simulatedQubits(problem: Problem, settings: QaoaBlocksSettings): number } = {
  name: 'qaoa-blocks',
  label: 'QAOA by blocks (decomposition for large networks)',
  family: 'variational',
  kinds: ['maxcut', 'bisection'],
  guarantee: 'Heuristic, no optimality guarantee: QAOA on blocks of at most blockSize depots, block orientations from a second small problem over the blocks, then local refinement; compare it with the classical best and the bound.',
  parseSettings: (input) => parseNumberSettings(input, schema),
  refuses(problem) {
    if (problem.kind === 'kway') return 'qaoa-blocks answers max-cut and balanced bisection; for k regions use qaoa (recursive bisection) on small networks, or fm / milp';
    return null;
  },
  /** Qubits simulated at once: one block (bisection: plus at most 5 slack qubits), never the whole network. */
  simulatedQubits: (problem, settings) => Math.min(settings.blockSize, freeDepots(problem.pins).length) + (problem.kind === 'bisection' ? 5 : 0),
  async solve(problem, s, ctx) {
    const started = performance.now();
    const elapsed = () => (performance.now() - started) / 1000;
    const rng = createRng(ctx.seed);
    const trace: TracePoint[] = [];
    let lastReport = -Infinity;
    const decompose = problem.kind === 'bisection' ? decomposeBisection : decomposeMaxcut;
    const outcome = decompose(problem, s, rng, {
      shouldStop: () => elapsed() >= ctx.timeLimitSeconds || ctx.cancel?.cancelled === true,
      onStep: (fraction, bestValue) => ctx.onProgress?.({ fraction: Math.max(fraction, Math.min(1, elapsed() / ctx.timeLimitSeconds)), bestValue }),
      onIteration: (p) => {
        trace.push({ iteration: p.iteration, energy: p.energy, stdError: p.stdError, seconds: elapsed() });
        if (elapsed() - lastReport >= 0.1) {
          lastReport = elapsed();
          ctx.onProgress?.({ fraction: Math.min(1, elapsed() / ctx.timeLimitSeconds), iteration: p.iteration, energy: p.energy, stdError: p.stdError });
        }
      },
    });
    const assignment = Array.from(outcome.assignment);
    const largest = outcome.blocks.reduce((q, b) => Math.max(q, b.qubits), 0);
    const how = { exact: 'exact enumeration', rqaoa: 'recursive QAOA (level 1, closed form)', local: 'greedy flips', single: 'none needed' }[outcome.merge.method];
    const notes = [
      `${outcome.merge.blocks} block(s) of at most ${s.blockSize} depots (largest circuit ${largest} qubits); block orientations by ${how}${problem.kind === 'bisection' ? ' under the balance rule' : ''} (gain ${outcome.merge.gain})`,
      problem.kind === 'maxcut'
        ? `merged cut ${outcome.mergedValue}; block re-solves with fixed surroundings gained ${outcome.roundsGain}; 1-flip refinement made ${outcome.refineFlips} flip(s)`
        : `merged crossing weight ${outcome.mergedValue}; flip-and-swap refinement inside the balance window made ${outcome.refineFlips} move(s)`,
      'heuristic: no optimality guarantee',
    ];
    if (outcome.stopped) notes.push('stopped early (time limit or cancel): later blocks kept their starting sides');
    return {
      value: crossingWeight(problem, assignment),
      assignment,
      bound: null,
      gap: null,
      provenOptimal: false,
      energy: null,
      expectation: null,
      params: null,
      seconds: elapsed(),
      evaluations: outcome.evaluations,
      shots: outcome.shots,
      trace,
      notes,
    };
  },
};
