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
import { defineSolver } from './define';
import { booleanField, intField, settingsObject } from './settings';

const batchMessage = (i: { input?: unknown }) => `give 'auto' or a share of the spins per round in 0…0.5 (0 = one per round; got ${JSON.stringify(i.input)})`;

const settings = settingsObject({
  stopAt: intField(16, 1, RQAOA_MAX_REMAINDER),
  batch: z.union([z.literal('auto'), z.number({ error: batchMessage }).min(0, { error: batchMessage }).max(0.5, { error: batchMessage })], { error: batchMessage }).default('auto'),
  refine: booleanField(true),
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
   * The widest state handled at once is the exact remainder (stopAt spins); the level-1 rounds
   * read an n-qubit circuit's expectations from the closed form without building its state.
   */
  qubits: (problem, s) => Math.min(s.stopAt, freeSpins(problem)),
  async solve(problem, s, ctx) {
    const started = performance.now();
    const elapsed = () => (performance.now() - started) / 1000;
    const spins = freeSpins(problem);
    const out = rqaoaOnProblem(problem, {
      stopAt: s.stopAt,
      batchFraction: s.batch === 'auto' ? defaultBatchFraction(spins) : s.batch,
      refine: s.refine,
      hurry: () => ctx.cancel?.cancelled === true || elapsed() >= HURRY_AT * ctx.timeLimitSeconds,
      overdue: () => ctx.cancel?.cancelled === true || elapsed() >= ctx.timeLimitSeconds,
      onRound: (r) => ctx.onProgress?.({ fraction: Math.min(1, Math.max(1 - r.spins / Math.max(1, spins), elapsed() / ctx.timeLimitSeconds)), iteration: r.round, energy: r.energy }),
    });
    const notes = [
      `${out.rounds} round(s) of level-1 QAOA on the closed form, ${out.steps.length} depot(s) eliminated, ${out.remainder} solved exactly at the end`,
      s.refine ? `classical local search refined the answer: ${out.unrefinedValue} before, ${out.value} after (${out.refineMoves} move(s))` : 'no classical refinement (the answer is the recursion\'s own)',
      'heuristic: no optimality guarantee',
    ];
    if (!out.feasible) notes.push('the answer breaks the balance rule (reported, not hidden)');
    return {
      value: out.value,
      assignment: Array.from(out.assignment),
      bound: null,
      gap: null,
      provenOptimal: false,
      energy: out.energy,
      expectation: out.expectation,
      params: [...out.params],
      seconds: elapsed(),
      evaluations: out.evaluations,
      shots: 0,
      notes,
      ...(out.feasible ? {} : { infeasible: true }),
      refinement: { applied: s.refine, unrefinedValue: out.unrefinedValue, unrefinedInfeasible: !out.unrefinedFeasible, moves: out.refineMoves },
      recursion: { rounds: out.rounds, remainder: out.remainder, eliminations: out.steps.slice(0, 2000), eliminationsTotal: out.steps.length, roundLog: out.roundLog },
    };
  },
});
