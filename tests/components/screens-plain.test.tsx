import { render, screen } from '@testing-library/react';
import { LedgerHistory } from '../../components/billing/LedgerHistory';
import { ledgerLines } from '../../components/billing/ledger-lines';
import { paymentNotice } from '../../components/billing/RunPaymentPanel';
import { jobStatusLine, runClock } from '../../components/runs/progress';
import { formatDate, formatDateTime } from '../../components/ui/dates';
import { formatWhen } from '../../components/networks/format';
import { shortDate } from '../../components/billing/format';
import { formatDate as teamDate, formatDateTime as teamDateTime } from '../../components/team/format';
import { shouldRetry } from '../../components/queries/client';
import { ApiError } from '../../components/api/client';
import type { LedgerEntryView } from '../../shared/schemas/billing';
import type { RunJob } from '../../components/runs/types';

jest.mock('expo-router', () => ({ useRouter: () => ({ push: jest.fn(), replace: jest.fn() }), useLocalSearchParams: () => ({}) }));

/** Screens say plainly what the data says: one payment is one line, one clock per state, one date style. */

const entry = (id: number, kind: string, amount: number, balanceAfter: number, paymentId: number | null, note: string | null = null): LedgerEntryView => ({
  id, kind, amount, currency: 'eur', balanceAfter, runId: 7, paymentId, eventId: null, note, createdAt: '2026-12-01T10:00:00.000Z',
});

test('billing history: a run paid by card is one line, not +€2.50 and −€2.50', () => {
  // Newest first, as the API answers: the spend (id 12) follows the card payment (id 11).
  const entries = [entry(12, 'run_spend', -250, 1000, 5, 'Run #7 paid by card'), entry(11, 'run_payment', 250, 1250, 5, 'Card payment for run #7'), entry(10, 'credit_purchase', 1000, 1000, 4)];
  const lines = ledgerLines(entries);
  expect(lines.map((l) => l.kind)).toEqual(['run_card', 'credit_purchase']);
  expect(lines[0]).toMatchObject({ byCard: 250, amount: 0, balanceAfter: 1000, note: 'Run #7 paid by card' });
  render(<LedgerHistory entries={entries} />);
  expect(screen.queryByText('+€2.50')).toBeNull();
  expect(screen.queryByText('−€2.50')).toBeNull();
  expect(screen.getByText('€2.50 by card')).toBeTruthy();
  expect(screen.getByText('Run paid by card')).toBeTruthy();
  // Credits spent on a run stay a signed line of their own.
  expect(ledgerLines([entry(20, 'run_spend', -300, 700, null)])[0]).toMatchObject({ kind: 'run_spend', amount: -300, byCard: null });
});

test('payment return: back from a successful payment, an earlier decline is not shown beside "Confirming"', () => {
  expect(paymentNotice('success', 'Your card was declined.')).toBe('confirming');
  expect(paymentNotice(undefined, 'Your card was declined.')).toBe('failed');
  expect(paymentNotice('cancelled', 'Your card was declined.')).toBe('failed');
  expect(paymentNotice('cancelled', null)).toBe('cancelled');
  expect(paymentNotice(undefined, null)).toBeNull();
});

const job = (over: Partial<RunJob>): RunJob => ({
  id: 1, position: 0, solver: 'tabu', label: 'Tabu search', family: 'heuristic', settings: {}, status: 'queued', progress: 0, live: null, attempt: 1,
  queuedAt: '2026-12-01T10:00:00.000Z', startedAt: null, finishedAt: null, result: null, error: null, ...over,
});
const result = (seconds: number) => ({ value: 10, assignment: [], bound: null, gap: null, energy: null, expectation: null, params: null, seconds, evaluations: 1, shots: 0, provenOptimal: false });
const NOW = Date.parse('2026-12-01T10:00:30.000Z');

test('a solver of a run that waits for payment waits for the payment, with no clock', () => {
  expect(jobStatusLine(job({}), 'awaiting_payment', NOW)).toBe('Waiting for payment');
  expect(jobStatusLine(job({}), 'queued', NOW)).toBe('Waiting for a worker');
  expect(runClock({ status: 'awaiting_payment', createdAt: '2026-12-01T10:00:00.000Z', releasedAt: null, finishedAt: null, jobs: [job({})] }, false, NOW)).toBe('');
});

test('an exact energy has no "± 0"; an estimate keeps its standard error', () => {
  const running = (stdError: number | undefined) => job({ status: 'running', startedAt: '2026-12-01T10:00:10.000Z', progress: 0.5, live: { energy: 6560.3, stdError, bestValue: 12 } as RunJob['live'] });
  expect(jobStatusLine(running(0), 'running', NOW)).toBe('Running · 20.0 s · best so far 12 · energy 6,560.3');
  expect(jobStatusLine(running(1.25), 'running', NOW)).toBe('Running · 20.0 s · best so far 12 · energy 6,560.3 ± 1.25');
});

test('"Took" is never shorter than the slowest solver (the run times are whole seconds)', () => {
  const run = { status: 'succeeded' as const, createdAt: '2026-12-01T10:00:00.000Z', releasedAt: null, finishedAt: '2026-12-01T10:00:00.000Z', jobs: [job({ status: 'succeeded', result: result(0.45) }), job({ status: 'succeeded', result: result(0.1) })] };
  expect(runClock(run, false, NOW)).toBe('Took 0.45 s');
  expect(runClock({ ...run, finishedAt: '2026-12-01T10:00:03.000Z' }, false, NOW)).toBe('Took 3.00 s');
  expect(runClock({ ...run, status: 'running', finishedAt: null }, true, NOW)).toBe('Elapsed 30.0 s');
});

test('one date style on every screen', () => {
  const iso = '2026-09-04T08:05:00';
  expect(formatDate(iso)).toBe('4 Sep 2026');
  expect(formatDateTime(iso)).toBe('4 Sep 2026, 08:05');
  for (const f of [formatWhen, teamDateTime]) expect(f(iso)).toBe(formatDateTime(iso));
  for (const f of [shortDate, teamDate]) expect(f(iso)).toBe(formatDate(iso));
  expect(formatDate(null)).toBe('—');
});

test('a missing or refused resource is not asked for again (it answers at once); outages are', () => {
  expect(shouldRetry(0, new ApiError(404, 'Network not found.'))).toBe(false);
  expect(shouldRetry(0, new ApiError(403, 'no'))).toBe(false);
  expect(shouldRetry(0, new ApiError(503, 'busy'))).toBe(true);
  expect(shouldRetry(0, new ApiError(0, 'offline'))).toBe(true);
  expect(shouldRetry(3, new ApiError(0, 'offline'))).toBe(false);
});

import { costLine, fieldProblems, solverLine, typedProblems } from '../../components/runs/setup-words';
import { DEFAULT_ADVANCED } from '../../components/runs/setup';

test('run setup: one plain line per solver and for the run, no formulas', () => {
  const q = { solver: 'qaoa', qubits: 15, estimatedSeconds: { atMost: 12.3 } };
  expect(solverLine(q, null, 1)).toBe('needs 15 qubits · about 12 s · free');
  const price = { amount: 300, currency: 'eur', lines: [{ label: 'Large solve', amount: 200 }, { label: 'Solver 2: 3 qubits above 12', amount: 100 }] };
  expect(solverLine(q, price, 2)).toBe('needs 15 qubits · about 12 s · €1.00 for its qubits');
  expect(solverLine({ solver: 'tabu', qubits: null, estimatedSeconds: { atMost: 10 } }, price, 1)).toBe('about 10 s · in the run price');
  expect(solverLine({ solver: 'vqe', refusal: 'needs 30 qubits; the limit is 24' }, null, 3)).toBe('Will not run here: needs 30 qubits; the limit is 24');
  expect(costLine(null)).toBe('This run is free on your plan.');
  expect(costLine({ ...price, label: '€3.00' })).toBe('This run costs €3.00; it starts once it is paid.');
  for (const line of [solverLine(q, price, 2)!, costLine(price)]) expect(line).not.toMatch(/[Σ⌈⌉ε×^]|2\^/);
});

test('run setup: a bad advanced value is a sentence on its field, never a path', () => {
  const problems = fieldProblems({ 'solvers.2.settings.layers': ['must lie in 1…10 (got -3)'], timeLimitSeconds: ['must be positive'] }, (i) => ['Exact enumeration', 'Tabu search', 'QAOA (simulated quantum circuit)'][i]);
  expect(problems).toEqual([
    { field: 'layers', text: 'Circuit layers (QAOA (simulated quantum circuit)): must lie in 1…10 (you entered -3).' },
    { field: 'timeLimitSeconds', text: 'Time limit per solver: must be positive.' },
  ]);
  expect(problems.map((p) => p.text).join(' ')).not.toMatch(/solvers\.\d/);
  expect(typedProblems({ ...DEFAULT_ADVANCED, layers: 'two', shots: '1.5' })).toEqual([
    { field: 'layers', text: 'Circuit layers: enter a whole number (you entered “two”).' },
    { field: 'shots', text: 'Shots per energy estimate: enter a whole number (you entered “1.5”).' },
  ]);
  expect(typedProblems(DEFAULT_ADVANCED)).toEqual([]);
});

import { SampleHistogram } from '../../components/charts/SampleHistogram';
import { ConvergenceChart } from '../../components/charts/ConvergenceChart';
import { colors } from '../../components/theme';

test('the histogram has a count scale: whole-shot ticks from 0 to the tallest bar', () => {
  const samples = [
    { assignment: [0, 1, 1], count: 300, value: 5 },
    { assignment: [1, 0, 0], count: 120, value: 5 },
    { assignment: [0, 0, 1], count: 40, value: 3 },
  ];
  const { container } = render(<SampleHistogram samples={samples} sense="max" width={360} />);
  const ticks = Array.from(container.querySelectorAll('[data-testid="histogram-tick"]')).map((t) => Number((t.textContent ?? '').replace(/,/g, '')));
  expect(ticks[0]).toBe(0);
  expect(ticks.length).toBeGreaterThan(2);
  expect(Math.max(...ticks)).toBeLessThanOrEqual(300);
  expect(Math.max(...ticks)).toBeGreaterThanOrEqual(200);
  expect(ticks.every(Number.isInteger)).toBe(true);
  expect(container.textContent).toMatch(/shots/);
});

test('the convergence chart explains restarts and draws a visible standard-error band with its typical size', () => {
  const trace = [
    { iteration: 0, energy: -10, stdError: 1.5 },
    { iteration: 1, energy: -12, stdError: 1.5 },
    { iteration: 2, energy: -8, stdError: 2 }, // a new start: the energy jumps up
    { iteration: 3, energy: -13, stdError: 1.5 },
  ];
  const { container, getByTestId } = render(<ConvergenceChart trace={trace} width={360} restarts={2} />);
  expect(getByTestId('convergence-restarts').textContent).toMatch(/starts 2 times .* jump upward/);
  const band = container.querySelector('[data-testid="convergence-band"]')!;
  expect(Number(band.getAttribute('fill-opacity'))).toBeGreaterThanOrEqual(0.45);
  expect(band.getAttribute('stroke')).toBe(colors.signalDeep);
  expect(container.textContent).toMatch(/typically ± 1\.5/);
});

test('the convergence chart marks each restart where it begins and names it in the note', () => {
  const trace = [
    { iteration: 0, energy: -10, start: 0 },
    { iteration: 1, energy: -12, start: 0 },
    { iteration: 2, energy: -8, start: 1 }, // start 2 begins: the energy jumps up
    { iteration: 3, energy: -13, start: 1 },
    { iteration: 4, energy: -9, start: 2 }, // start 3
    { iteration: 5, energy: -12.5, start: 2 },
  ];
  const { container, getByTestId } = render(<ConvergenceChart trace={trace} width={360} restarts={3} />);
  const marks = Array.from(container.querySelectorAll('[data-testid="convergence-restart-marker"]'));
  expect(marks.map((m) => m.textContent)).toEqual(['start 2', 'start 3']);
  expect(getByTestId('convergence-restarts').textContent).toMatch(/Dashed lines mark .*start 2, start 3.*best over all 3 starts/);
  // Without start indices (live points) there is nothing to mark, and the note explains jumps in general.
  const plain = render(<ConvergenceChart trace={trace.map(({ start: _s, ...p }) => p)} width={360} />);
  expect(plain.container.querySelectorAll('[data-testid="convergence-restart-marker"]').length).toBe(0);
});
