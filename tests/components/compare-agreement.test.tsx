/**
 * One rule for "which answer is better" (shared/engine/problem/compare.ts): the scorecard and the
 * sample histogram must agree. The reproduction: a bisection run whose read-out held an unbalanced
 * sample of crossing weight 851 and a balanced one of 852; the histogram marked 851 "best" while
 * the scorecard (rightly) showed 852.
 */
import { histogramBars } from '../../components/charts/histogram';
import { buildScorecard } from '../../components/runs/scorecard';
import { startBlockers } from '../../components/runs/setup';
import type { ScorableRun } from '../../components/runs/types';

const samples = [
  { assignment: [0, 0, 0, 1], count: 300, value: 851, feasible: false }, // unbalanced: three depots on one side
  { assignment: [0, 0, 1, 1], count: 200, value: 852, feasible: true },
  { assignment: [0, 1, 0, 1], count: 100, value: 900, feasible: true },
];

const run: ScorableRun = {
  problem: { kind: 'bisection' },
  jobs: [{
    id: 1, solver: 'qaoa', status: 'succeeded', error: null,
    result: { value: 852, assignment: [0, 0, 1, 1], bound: null, gap: null, energy: -1, expectation: 870, params: [0.1, 0.2], seconds: 1, evaluations: 40, shots: 1024, provenOptimal: false, samples },
  }],
};

test('the histogram marks the best feasible sample, the same value the scorecard shows', () => {
  const bars = histogramBars(samples, { width: 300, height: 120 }, { sense: 'min' });
  const best = bars.filter((b) => b.best);
  expect(best.map((b) => b.value)).toEqual([852]);
  expect(bars.find((b) => b.value === 851)).toMatchObject({ best: false, feasible: false });
  const card = buildScorecard(run);
  expect(card.rows.find((r) => r.isBest)!.value).toBe(best[0].value);
});

test('max-cut: equal values tie as best; samples stored without feasibility are not guessed for balanced questions', () => {
  const cut = [{ assignment: [0, 1], count: 5, value: 7 }, { assignment: [1, 0], count: 3, value: 7 }, { assignment: [0, 0], count: 9, value: 0 }];
  expect(histogramBars(cut, { width: 300, height: 120 }, { sense: 'max' }).filter((b) => b.best).map((b) => b.count)).toEqual([5, 3]);
  const old = samples.map(({ feasible: _f, ...rest }) => rest);
  expect(histogramBars(old, { width: 300, height: 120 }, { sense: 'min' }).some((b) => b.best)).toBe(false);
});

test('Start follows the server preview of this very body: blockers from the API keep it disabled', () => {
  const preview = { blockers: [], solvers: [{ solver: 'qaoa', refusal: null, allowed: true }] };
  expect(startBlockers(preview, ['qaoa'], true)).toEqual({ pending: false, reasons: [] });
  expect(startBlockers(preview, ['qaoa'], false).pending).toBe(true); // the previous body's preview does not count
  const refused = { blockers: ['The Fleet plan allows 24 qubits.'], solvers: [{ solver: 'qaoa', refusal: null, allowed: true }] };
  expect(startBlockers(refused, ['qaoa'], true).reasons).toEqual(['The Fleet plan allows 24 qubits.']);
  const custom = { solvers: [{ solver: 'vqe', label: 'VQE', refusal: null, allowed: false }] };
  expect(startBlockers(custom, ['vqe'], true).reasons[0]).toMatch(/runs:advanced/);
});
