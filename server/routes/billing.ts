import type { Deps } from '../deps';
import { z } from 'zod';
import { NoBodySchema, type AuthContext, type RouteSpec } from '../lib/routes';
import { unauthorized } from '../lib/http-error';
import { BillingRunParamsSchema, CheckoutBodySchema, LedgerQuerySchema, QuoteBodySchema } from '../../shared/schemas/billing';
import { billingSummary, createCheckout, handleWebhook, listPayments, type BillingActor } from '../services/billing';
import { payRunWithCredits, refundFailedRuns, runChargeView } from '../services/billing-runs';
import { listLedger } from '../services/ledger';
import { quoteRun } from '../services/pricing';

const read = { kind: 'member', permission: 'billing:read' } as const;
const manage = { kind: 'member', permission: 'billing:manage' } as const;

function actorOf(auth: AuthContext | null, ip?: string): BillingActor {
  if (!auth || auth.organisationId === null) throw unauthorized();
  return { organisationId: auth.organisationId, userId: auth.userId, role: auth.role, ip: ip ?? null };
}

/** Billing: plan, seats and credits; checkouts; the provider's webhook; paying held runs (docs/billing.md). */
export function billingRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get', path: '/billing', summary: 'Plan, seats in use and purchased, credits balance, runs awaiting payment', access: read,
      handler: ({ auth }) => billingSummary(deps, actorOf(auth).organisationId),
    },
    {
      method: 'get', path: '/billing/ledger', summary: 'Credits ledger entries, newest first, with the balance after each', access: read, query: LedgerQuerySchema,
      handler: async ({ auth, query }) => {
        const organisationId = actorOf(auth).organisationId;
        await refundFailedRuns(deps, organisationId).catch((err) => deps.logger.warn({ err }, 'refund sweep failed'));
        return listLedger(deps, organisationId, query.limit);
      },
    },
    {
      method: 'get', path: '/billing/payments', summary: 'Payments and receipts, newest first', access: read,
      handler: ({ auth }) => listPayments(deps, actorOf(auth).organisationId),
    },
    {
      method: 'post', path: '/billing/checkout', summary: 'Start a card payment (credits, seats, or one held run): the provider checkout session with its payment page URL', access: { kind: 'member', permission: 'runs:start' }, body: CheckoutBodySchema, status: 201,
      handler: ({ auth, body, req }) => createCheckout(deps, actorOf(auth, req.ip), body),
    },
    {
      method: 'post', path: '/billing/webhook', summary: 'Payment provider events (signature checked with the SDK; raw body)', access: { kind: 'public' },
      // The raw bytes the signature covers (express.raw in server/app.ts); anything else is refused with 400.
      body: z.instanceof(Buffer, { message: 'send the provider event as the raw request body' }),
      handler: ({ req }) => handleWebhook(deps, req.body, req.get('stripe-signature')),
    },
    {
      method: 'post', path: '/billing/quote', summary: 'Price of a run of this size and whether the credits cover it (nothing is written)', access: { kind: 'member', permission: 'runs:read' }, body: QuoteBodySchema,
      handler: ({ auth, body }) => quoteRun(deps, actorOf(auth).organisationId, body),
    },
    {
      method: 'get', path: '/billing/runs/:id', summary: 'Price of a held run, how it was paid, and whether the credits cover it', access: { kind: 'member', permission: 'runs:read' }, params: BillingRunParamsSchema,
      handler: ({ auth, params }) => runChargeView(deps, actorOf(auth).organisationId, params.id),
    },
    {
      method: 'post', path: '/runs/:id/pay', summary: 'Pay a held run from the credits and queue it (admins and owners)', access: manage, params: BillingRunParamsSchema, body: NoBodySchema,
      handler: ({ auth, params, req }) => payRunWithCredits(deps, { ...actorOf(auth, req.ip), userId: actorOf(auth).userId }, params.id),
    },
  ];
}
