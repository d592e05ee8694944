import type { LedgerEntryView } from '../../shared/schemas/billing';

/**
 * One line of the credits history. A run paid by card enters the ledger twice — the card money
 * comes in (run_payment) and is spent on the run at once (run_spend), so the balance does not move —
 * and a reader sees one payment, not "+€2.50" and "−€2.50": the pair becomes one line `byCard`.
 */
export interface LedgerLine {
  key: number;
  kind: string;
  /** Signed cents that moved the credit balance (0 for a run paid straight by card). */
  amount: number;
  /** Cents paid by card that went straight to a run (the balance is unchanged). */
  byCard: number | null;
  currency: string;
  balanceAfter: number;
  note: string | null;
  createdAt: string;
}

/** Entries newest first in, lines newest first out. */
export function ledgerLines(entries: LedgerEntryView[]): LedgerLine[] {
  const paymentOf = (spend: LedgerEntryView) =>
    spend.kind === 'run_spend' && spend.paymentId !== null ? entries.find((p) => p.kind === 'run_payment' && p.paymentId === spend.paymentId && p.amount === -spend.amount) : undefined;
  const spendOf = new Map<number, LedgerEntryView>();
  for (const e of entries) if (paymentOf(e)) spendOf.set(e.paymentId!, e);
  const lines: LedgerLine[] = [];
  for (const e of entries) {
    if (paymentOf(e)) continue; // shown on its payment's line
    const spend = e.kind === 'run_payment' && e.paymentId !== null ? spendOf.get(e.paymentId) : undefined;
    lines.push(
      spend
        ? // The spend is the later entry, so its balance is the one after the pair.
          { key: e.id, kind: 'run_card', amount: 0, byCard: e.amount, currency: e.currency, balanceAfter: spend.balanceAfter, note: spend.note ?? e.note, createdAt: spend.createdAt }
        : { key: e.id, kind: e.kind, amount: e.amount, byCard: null, currency: e.currency, balanceAfter: e.balanceAfter, note: e.note, createdAt: e.createdAt },
    );
  }
  return lines;
}
