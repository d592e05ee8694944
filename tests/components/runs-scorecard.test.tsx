import { act, render, screen, within } from '@testing-library/react';
import { Scorecard } from '../../components/runs/Scorecard';
import { buildScorecard } from '../../components/runs/scorecard';
import { formatGap, formatRatio } from '../../components/runs/format';
import type { JobResult, JobStatus, ScorableRun } from '../../components/runs/types';

type Job = ScorableRun['jobs'][number];

/** A finished job with just the figures the scorecard reads. */
function job(id: number, solver: string, r: Partial<JobResult> & { value: number }, status: JobStatus = 'succeeded'): Job {
  return {
    id,
    solver,
    status,
    error: null,
    result: { assignment: [], bound: null, gap: null, energy: null, expectation: null, params: null, seconds: 0.5, evaluations: 100, shots: 0, provenOptimal: false, ...r },
  };
}

function run(kind: ScorableRun['problem']['kind'], jobs: Job[], bound?: number | null): ScorableRun {
  return { problem: { kind }, jobs, bound };
}

describe('buildScorecard (best answer, ratio, gap)', () => {
  test('a split against the trivial bound 0 shows no ratio or gap (not 0.000 and 100 %), and the bound line says why', () => {
    // Crossing weight is a sum of non-negative lane weights, so 0 bounds every split: it proves nothing.
    const card = buildScorecard(run('kway', [job(1, 'fm', { value: 41, bound: 0 })]));
    expect(card.bound).toBe(0);
    expect(card.rows[0].ratio).toBeNull();
    expect(card.rows[0].gap).toBeNull();
    render(<Scorecard card={card} valueName="Crossing weight" wide={false} />);
    expect(screen.getByText(/no ratio or gap is shown/)).toBeTruthy();
    // An answer that reaches the bound 0 is still proven best.
    const zero = buildScorecard(run('bisection', [job(1, 'fm', { value: 0, bound: 0 })]));
    expect(zero.rows[0].ratio).toBe(1);
    expect(zero.rows[0].gap).toBe(0);
  });

  // K4 with unit lanes: max cut = ⌊n²/4⌋ = 4 (textbook max-cut value for K_n, common practice).
  // The exact solver proves 4; a 3-lane answer (one depot alone) is a valid but worse cut.
  const k4 = run('maxcut', [
    job(1, 'exact', { value: 4, provenOptimal: true, bound: 4 }),
    job(2, 'tabu', { value: 4 }),
    job(3, 'qaoa', { value: 3, shots: 2048, seconds: 2.1 }),
  ]);

  test('max-cut: the highest cut is best; ratio value/bound and gap (bound − value)/bound', () => {
    const card = buildScorecard(k4);
    expect(card.sense).toBe('max');
    expect(card.bound).toBe(4);
    expect(card.rows.map((r) => r.isBest)).toEqual([true, true, false]);
    expect(card.bestJobId).toBe(1);
    const qaoa = card.rows[2];
    expect(qaoa.ratio).toBeCloseTo(3 / 4, 12);
    // SolveResult's documented gap for max: (bound − value)/bound = 1/4.
    expect(qaoa.gap).toBeCloseTo(0.25, 12);
    expect(formatRatio(qaoa.ratio)).toBe('0.750');
    expect(formatGap(qaoa.gap)).toBe('25.0 %');
    expect(formatGap(card.rows[0].gap)).toBe('0 %');
  });

  test('max-cut: the tightest of several upper bounds is used (the lowest)', () => {
    // Mohar–Poljak's eigenvalue bound for K4 is (n/4)·λ_max(L) = 1·4 = 4 (Mohar & Poljak 1990);
    // a looser bound (the total weight, 6) must not win.
    const card = buildScorecard(run('maxcut', [job(1, 'tabu', { value: 4, bound: 6 }), job(2, 'gw', { value: 3, bound: 4 })]));
    expect(card.bound).toBe(4);
    expect(card.rows[0].ratio).toBe(1);
  });

  test('bisection: the lowest crossing among balanced answers is best; an unbalanced 0 is never best', () => {
    // Cycle C6: minimum bisection = 2 (textbook, common practice). Putting every depot on one
    // side crosses 0 lanes but breaks the balance rule, so it must not be marked best.
    const c6 = run('bisection', [
      job(1, 'exact', { value: 2, provenOptimal: true, bound: 2 }),
      job(2, 'fm', { value: 4 }),
      job(3, 'qaoa', { value: 0, infeasible: true, shots: 1000 }),
    ]);
    const card = buildScorecard(c6);
    expect(card.sense).toBe('min');
    expect(card.rows.map((r) => r.isBest)).toEqual([true, false, false]);
    expect(card.rows[2].balanced).toBe(false);
    // For min questions the ratio is bound/value and the gap (value − bound)/value.
    expect(card.rows[1].ratio).toBeCloseTo(0.5, 12);
    expect(card.rows[1].gap).toBeCloseTo(0.5, 12);
    expect(formatGap(card.rows[1].gap)).toBe('50.0 %');
  });

  test('without any bound the ratio and gap are shown as unknown, the best is still marked', () => {
    const card = buildScorecard(run('kway', [job(1, 'fm', { value: 7 }), job(2, 'anneal', { value: 5 }), job(3, 'qaoa', { value: 0 }, 'running')]));
    expect(card.bound).toBeNull();
    expect(card.rows[0].ratio).toBeNull();
    expect(formatRatio(card.rows[0].ratio)).toBe('—');
    // The running job has no answer yet and cannot be best.
    expect(card.rows.map((r) => r.isBest)).toEqual([false, true, false]);
  });

  test('failed jobs carry their error and no value', () => {
    const failed: Job = { ...job(2, 'vqe', { value: 0 }), status: 'failed', result: null, error: 'too many qubits' };
    const card = buildScorecard(run('maxcut', [job(1, 'tabu', { value: 4 }), failed]));
    expect(card.rows[1].value).toBeNull();
    expect(card.rows[1].error).toBe('too many qubits');
    expect(card.rows[0].isBest).toBe(true);
  });
});

describe('<Scorecard>', () => {
  const k4 = run('maxcut', [
    job(1, 'exact', { value: 4, provenOptimal: true, bound: 4 }),
    job(2, 'qaoa', { value: 3, shots: 2048 }),
  ]);

  test('phone: one card per solver, best and proven-optimal badges, ratio shown', () => {
    render(<Scorecard card={buildScorecard(k4, { exact: 'Exact enumeration', qaoa: 'QAOA' })} valueName="Cut weight" wide={false} />);
    const exact = screen.getByTestId('score-exact');
    expect(within(exact).getByText('Exact enumeration')).toBeTruthy();
    expect(screen.getByTestId('best-exact')).toBeTruthy();
    expect(screen.getByTestId('proven-exact')).toBeTruthy();
    expect(screen.queryByTestId('best-qaoa')).toBeNull();
    expect(screen.getByTestId('ratio-qaoa').textContent).toBe('0.750');
    expect(screen.getByTestId('gap-qaoa').textContent).toBe('25.0 %');
    expect(screen.getByTestId('shots-qaoa').textContent).toBe('2,048');
    expect(screen.getByTestId('shots-exact').textContent).toBe('—');
  });

  test('wide: a table with the value column named for the question, rows selectable', () => {
    const picked: number[] = [];
    render(<Scorecard card={buildScorecard(k4)} valueName="Cut weight" wide onSelect={(id) => picked.push(id)} />);
    expect(screen.getByText('Cut weight')).toBeTruthy();
    expect(screen.getByTestId('value-qaoa').textContent).toBe('3');
    expect(screen.getByTestId('best-exact')).toBeTruthy();
    expect(screen.getByTestId('optimal-qaoa').textContent).toBe('No');
    act(() => {
      screen.getByTestId('score-qaoa').click();
    });
    expect(picked).toEqual([2]);
  });
});
