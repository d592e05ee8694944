import { render, screen } from '@testing-library/react';
import { refusedChosen } from '../../components/runs/setup';
import { afterSignIn } from '../../components/auth/next';
import { shortDate } from '../../components/billing/format';
import { PlanCard } from '../../components/billing/PlanCard';
import { formatMoney, priceOfRun } from '../../shared/plans';
import type { BillingSummary } from '../../shared/schemas/billing';

// Fixes from the end-to-end product walk (phone and wide): each check here failed before its fix.

describe('money and dates as customers read them', () => {
  const teamSummary = {
    plan: { id: 'team', label: 'Team', includedDepots: 2000, includedQubits: 22, includedSeconds: 600, monthlyFreeRuns: 1000 },
    runsThisMonth: 1,
  } as unknown as BillingSummary;

  test('large quotes are grouped by thousands, cents kept (common practice for en-GB amounts)', () => {
    expect(formatMoney({ amount: 3932295, currency: 'eur' })).toBe('€39,322.95');
    expect(formatMoney({ amount: 100000000, currency: 'eur' })).toBe('€1,000,000.00');
    expect(formatMoney({ amount: 575, currency: 'eur' })).toBe('€5.75');
  });

  test('billing dates use the day-month-year style of the team and audit screens, not the browser locale', () => {
    expect(shortDate('2026-12-01T20:06:00Z')).toBe('1 Dec 2026');
    expect(shortDate(null)).toBe('—');
  });

  test('a paid plan card says what is included, not "Free:"', () => {
    render(<PlanCard summary={teamSummary} />);
    const text = screen.getByTestId('billing-plan').textContent ?? '';
    expect(text).not.toMatch(/Free:/);
    expect(text).toContain('Included at no charge: runs up to 2,000 depots, 22 qubits and 600 s per solver — 1 of 1,000 included runs used this month.');
  });

  test('the qubit surcharge reads as prices, not a formula, and equals what a run above the qubits is charged', () => {
    render(<PlanCard summary={teamSummary} />);
    const line = screen.getByTestId('plan-qubit-price').textContent ?? '';
    expect(line).not.toMatch(/\^|extra −|× \(/);
    // The same rule prices a run: one QAOA solver 2 qubits above the Team plan's included 22.
    const run = priceOfRun('team', { depots: 10, secondsPerSolver: 10, solvers: [{ family: 'variational', qubits: 24 }] })!;
    const qubitLine = run.lines.find((l) => l.label.includes('qubits above'))!;
    expect(line).toContain(`${formatMoney({ amount: qubitLine.amount, currency: 'eur' })} for 2 more`);
    expect(line).toMatch(/€0\.15 for 1 more, €0\.45 for 2 more, €1\.05 for 3 more/);
  });
});

describe('run setup start button', () => {
  const preview = [
    { solver: 'exact', label: 'Exact enumeration', refusal: null },
    { solver: 'qaoa', label: 'QAOA (simulated quantum circuit)', refusal: 'needs at least 40 qubits; this run allows 24' },
    { solver: 'vqe', label: 'VQE (simulated quantum circuit)', refusal: 'needs at least 40 qubits' },
  ];
  test('names only the chosen solvers that will not run (the API refuses the whole run for them)', () => {
    expect(refusedChosen(preview, ['exact', 'qaoa'])).toEqual(['QAOA (simulated quantum circuit)']);
    expect(refusedChosen(preview, ['exact'])).toEqual([]);
    expect(refusedChosen([{ solver: 'vqe', refusal: 'too big' }], ['vqe'])).toEqual(['vqe']);
  });
});

describe('sign-in lands on the page that was asked for', () => {
  // Open-redirect rule, common practice: after sign-in follow only paths inside this app.
  test('a shared run link survives the sign-in; anything not a local path goes to the networks list', () => {
    expect(afterSignIn('/runs/12')).toBe('/runs/12');
    expect(afterSignIn('/networks/3')).toBe('/networks/3');
    expect(afterSignIn(undefined)).toBe('/networks');
    expect(afterSignIn('//evil.example/runs/1')).toBe('/networks');
    expect(afterSignIn('https://evil.example/')).toBe('/networks');
    expect(afterSignIn('/\\evil.example')).toBe('/networks');
    expect(afterSignIn('/sign-in')).toBe('/networks');
    expect(afterSignIn('/invite?token=x')).toBe('/networks');
  });
});
