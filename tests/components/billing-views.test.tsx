import { render, screen } from '@testing-library/react';
import { LedgerHistory } from '../../components/billing/LedgerHistory';
import { ReceiptsList } from '../../components/billing/ReceiptsList';
import { signedEuros } from '../../components/billing/format';
import type { LedgerEntryView, PaymentView } from '../../shared/schemas/billing';

/**
 * The billing page's history and receipts render what the API returns: signed amounts in euros
 * from integer cents, the balance after each entry, and only settled payments as receipts.
 */
const entry = (id: number, kind: string, amount: number, balanceAfter: number, note: string | null = null): LedgerEntryView => ({
  id, kind, amount, currency: 'eur', balanceAfter, runId: null, paymentId: null, eventId: null, note, createdAt: '2026-12-01T10:00:00.000Z',
});

const payment = (id: number, status: string, extra: Partial<PaymentView> = {}): PaymentView => ({
  id, purpose: 'credits', quantity: 25, amount: 2500, currency: 'eur', status, runId: null, cardLast4: null, failureMessage: null,
  receiptNumber: `SY-${String(id).padStart(6, '0')}`, receiptSent: status === 'paid', paidAt: status === 'paid' ? '2026-12-01T10:00:00.000Z' : null, createdAt: '2026-12-01T09:59:00.000Z', ...extra,
});

test('signed amounts use a real minus sign and two decimals', () => {
  expect(signedEuros(-575)).toBe('−€5.75');
  expect(signedEuros(2500)).toBe('+€25.00');
});

test('ledger history: each entry with its label, signed amount and balance after', () => {
  render(<LedgerHistory entries={[entry(3, 'run_spend', -575, 1925, 'Run #9 paid from credits'), entry(2, 'credit_purchase', 2500, 2500, 'Receipt SY-000002')]} />);
  expect(screen.getByText('Run paid')).toBeTruthy();
  expect(screen.getByText('−€5.75')).toBeTruthy();
  expect(screen.getByTestId('ledger-3').textContent).toContain('€19.25');
  expect(screen.getByText('Credits bought')).toBeTruthy();
  expect(screen.getByText('+€25.00')).toBeTruthy();
});

test('an empty ledger says so', () => {
  render(<LedgerHistory entries={[]} />);
  expect(screen.getByText('No credit movements yet.')).toBeTruthy();
});

test('receipts list settled payments only, with the receipt number and the decline reason', () => {
  render(<ReceiptsList payments={[payment(4, 'open'), payment(5, 'paid', { cardLast4: '4242' }), payment(6, 'failed', { failureMessage: 'Your card was declined.' })]} />);
  expect(screen.queryByTestId('payment-4')).toBeNull();
  expect(screen.getByTestId('payment-5').textContent).toContain('receipt SY-000005 (e-mailed)');
  expect(screen.getByTestId('payment-5').textContent).toContain('card •••• 4242');
  expect(screen.getByTestId('payment-6').textContent).toContain('Declined');
  expect(screen.getByTestId('payment-6').textContent).toContain('Your card was declined.');
});
