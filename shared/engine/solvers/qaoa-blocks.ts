/**
 * `qaoa-blocks`: variational max-cut and bisection for networks beyond the statevector limit, by
 * decomposition into blocks of ≤ blockSize depots, QAOA per block and a small orientation problem
 * over the blocks (after Zhou, Du, Tian, Tao, arXiv:2205.11762 (2022); see variational/decompose.ts).
 */
import { freeDepots } from '../classical/result';
import { crossingWeight, isBalanced } from '../problem/evaluate';
import { createRng } from '../random';
import { decomposeBisection, decomposeMaxcut } from '../variational/decompose';
import { defineSolver } from './define';
import { booleanField, intField, settingsObject } from './settings';
import type { TracePoint } from './types';
/** Depots per block unless the block size setting says otherwise. */
const DEFAULT_BLOCK_SIZE = 14;

const settings = settingsObject({
  blockSize: intField(DEFAULT_BLOCK_SIZE, 2, 20),
  layers: intField(2, 1, 6),
  shots: intField(0, 0, 100_000),
  readoutShots: intField(1024, 1, 100_000),
  restarts: intField(1, 1, 10),
  maxIterations: intField(150, 1, 5000),
  mergeExactLimit: intField(16, 1, 20),
  rounds: intField(3, 0, 20),
  /** Classical local search on the answer (reported with the value before it; decompose.ts). */
  refine: booleanField(true),
});

/** Most slack qubits a block's bisection encoding adds (encodings/bisection.ts maxSlackBits default). */
const BLOCK_SLACK_QUBITS = 5;

export const qaoaBlocksSolver = defineSolver({
  name: 'qaoa-blocks',
  label: 'QAOA by blocks (decomposition for large networks)',
  family: 'variational',
  kinds: ['maxcut', 'bisection'],
  guarantee: `Heuristic, no optimality guarantee: QAOA on blocks of at most ${DEFAULT_BLOCK_SIZE} depots (the block size setting), block orientations from a second small problem over the blocks, then local refinement; compare it with the classical best and the bound.`,
  otherwise: 'qaoa (recursive bisection) on small networks, or fm / milp',
  settings,
  /**
   * The widest circuit: one block (bisection: plus its slack qubits, at most), never the whole
   * network; the block orientations use exact enumeration or level-1 recursive QAOA from its
   * closed form, which simulates no wider state.
   */
  qubits(problem, s) {
    const block = Math.min(s.blockSize, freeDepots(problem.pins).length);
    return block > 0 && problem.kind === 'bisection' ? block + BLOCK_SLACK_QUBITS : block;
  },
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
        ? `merged cut ${outcome.mergedValue}; block re-solves with fixed surroundings gained ${outcome.roundsGain}; ${s.refine ? `1-flip refinement made ${outcome.refineFlips} flip(s)` : 'no classical refinement'}`
        : `merged crossing weight ${outcome.unrefinedValue}; ${s.refine ? `whole-block moves and flip-and-swap refinement inside the balance window made ${outcome.refineFlips} move(s)` : 'no classical refinement'}`,
      s.refine ? `classical local search refined the answer: ${outcome.unrefinedValue} before it${problem.kind === 'maxcut' ? ' (after the merge; the improvement rounds interleave with it)' : ''}` : 'the answer is the blocks\' QAOA and the merge alone (refine off)',
      'heuristic: no optimality guarantee',
    ];
    if (outcome.stopped) notes.push('stopped early (time limit or cancel): later blocks kept their starting sides');
    const feasible = isBalanced(problem, assignment);
    if (!feasible) notes.push('the answer breaks the balance rule (reported, not hidden)');
    return {
      ...(feasible ? {} : { infeasible: true }),
      refinement: { applied: s.refine, unrefinedValue: outcome.unrefinedValue, unrefinedInfeasible: !outcome.unrefinedFeasible, moves: outcome.refineFlips },
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
});
