import { formatMoney } from '../../shared/plans';

/** "€12.50" from integer cents. */
export const euros = (amount: number, currency = 'eur') => formatMoney({ amount, currency });

/** "+€10.00" / "−€5.75" for ledger entries. */
export const signedEuros = (amount: number, currency = 'eur') => `${amount < 0 ? '−' : '+'}${formatMoney({ amount: Math.abs(amount), currency })}`;

export const LEDGER_KIND_LABELS: Record<string, string> = {
  credit_purchase: 'Credits bought',
  run_payment: 'Card payment for a run',
  run_card: 'Run paid by card',
  run_spend: 'Run paid',
  run_refund: 'Failed run given back',
  card_refund: 'Refunded to card',
};

export const PURPOSE_LABELS: Record<string, string> = { credits: 'Credits', run: 'Large solve', seats: 'Seats' };

export const STATUS_LABELS: Record<string, string> = { open: 'Not paid yet', paid: 'Paid', failed: 'Declined', expired: 'Closed', refunded: 'Refunded' };

/** "1 Dec 2026", as everywhere in the app (components/ui/dates.ts). */
export { formatDate as shortDate } from '../ui/dates';
