import { QueryTypes, Transaction, UniqueConstraintError } from 'sequelize';
import type { Deps } from '../deps';
import { CURRENCY } from '../../shared/plans';
import { HttpError, notFound } from '../lib/http-error';
import type { LedgerKind } from '../models/ledger-entry';
import type { LedgerEntryView } from '../../shared/schemas/billing';

/**
 * The credits ledger: append-only entries, balance = SUM(amount) (never stored on its own).
 * Every entry has a UNIQUE source key (payment event / checkout id, or `run:<id>:spend`), so a
 * replayed event or a repeated click writes once. Spending locks the organisation row first
 * (SELECT … FOR UPDATE), so two spends of the last credits cannot both pass the balance check.
 */
export type LedgerDeps = Pick<Deps, 'db' | 'models'>;

export interface NewLedgerEntry {
  organisationId: number;
  kind: LedgerKind;
  /** Signed integer cents. */
  amount: number;
  sourceKey: string;
  eventId?: string | null;
  paymentId?: number | null;
  runId?: number | null;
  note?: string | null;
  createdBy?: number | null;
}

function assertCents(amount: number): void {
  if (!Number.isSafeInteger(amount)) throw new Error(`ledger amounts are integer cents, got ${amount}`);
}

/** Balance in cents, summed from the entries (inside `transaction` when given). */
export async function balanceOf(deps: LedgerDeps, organisationId: number, transaction?: Transaction): Promise<number> {
  const rows = await deps.db.query<{ total: string | number | null }>('SELECT COALESCE(SUM(amount), 0) AS total FROM ledger_entries WHERE organisation_id = ? AND currency = ?', {
    replacements: [organisationId, CURRENCY],
    type: QueryTypes.SELECT,
    transaction,
  });
  return Number(rows[0]?.total ?? 0);
}

/** Lock the organisation row for the rest of `transaction` (the serialisation point for spending). */
export async function lockOrganisationRow(deps: LedgerDeps, organisationId: number, transaction: Transaction): Promise<void> {
  const org = await deps.models.Organisation.findByPk(organisationId, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
  if (!org) throw notFound('Organisation');
}

/**
 * Append one entry; false when its source key is already in the ledger (a replay).
 * Inside a caller's transaction a duplicate would abort it, so callers check `hasEntry` first
 * under their lock; without one, the unique constraint is the last word.
 */
export async function appendEntry(deps: LedgerDeps, entry: NewLedgerEntry, transaction?: Transaction): Promise<boolean> {
  assertCents(entry.amount);
  try {
    await deps.models.LedgerEntry.create(
      {
        organisationId: entry.organisationId, kind: entry.kind, amount: entry.amount, currency: CURRENCY, sourceKey: entry.sourceKey,
        eventId: entry.eventId ?? null, paymentId: entry.paymentId ?? null, runId: entry.runId ?? null, note: entry.note ?? null, createdBy: entry.createdBy ?? null,
      },
      { transaction },
    );
    return true;
  } catch (err) {
    if (err instanceof UniqueConstraintError && !transaction) return false;
    throw err;
  }
}

export async function hasEntry(deps: LedgerDeps, sourceKey: string, transaction?: Transaction): Promise<boolean> {
  return (await deps.models.LedgerEntry.count({ where: { sourceKey }, transaction })) > 0;
}

export function insufficientCredits(balance: number, amount: number): HttpError {
  const fmt = (c: number) => `€${(c / 100).toFixed(2)}`;
  return new HttpError(402, `The organisation's credits (${fmt(balance)}) do not cover ${fmt(amount)}. Buy credits on the Billing page or pay this run by card.`, {
    code: 'insufficient_credits', balance, amount,
  });
}

/**
 * Spend `amount` cents from the balance in its own transaction (READ COMMITTED, after the row
 * lock, so the SUM sees every spend committed before us). `also` runs in the same transaction
 * (e.g. mark the run paid). Returns the balance after; throws 402 when it does not cover it,
 * 409 when this source key was already spent.
 */
export async function spendCredits(
  deps: LedgerDeps,
  spend: Omit<NewLedgerEntry, 'kind' | 'amount'> & { amount: number },
  also?: (transaction: Transaction) => Promise<void>,
): Promise<number> {
  assertCents(spend.amount);
  if (spend.amount <= 0) throw new Error('spend a positive amount');
  return deps.db.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
    await lockOrganisationRow(deps, spend.organisationId, transaction);
    if (await hasEntry(deps, spend.sourceKey, transaction)) throw new HttpError(409, 'This has already been paid.', { code: 'already_paid' });
    const balance = await balanceOf(deps, spend.organisationId, transaction);
    if (balance < spend.amount) throw insufficientCredits(balance, spend.amount);
    await appendEntry(deps, { ...spend, kind: 'run_spend', amount: -spend.amount }, transaction);
    if (also) await also(transaction);
    return balance - spend.amount;
  });
}

/** Entries newest first, each with the balance after it. */
export async function listLedger(deps: LedgerDeps, organisationId: number, limit: number): Promise<{ balance: number; entries: LedgerEntryView[] }> {
  const rows = await deps.models.LedgerEntry.findAll({ where: { organisationId }, order: [['id', 'DESC']], limit });
  let after = await balanceOf(deps, organisationId);
  const balance = after;
  const entries = rows.map((r) => {
    const view: LedgerEntryView = {
      id: Number(r.id), kind: r.kind, amount: r.amount, currency: r.currency, balanceAfter: after, runId: r.runId, paymentId: r.paymentId, eventId: r.eventId, note: r.note,
      createdAt: new Date(r.createdAt).toISOString(),
    };
    after -= r.amount;
    return view;
  });
  return { balance, entries };
}
