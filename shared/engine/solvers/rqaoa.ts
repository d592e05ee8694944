/**
 * `rqaoa`: recursive QAOA for max-cut at any size and bisection up to 80 free depots
 * (Bravyi, Kliesch, Koenig & Tang, PRL 125, 260505 (2020); engine: variational/rqaoa.ts and
 * variational/rqaoa-problem.ts). Level-1 expectations come from the closed form, so no
 * statevector wider than the exact remainder (stopAt spins) is ever built.
 */
import { z } from 'zod';
import type { Problem } from '../problem/types';
import { defaultBatchFraction, RQAOA_MAX_REMAINDER } from '../variational/rqaoa';
import { rqaoaOnProblem, rqaoaRefusal } from '../variational/rqaoa-problem';
import { BLOCK_QAOA_DEFAULTS, descendByBlocks } from '../variational/block-stages';
import { crossingWeight } from '../problem/evaluate';
import { defineSolver } from './define';
import { booleanField, intField, settingsObject } from './settings';

const batchMessage = (i: { input?: unknown }) => `give 'auto' or a share of the spins per round in 0…0.5 (0 = one per round; got ${JSON.stringify(i.input)})`;

const settings = settingsObject({
  stopAt: intField(16, 1, RQAOA_MAX_REMAINDER),
  batch: z.union([z.literal('auto'), z.number({ error: batchMessage }).min(0, { error: batchMessage }).max(0.5, { error: batchMessage })], { error: batchMessage }).default('auto'),
  refine: booleanField(true),
  /**
   * Max-cut: after the recursion, QAOA descent rounds until the time limit (blocks of 14 re-solved
   * with their surroundings fixed, on a redrawn split each round; variational/block-stages.ts). What
   * it gains on the G-set is measured in docs/benchmarks.md, "Large variational".
   */
  descent: booleanField(true),
});

export type RqaoaSettings = z.output<typeof settings>;

const freeSpins = (problem: Problem) => {
  let free = 0;
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] < 0) free++;
  return free;
};

/** Share of the time limit after which later rounds take every candidate the cone rule allows… and more. */
const HURRY_AT = 0.6;

export const rqaoaSolver = defineSolver({
  name: 'rqaoa',
  label: 'Recursive QAOA (level 1, any size)',
  family: 'variational',
  kinds: ['maxcut', 'bisection'],
  guarantee: 'Heuristic, no optimality guarantee: one-layer QAOA correlations (exact closed form) fix depots round by round, the last few are solved exactly; optional classical refinement is reported with the value before it.',
  otherwise: 'qaoa (recursive bisection) on small networks, or fm / milp',
  settings,
  refuses: (problem) => rqaoaRefusal(problem),
  /**
   * The widest state handled at once is the exact remainder (stopAt spins) or, with the max-cut
   * descent, one block; the level-1 rounds read an n-qubit circuit's expectations from the closed
   * form without building its state.
   */
  qubits: (problem, s) => Math.min(Math.max(s.stopAt, s.descent && problem.kind === 'maxcut' ? BLOCK_QAOA_DEFAULTS.blockSize : 0), freeSpins(problem)),
  async solve(problem, s, ctx) {
    const started = performance.now();
    const elapsed = () => (performance.now() - started) / 1000;
    const spins = freeSpins(problem);
    const descend = s.descent && problem.kind === 'maxcut';
    const out = rqaoaOnProblem(problem, {
      stopAt: s.stopAt,
      batchFraction: s.batch === 'auto' ? defaultBatchFraction(spins) : s.batch,
      // With the descent, the classical refinement runs once, after it (descendByBlocks).
      refine: s.refine && !descend,
      hurry: () => ctx.cancel?.cancelled === true || elapsed() >= HURRY_AT * ctx.timeLimitSeconds,
      overdue: () => ctx.cancel?.cancelled === true || elapsed() >= ctx.timeLimitSeconds,
      onRound: (r) => ctx.onProgress?.({ fraction: Math.min(1, Math.max(1 - r.spins / Math.max(1, spins), elapsed() / ctx.timeLimitSeconds)), iteration: r.round, energy: r.energy }),
    });
    const descent = descend
      ? descendByBlocks(problem, out.assignment, { ...BLOCK_QAOA_DEFAULTS, refine: s.refine }, ctx.seed, {
        shouldStop: () => ctx.cancel?.cancelled === true || elapsed() >= ctx.timeLimitSeconds,
        onStep: (_f, bestValue) => ctx.onProgress?.({ fraction: Math.min(1, elapsed() / ctx.timeLimitSeconds), bestValue }),
      }, ctx.stateKernels)
      : null;
    const assignment = descent ? descent.assignment : out.assignment;
    const value = descent ? crossingWeight(problem, assignment) : out.value;
    const unrefinedValue = descent ? descent.unrefinedValue : out.unrefinedValue;
    const refineMoves = descent ? descent.refineFlips : out.refineMoves;
    const notes = [
      `${out.rounds} round(s) of level-1 QAOA on the closed form, ${out.steps.length} depot(s) eliminated, ${out.remainder} solved exactly at the end${descent ? ` (cut ${out.unrefinedValue})` : ''}`,
      ...(descent ? [`${descent.rounds} QAOA descent round(s) on blocks of ${BLOCK_QAOA_DEFAULTS.blockSize} with fixed surroundings gained ${descent.roundsGain}`] : []),
      s.refine ? `classical local search refined the answer: ${unrefinedValue} before, ${value} after (${refineMoves} move(s))` : 'no classical refinement (the answer is the variational method\'s own)',
      'heuristic: no optimality guarantee',
    ];
    if (!out.feasible) notes.push('the answer breaks the balance rule (reported, not hidden)');
    return {
      value,
      assignment: Array.from(assignment),
      bound: null,
      gap: null,
      provenOptimal: false,
      energy: out.energy,
      expectation: out.expectation,
      params: [...out.params],
      seconds: elapsed(),
      evaluations: out.evaluations + (descent?.evaluations ?? 0),
      shots: descent?.shots ?? 0,
      notes,
      ...(out.feasible ? {} : { infeasible: true }),
      refinement: { applied: s.refine, unrefinedValue, unrefinedInfeasible: !out.unrefinedFeasible, moves: refineMoves },
      recursion: { rounds: out.rounds, remainder: out.remainder, eliminations: out.steps.slice(0, 2000), eliminationsTotal: out.steps.length, roundLog: out.roundLog },
    };
  },
});
