import crypto from 'node:crypto';
import type Stripe from 'stripe';
import type { Deps } from '../deps';
import { can, type Role } from '../../shared/permissions';
import { CREDIT_PACKS, CURRENCY, PLANS, planLabel, planPrices, runLimits, seatLimit, type PlanId } from '../../shared/plans';
import type { BillingSummary, CheckoutBody, CheckoutView, PaymentView } from '../../shared/schemas/billing';
import { HttpError, badRequest, forbidden, notFound } from '../lib/http-error';
import type { PaymentPurpose, PaymentRow } from '../models/payment';
import { recordAudit } from './audit';
import { paymentClient } from './billing-client';
import { receiptNumber, sendReceipt } from './billing-receipts';
import { applyRunCardPayment, refundFailedRuns, releasePaidRun } from './billing-runs';
import { seatsInUse } from './invitations';
import { parseBillingEvent, type EventIntent, type EventSession } from './billing-events';
import { appendEntry, balanceOf, hasEntry, lockOrganisationRow } from './ledger';
import { runsThisMonth } from './pricing';
import { purchasedSeats } from './billing-seats';

/**
 * Billing: what the organisation has (plan, seats, credits), checkouts at the payment provider
 * through its SDK, and the webhook that turns paid checkouts into ledger entries, seats and
 * released runs. Amounts are integer cents throughout.
 */
export interface BillingActor {
  organisationId: number;
  userId: number;
  role: Role | null;
  ip?: string | null;
}


export async function billingSummary(deps: Deps, organisationId: number): Promise<BillingSummary> {
  await refundFailedRuns(deps, organisationId).catch((err) => deps.logger.warn({ err, organisationId }, 'refund sweep failed'));
  const org = await deps.models.Organisation.findByPk(organisationId);
  if (!org) throw notFound('Organisation');
  const plan = org.plan as PlanId;
  const limits = runLimits(plan);
  const prices = planPrices(plan);
  const purchased = await purchasedSeats(deps, organisationId);
  const awaiting = await deps.models.RunCharge.findAll({ where: { organisationId, status: 'awaiting' }, order: [['id', 'DESC']], limit: 20 });
  const live = awaiting.length ? await deps.models.Run.findAll({ where: { id: awaiting.map((a) => a.runId), deletedAt: null }, attributes: ['id'] }) : [];
  const liveIds = new Set(live.map((r) => r.get('id') as number));
  return {
    plan: { id: plan, label: planLabel(plan), includedDepots: limits.maxDepots, includedQubits: limits.maxQubits, includedSeconds: limits.maxSecondsPerSolver, monthlyFreeRuns: prices.monthlyFreeRuns },
    seats: { used: await seatsInUse(deps, organisationId), included: (PLANS[plan] ?? PLANS.free).seats, purchased, limit: seatLimit(plan, purchased), price: { amount: prices.seat, currency: CURRENCY } },
    balance: { amount: await balanceOf(deps, organisationId), currency: CURRENCY },
    creditPacks: [...CREDIT_PACKS],
    runsThisMonth: await runsThisMonth(deps, organisationId),
    awaitingRuns: awaiting.filter((a) => liveIds.has(a.runId)).map((a) => ({ runId: a.runId, amount: a.amount, currency: a.currency, failureMessage: a.failureMessage, createdAt: new Date(a.createdAt).toISOString() })),
  };
}

function paymentView(p: PaymentRow): PaymentView {
  return {
    id: p.id, purpose: p.purpose, quantity: p.quantity, amount: p.amount, currency: p.currency, status: p.status, runId: p.runId, cardLast4: p.cardLast4,
    failureMessage: p.failureMessage, receiptNumber: receiptNumber(p.id), receiptSent: !!p.receiptSentAt, paidAt: p.paidAt ? new Date(p.paidAt).toISOString() : null, createdAt: new Date(p.createdAt).toISOString(),
  };
}

export async function listPayments(deps: Deps, organisationId: number, limit = 100): Promise<PaymentView[]> {
  const rows = await deps.models.Payment.findAll({ where: { organisationId }, order: [['id', 'DESC']], limit });
  return rows.map((r) => paymentView(r.get({ plain: true }) as PaymentRow));
}

interface CheckoutItem {
  name: string;
  unitAmount: number;
  quantity: number;
  runId: number | null;
  successPath: string;
  cancelPath: string;
}

async function checkoutItem(deps: Deps, actor: BillingActor, body: CheckoutBody): Promise<CheckoutItem> {
  const org = await deps.models.Organisation.findByPk(actor.organisationId, { attributes: ['id', 'plan', 'name'] });
  if (!org) throw notFound('Organisation');
  if (body.purpose !== 'run' && !can(actor.role, 'billing:manage')) throw forbidden(`Your role (${actor.role ?? 'none'}) cannot buy credits or seats. Ask an admin or the owner (billing:manage).`);
  if (body.purpose === 'credits') {
    return { name: `Spinyard credits for ${org.name}`, unitAmount: 100, quantity: body.quantity!, runId: null, successPath: '/billing?checkout=success', cancelPath: '/billing?checkout=cancelled' };
  }
  if (body.purpose === 'seats') {
    return { name: `Additional Spinyard seat (${planLabel(org.plan)} plan)`, unitAmount: planPrices(org.plan).seat, quantity: body.quantity ?? 1, runId: null, successPath: '/billing?checkout=success', cancelPath: '/billing?checkout=cancelled' };
  }
  const runId = body.runId!;
  const run = await deps.models.Run.findOne({ where: { id: runId, organisationId: actor.organisationId, deletedAt: null }, attributes: ['id'] });
  if (!run) throw notFound('Run');
  const charge = await deps.models.RunCharge.findOne({ where: { runId, organisationId: actor.organisationId } });
  if (!charge) throw new HttpError(409, 'This run is free: it needs no payment.', { code: 'not_paid_run' });
  if (charge.status !== 'awaiting') throw new HttpError(409, 'This run is already paid.', { code: 'already_paid' });
  return { name: `Large solve: run #${runId}`, unitAmount: charge.amount, quantity: 1, runId, successPath: `/runs/${runId}?payment=success`, cancelPath: `/runs/${runId}?payment=cancelled` };
}

/** POST /api/billing/checkout — a checkout session at the provider (its hosted page URL) and our payment row. */
export async function createCheckout(deps: Deps, actor: BillingActor, body: CheckoutBody): Promise<CheckoutView> {
  const item = await checkoutItem(deps, actor, body);
  const user = await deps.models.User.findByPk(actor.userId, { attributes: ['email'] });
  // Our row first, so the provider's objects can carry its id (metadata.paymentId) back in events.
  const payment = await deps.models.Payment.create({
    organisationId: actor.organisationId, purpose: body.purpose as PaymentPurpose, runId: item.runId, quantity: item.quantity, amount: item.unitAmount * item.quantity, currency: CURRENCY,
    status: 'open', providerSessionId: `pending:${crypto.randomUUID()}`, payerEmail: user?.email ?? null, createdBy: actor.userId,
  });
  const metadata = { paymentId: String(payment.id), organisationId: String(actor.organisationId), purpose: body.purpose, quantity: String(item.quantity), runId: item.runId ? String(item.runId) : '' };
  const base = deps.config.publicUrl;
  let session: Stripe.Checkout.Session;
  try {
    session = await paymentClient(deps.config).checkout.sessions.create(
      {
        mode: 'payment',
        line_items: [{ quantity: item.quantity, price_data: { currency: CURRENCY, unit_amount: item.unitAmount, product_data: { name: item.name } } }],
        success_url: `${base}${item.successPath}${item.successPath.includes('?') ? '&' : '?'}session={CHECKOUT_SESSION_ID}`,
        cancel_url: `${base}${item.cancelPath}`,
        client_reference_id: String(actor.organisationId),
        customer_email: user?.email,
        metadata,
        payment_intent_data: { metadata },
      },
      { idempotencyKey: `spinyard-checkout-${payment.id}` },
    );
    if (!session.url) throw new Error('no payment page in the answer');
    // Our row's amount is what we credit later; a session for another amount is not ours to offer.
    if (session.amount_total !== payment.amount || (session.currency ?? '').toLowerCase() !== payment.currency) {
      throw new Error(`the provider's session is for ${session.amount_total} ${session.currency}, our checkout for ${payment.amount} ${payment.currency}`);
    }
  } catch (err) {
    deps.logger.warn({ err }, 'checkout session could not be created');
    await payment.update({ status: 'failed', failureMessage: 'The payment service did not answer.' });
    throw new HttpError(502, 'The payment service did not answer. Try again in a minute.', { code: 'payments_unavailable' });
  }
  await payment.update({ providerSessionId: session.id });
  await recordAudit(deps, { organisationId: actor.organisationId, actorUserId: actor.userId, action: 'billing.checkout_started', targetType: 'payment', targetId: payment.id, detail: { purpose: body.purpose, amount: payment.amount, runId: item.runId }, ip: actor.ip ?? null });
  return { paymentId: payment.id, purpose: body.purpose, sessionId: session.id, url: session.url, amount: payment.amount, currency: payment.currency };
}

/** Verify the SDK signature; 400 (nothing recorded) when it does not match. */
export function verifyWebhook(deps: Pick<Deps, 'config'>, rawBody: unknown, signature: string | undefined): Stripe.Event {
  if (!Buffer.isBuffer(rawBody) || !signature) throw new HttpError(400, 'Webhook rejected: missing body or signature header.', { code: 'bad_signature' });
  try {
    return paymentClient(deps.config as Deps['config']).webhooks.constructEvent(rawBody, signature, deps.config.STRIPE_WEBHOOK_SECRET);
  } catch {
    throw new HttpError(400, 'Webhook rejected: the signature does not match.', { code: 'bad_signature' });
  }
}

/**
 * The amount credited is our checkout record's, never the event's: an event that states another
 * amount or currency is refused (400 `amount_mismatch`), logged and audited, and credits nothing.
 */
async function refuseMismatch(deps: Deps, eventId: string, session: EventSession, payment: PaymentRow): Promise<void> {
  const stated = { amount: session.amount_total ?? null, currency: (session.currency ?? '').toLowerCase() || null };
  if (stated.amount === payment.amount && stated.currency === payment.currency) return;
  const detail = { eventId, sessionId: session.id, stated, recorded: { amount: payment.amount, currency: payment.currency } };
  deps.logger.error({ ...detail, paymentId: payment.id }, 'payment event refused: its amount differs from our checkout record');
  await recordAudit(deps, { organisationId: payment.organisationId, actorUserId: null, action: 'billing.payment_event_refused', targetType: 'payment', targetId: payment.id, detail });
  throw new HttpError(400, 'Webhook rejected: the amount in the event differs from the checkout it refers to.', { code: 'amount_mismatch' });
}

async function onCheckoutCompleted(deps: Deps, eventId: string, session: EventSession): Promise<string> {
  if (session.payment_status !== 'paid') return 'not paid yet';
  // By session id; else by our id in the metadata (if the row never got its session id saved).
  const byMeta = Number(session.metadata?.paymentId);
  const found = (await deps.models.Payment.findOne({ where: { providerSessionId: session.id } }))
    ?? (Number.isInteger(byMeta) && byMeta > 0 ? await deps.models.Payment.findOne({ where: { id: byMeta, organisationId: Number(session.metadata?.organisationId), status: 'open' } }) : null);
  if (!found) return 'unknown checkout';
  await refuseMismatch(deps, eventId, session, found.get({ plain: true }) as PaymentRow);
  if (found.providerSessionId !== session.id) await found.update({ providerSessionId: session.id });
  let last4: string | null = null;
  const intentId = typeof session.payment_intent === 'string' ? session.payment_intent : (session.payment_intent?.id ?? null);
  if (intentId) {
    try {
      const intent = (await paymentClient(deps.config).paymentIntents.retrieve(intentId)) as Stripe.PaymentIntent & { payment_method_details?: { card?: { last4?: string } } };
      last4 = intent.payment_method_details?.card?.last4 ?? null;
    } catch {
      last4 = null; // the receipt just leaves the card out
    }
  }
  const result = await deps.db.transaction(async (transaction) => {
    await lockOrganisationRow(deps, found.organisationId, transaction);
    const payment = (await deps.models.Payment.findByPk(found.id, { transaction, lock: transaction.LOCK.UPDATE }))!;
    if (payment.status === 'paid' || payment.status === 'refunded') return { outcome: 'duplicate', release: false };
    const amount = payment.amount;
    await payment.update({ status: 'paid', paidAt: new Date(), providerPaymentIntent: intentId, cardLast4: last4, failureMessage: null }, { transaction });
    let release = false;
    if (payment.purpose === 'credits') {
      if (!(await hasEntry(deps, `checkout:${session.id}`, transaction))) {
        await appendEntry(deps, { organisationId: payment.organisationId, kind: 'credit_purchase', amount, sourceKey: `checkout:${session.id}`, eventId, paymentId: payment.id, createdBy: payment.createdBy, note: `Receipt ${receiptNumber(payment.id)}` }, transaction);
      }
    } else if (payment.purpose === 'seats') {
      if ((await deps.models.SeatGrant.count({ where: { sourceKey: `checkout:${session.id}` }, transaction })) === 0) {
        await deps.models.SeatGrant.create({ organisationId: payment.organisationId, seats: payment.quantity, sourceKey: `checkout:${session.id}`, paymentId: payment.id }, { transaction });
      }
    } else if (payment.runId) {
      if (!(await hasEntry(deps, `checkout:${session.id}`, transaction))) {
        release = await applyRunCardPayment(deps, { organisationId: payment.organisationId, runId: payment.runId, paymentId: payment.id, amount, sessionId: session.id, eventId, userId: payment.createdBy }, transaction);
      }
    }
    await recordAudit(deps, { organisationId: payment.organisationId, actorUserId: payment.createdBy, action: 'billing.payment_succeeded', targetType: 'payment', targetId: payment.id, detail: { purpose: payment.purpose, amount, eventId } }, { transaction });
    return { outcome: 'paid', release, runId: payment.runId };
  });
  if (result.release && result.runId) await releasePaidRun(deps, result.runId);
  if (result.outcome === 'paid' || result.outcome === 'duplicate') await sendReceipt(deps, found.id);
  return result.outcome;
}

async function onPaymentFailed(deps: Deps, intent: EventIntent): Promise<string> {
  const message = intent.last_payment_error?.message ?? 'The payment was refused.';
  const paymentId = Number(intent.metadata?.paymentId);
  const payment = Number.isInteger(paymentId) && paymentId > 0 ? await deps.models.Payment.findOne({ where: { id: paymentId, organisationId: Number(intent.metadata?.organisationId) } }) : null;
  if (!payment) return 'unknown payment';
  // Events arrive in any order: the session's 'expired' event may come first for a declined card.
  if (payment.status !== 'open' && payment.status !== 'expired') return 'already settled';
  await payment.update({ status: 'failed', failureMessage: message.slice(0, 300), providerPaymentIntent: intent.id });
  if (payment.runId) await deps.models.RunCharge.update({ failureMessage: `Card payment failed: ${message}`.slice(0, 300) }, { where: { runId: payment.runId, status: 'awaiting' } });
  await recordAudit(deps, { organisationId: payment.organisationId, actorUserId: payment.createdBy, action: 'billing.payment_failed', targetType: 'payment', targetId: payment.id, detail: { message } });
  return 'failed';
}

async function onCheckoutExpired(deps: Deps, session: EventSession): Promise<string> {
  const [n] = await deps.models.Payment.update({ status: 'expired' }, { where: { providerSessionId: session.id, status: 'open' } });
  return n ? 'expired' : 'nothing to do';
}

/** POST /api/billing/webhook — verify, then apply once (replays find the payment already settled). */
export async function handleWebhook(deps: Deps, rawBody: unknown, signature: string | undefined): Promise<{ received: true; outcome: string }> {
  const event = parseBillingEvent(verifyWebhook(deps, rawBody, signature));
  switch (event.type) {
    case 'checkout.session.completed':
    case 'checkout.session.async_payment_succeeded':
      return { received: true, outcome: await onCheckoutCompleted(deps, event.id, event.session) };
    case 'payment_intent.payment_failed':
      return { received: true, outcome: await onPaymentFailed(deps, event.intent) };
    case 'checkout.session.expired':
      return { received: true, outcome: await onCheckoutExpired(deps, event.session) };
    default:
      return { received: true, outcome: 'ignored' };
  }
}

export function assertPositiveCents(amount: number): void {
  if (!Number.isSafeInteger(amount) || amount <= 0) throw badRequest('Amounts are whole cents.');
}
