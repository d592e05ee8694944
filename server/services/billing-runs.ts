import { Op, type Transaction } from 'sequelize';
import type { Deps } from '../deps';
import { CURRENCY, type RunPrice } from '../../shared/plans';
import type { RunChargeView } from '../../shared/schemas/billing';
import { HttpError, notFound } from '../lib/http-error';
import type { RunChargeRow } from '../models/payment-run-charge';
import { appendEntry, balanceOf, hasEntry, lockOrganisationRow, spendCredits } from './ledger';
import { paymentClient } from './billing-client';
import { recordAudit } from './audit';
import { refundDue } from './refund-rule';
import { releaseRun } from './runs/start';

/**
 * Paid runs: the price held with a run created awaiting payment, paying it from the credits
 * (admin/owner confirms) or by card (checkout), releasing it to the queue once paid, giving the
 * money back when a paid run failed without any answer (refund-rule.ts), and charging a refunded
 * run again before it may run again. The run service reaches these through deps.runHooks
 * (billing-run-hooks.ts); this module calls the run service directly (release).
 */
export type BillingRunDeps = Pick<Deps, 'db' | 'models' | 'redis' | 'mailer' | 'config' | 'logger' | 'runHooks'>;

/** Ledger keys of one charging round of a run (round 1 keeps the plain key). */
const roundSuffix = (round: number) => (round > 1 ? `:${round}` : '');
export const spendKey = (runId: number, round = 1) => `run:${runId}:spend${roundSuffix(round)}`;
export const refundKey = (runId: number, round = 1) => `run:${runId}:refund${roundSuffix(round)}`;

/** Store the price with a run the run service created held (call inside its transaction or right after). */
export async function recordRunCharge(deps: Pick<Deps, 'models'>, charge: { runId: number; organisationId: number; price: RunPrice }, transaction?: Transaction): Promise<void> {
  if (!Number.isSafeInteger(charge.price.amount) || charge.price.amount <= 0) throw new Error(`run price must be positive integer cents, got ${charge.price.amount}`);
  await deps.models.RunCharge.create(
    { runId: charge.runId, organisationId: charge.organisationId, amount: charge.price.amount, currency: charge.price.currency, lines: JSON.stringify(charge.price.lines), status: 'awaiting' },
    { transaction },
  );
}

async function chargeOf(deps: Pick<Deps, 'models'>, organisationId: number, runId: number, transaction?: Transaction): Promise<RunChargeRow> {
  const row = await deps.models.RunCharge.findOne({ where: { runId, organisationId }, transaction });
  if (!row) throw new HttpError(404, 'This run has no price: it is free or does not exist.', { code: 'not_paid_run' });
  return row.get({ plain: true }) as RunChargeRow;
}

export async function runChargeView(deps: Pick<Deps, 'db' | 'models'>, organisationId: number, runId: number): Promise<RunChargeView> {
  const c = await chargeOf(deps, organisationId, runId);
  const balance = await balanceOf(deps, organisationId);
  let lines: RunChargeView['price']['lines'] = [];
  try {
    lines = JSON.parse(c.lines);
  } catch {
    lines = [];
  }
  return {
    runId, price: { amount: c.amount, currency: c.currency, lines }, status: c.status, paidWith: c.paidWith, failureMessage: c.failureMessage,
    balance: { amount: balance, currency: CURRENCY }, affordable: balance >= c.amount,
    paidAt: c.paidAt ? new Date(c.paidAt).toISOString() : null, refundedAt: c.refundedAt ? new Date(c.refundedAt).toISOString() : null,
  };
}

/** Hand a paid run to the queue (the run service's one release function). */
async function release(deps: BillingRunDeps, runId: number): Promise<void> {
  try {
    await releaseRun(deps, runId);
  } catch (err) {
    // Paid and un-held in the database; the workers' periodic queue reconciler queues its jobs.
    deps.logger.warn({ err, runId }, 'releasing a paid run failed; the reconciler will queue it');
  }
}

/**
 * POST /api/runs/:id/pay — spend the run's price from the credits (ledger entry `run:<id>:spend`
 * under the organisation row lock) and release it. 402 when the credits do not cover it.
 */
export async function payRunWithCredits(deps: BillingRunDeps, actor: { organisationId: number; userId: number; ip?: string | null }, runId: number) {
  const charge = await chargeOf(deps, actor.organisationId, runId);
  if (charge.status !== 'awaiting') throw new HttpError(409, 'This run is already paid.', { code: 'already_paid' });
  const run = await deps.models.Run.findOne({ where: { id: runId, organisationId: actor.organisationId, deletedAt: null }, attributes: ['id', 'held'] });
  if (!run) throw notFound('Run');
  const balance = await spendCredits(
    deps,
    { organisationId: actor.organisationId, amount: charge.amount, sourceKey: spendKey(runId, charge.round), runId, createdBy: actor.userId, note: `Run #${runId} paid from credits` },
    async (transaction) => {
      const [changed] = await deps.models.RunCharge.update({ status: 'paid', paidWith: 'credits', paidAt: new Date(), failureMessage: null }, { where: { id: charge.id, status: 'awaiting' }, transaction });
      if (!changed) throw new HttpError(409, 'This run is already paid.', { code: 'already_paid' });
      await recordAudit(deps, { organisationId: actor.organisationId, actorUserId: actor.userId, action: 'billing.run_paid', targetType: 'run', targetId: runId, detail: { amount: charge.amount, with: 'credits' }, ip: actor.ip ?? null }, { transaction });
    },
  );
  await release(deps, runId);
  return { runId, status: 'paid' as const, balance: { amount: balance, currency: CURRENCY } };
}

/**
 * A card payment for a run went through (webhook, inside its transaction with the organisation
 * row locked): the payment enters the ledger and is spent on the run. If the run was paid in
 * the meantime (from credits), the card money stays as credits. Returns whether to release.
 */
export async function applyRunCardPayment(
  deps: Pick<Deps, 'db' | 'models'>,
  p: { organisationId: number; runId: number; paymentId: number; amount: number; sessionId: string; eventId: string; userId: number | null },
  transaction: Transaction,
): Promise<boolean> {
  await appendEntry(deps, { organisationId: p.organisationId, kind: 'run_payment', amount: p.amount, sourceKey: `checkout:${p.sessionId}`, eventId: p.eventId, paymentId: p.paymentId, runId: p.runId, createdBy: p.userId, note: `Card payment for run #${p.runId}` }, transaction);
  const charge = await deps.models.RunCharge.findOne({ where: { runId: p.runId, organisationId: p.organisationId }, transaction });
  if (!charge || charge.status !== 'awaiting' || (await hasEntry(deps, spendKey(p.runId, charge.round), transaction))) return false;
  // Paid less than the price (should not happen), or the run was deleted meanwhile: the money stays as credits.
  if (p.amount < charge.amount) return false;
  if (!(await deps.models.Run.count({ where: { id: p.runId, deletedAt: null }, transaction }))) return false;
  await appendEntry(deps, { organisationId: p.organisationId, kind: 'run_spend', amount: -charge.amount, sourceKey: spendKey(p.runId, charge.round), eventId: p.eventId, paymentId: p.paymentId, runId: p.runId, createdBy: p.userId, note: `Run #${p.runId} paid by card` }, transaction);
  await charge.update({ status: 'paid', paidWith: 'card', paymentId: p.paymentId, paidAt: new Date(), failureMessage: null }, { transaction });
  return true;
}

export async function releasePaidRun(deps: BillingRunDeps, runId: number): Promise<void> {
  await release(deps, runId);
}

/**
 * Give back the price of a paid run that failed without any answer (refundDue): a `run_refund`
 * entry (+) and, when it was paid by card, a refund through the SDK and a `card_refund` entry (−)
 * — so the money goes back where it came from. Once per charging round (unique key
 * `run:<id>:refund[:round]`), decided under the run row lock so a retry cannot slip in between.
 * Returns whether it refunded now.
 */
export async function refundFailedRun(deps: Pick<Deps, 'db' | 'models' | 'config' | 'logger'>, runId: number): Promise<boolean> {
  const claimed = await deps.db.transaction(async (transaction) => {
    const run = await deps.models.Run.findByPk(runId, { attributes: ['id', 'status', 'organisationId'], lock: transaction.LOCK.UPDATE, transaction });
    if (!run) return null;
    const answers = await deps.models.RunJob.count({ where: { runId, result: { [Op.ne]: null } }, transaction });
    if (!refundDue(run.get('status') as string, answers)) return null;
    const organisationId = run.get('organisationId') as number;
    await lockOrganisationRow(deps, organisationId, transaction);
    const charge = await deps.models.RunCharge.findOne({ where: { runId, status: 'paid' }, lock: transaction.LOCK.UPDATE, transaction });
    if (!charge || (await hasEntry(deps, refundKey(runId, charge.round), transaction))) return null;
    await appendEntry(deps, { organisationId, kind: 'run_refund', amount: charge.amount, sourceKey: refundKey(runId, charge.round), runId, note: `Run #${runId} failed without an answer: price given back` }, transaction);
    await charge.update({ status: 'refunded', refundedAt: new Date() }, { transaction });
    return { organisationId, charge: charge.get({ plain: true }) as RunChargeRow };
  });
  if (!claimed) return false;
  const { organisationId, charge } = claimed;
  const payment = charge.paidWith === 'card' && charge.paymentId ? await deps.models.Payment.findByPk(charge.paymentId) : null;
  if (payment?.providerPaymentIntent) {
    try {
      const refund = await paymentClient(deps.config as Deps['config']).refunds.create(
        { payment_intent: payment.providerPaymentIntent, amount: charge.amount, metadata: { runId: String(runId), reason: 'run failed' } },
        { idempotencyKey: `spinyard-run-refund-${runId}${roundSuffix(charge.round)}` },
      );
      await appendEntry(deps, { organisationId, kind: 'card_refund', amount: -charge.amount, sourceKey: `refund:${refund.id}`, runId, paymentId: payment.id, note: `Refunded to card •••• ${payment.cardLast4 ?? '????'}` });
      await payment.update({ status: 'refunded' });
    } catch (err) {
      // The money stays as credits (the run_refund entry); an admin can see it in the ledger.
      deps.logger.warn({ err, runId }, 'card refund failed; the price stays as credits');
    }
  }
  await recordAudit(deps, { organisationId, actorUserId: null, action: 'billing.run_refunded', targetType: 'run', targetId: runId, detail: { amount: charge.amount, round: charge.round, to: payment ? 'card' : 'credits' } });
  return true;
}

/**
 * A refunded run is about to run again (the run service's retry, inside its transaction): its
 * charge starts a new round awaiting payment, so it runs only once paid again. False (runs
 * without a new payment) for free runs and for paid runs whose price was kept.
 */
export async function chargeAgainIfRefunded(deps: Pick<Deps, 'models'>, runId: number, transaction: Transaction): Promise<boolean> {
  const charge = await deps.models.RunCharge.findOne({ where: { runId }, lock: transaction.LOCK.UPDATE, transaction });
  if (!charge || charge.status !== 'refunded') return false;
  await charge.update({ status: 'awaiting', round: charge.round + 1, paidWith: null, paymentId: null, paidAt: null, refundedAt: null, failureMessage: null }, { transaction });
  return true;
}

/** Refund every paid run of the organisation that has failed since (swept on billing reads; the status recompute calls refundFailedRun first). */
export async function refundFailedRuns(deps: Pick<Deps, 'db' | 'models' | 'config' | 'logger'>, organisationId: number): Promise<number> {
  const charges = await deps.models.RunCharge.findAll({ where: { organisationId, status: 'paid' }, attributes: ['runId'] });
  if (charges.length === 0) return 0;
  const failed = await deps.models.Run.findAll({ where: { id: charges.map((c) => c.runId), status: 'failed' }, attributes: ['id'] });
  let n = 0;
  for (const r of failed) if (await refundFailedRun(deps, r.get('id') as number)) n++;
  return n;
}
