import http from 'node:http';
import type { AddressInfo } from 'node:net';
import express, { type NextFunction, type Request, type Response } from 'express';
import Stripe from 'stripe';
import { hostedPageHtml } from './hosted-page';
import { cardOutcome, createFakeState, fakeId, nowSeconds, type FakeCheckoutSession, type FakeEvent, type FakePaymentIntent, type FakeState } from './state';

/**
 * Local stand-in for the payment provider, spoken to through the official SDK: the subset we
 * use (checkout sessions, payment intents, refunds), a hosted test payment page, and webhook
 * events signed with the SDK's own test-header helper. Everything else under /v1 (customers,
 * charges, products, prices) falls through to stripe-stateful-mock. Loopback only.
 */
export interface PaymentFakeOptions {
  port: number;
  /** Where events are POSTed (our /api/billing/webhook); null = keep them, deliver nothing. */
  webhookUrl: string | null;
  /** Signing secret shared with the app (STRIPE_WEBHOOK_SECRET). */
  webhookSecret: string;
  /** Delays between delivery attempts when the endpoint does not answer 2xx (ms). */
  retryDelaysMs?: number[];
}

export interface PaymentFake {
  url: string;
  port: number;
  state: FakeState;
  /** Change where events go (tests start the app after the fake). */
  setWebhookUrl(url: string | null): void;
  /** What the hosted page's Pay button does; `card` picks the outcome (state.ts TEST_CARDS). */
  submitCard(sessionId: string, card: string): Promise<{ ok: boolean; redirect: string; message?: string }>;
  /** Send an already-created event again (same id, fresh signature), `times` times. */
  redeliver(eventId: string, times?: number): Promise<number[]>;
  /** Resolves once every delivery started so far has finished (including retries). */
  settled(): Promise<void>;
  close(): Promise<void>;
}

const API_VERSION = '2025-01-01.fake';

function stripeError(res: Response, status: number, message: string, extra: Record<string, unknown> = {}) {
  res.status(status).json({ error: { type: status === 401 ? 'authentication_error' : 'invalid_request_error', message, ...extra } });
}

const asRecord = (v: unknown): Record<string, string> => {
  if (!v || typeof v !== 'object') return {};
  return Object.fromEntries(Object.entries(v as Record<string, unknown>).map(([k, x]) => [k, String(x)]));
};

export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const state = createFakeState();
  let webhookUrl = options.webhookUrl;
  const retryDelays = options.retryDelaysMs ?? [200, 1000, 3000];
  const pending = new Set<Promise<unknown>>();
  const signer = new Stripe('sk_test_fake_signer');
  let baseUrl = '';

  /** POST one event, signed the way the SDK's constructEvent checks it; returns the HTTP status (0 = no answer). */
  async function post(event: FakeEvent): Promise<number> {
    if (!webhookUrl) return 0;
    const { deliveries: _omit, ...wire } = event;
    const payload = JSON.stringify(wire);
    const header = signer.webhooks.generateTestHeaderString({ payload, secret: options.webhookSecret });
    try {
      const r = await fetch(webhookUrl, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': header }, body: payload, signal: AbortSignal.timeout(10_000) });
      await r.arrayBuffer();
      return r.status;
    } catch {
      return 0;
    }
  }

  function track<T>(p: Promise<T>): Promise<T> {
    pending.add(p);
    void p.finally(() => pending.delete(p));
    return p;
  }

  /** Deliver with retries until a 2xx (as a provider would), in the background. */
  function deliver(event: FakeEvent): void {
    void track((async () => {
      for (let attempt = 0; attempt <= retryDelays.length; attempt++) {
        const status = await post(event);
        event.deliveries.push(status);
        if (status >= 200 && status < 300) return;
        if (!webhookUrl || attempt === retryDelays.length) return;
        await new Promise((r) => setTimeout(r, retryDelays[attempt]));
      }
    })());
  }

  function emit(type: string, object: unknown): FakeEvent {
    const event: FakeEvent = { id: fakeId('evt'), object: 'event', type, created: nowSeconds(), livemode: false, api_version: API_VERSION, data: { object: structuredClone(object) }, deliveries: [] };
    state.events.push(event);
    deliver(event);
    return event;
  }

  async function submitCard(sessionId: string, card: string) {
    const session = state.sessions.get(sessionId);
    if (!session) throw new Error(`no checkout session ${sessionId}`);
    if (session.status !== 'open') return { ok: session.status === 'complete', redirect: session.status === 'complete' ? session.success_url : session.cancel_url, message: `the session is ${session.status}` };
    const outcome = cardOutcome(card);
    const intent: FakePaymentIntent = {
      id: fakeId('pi'), object: 'payment_intent', amount: session.amount_total, amount_received: 0, currency: session.currency, status: 'requires_payment_method',
      metadata: { ...session.payment_intent_metadata }, last_payment_error: null, payment_method_details: null, latest_charge: null, created: nowSeconds(), livemode: false,
    };
    state.intents.set(intent.id, intent);
    session.payment_intent = intent.id;
    if (outcome.ok) {
      Object.assign(intent, { status: 'succeeded', amount_received: intent.amount, latest_charge: fakeId('ch'), payment_method_details: { card: { brand: 'visa', last4: outcome.last4 } } });
      Object.assign(session, { status: 'complete', payment_status: 'paid', url: null });
      emit('payment_intent.succeeded', intent);
      emit('checkout.session.completed', session);
      return { ok: true, redirect: session.success_url.replace('{CHECKOUT_SESSION_ID}', session.id) };
    }
    // A refused card ends this checkout: the payer starts a new one from the app.
    intent.last_payment_error = { code: outcome.code, decline_code: outcome.declineCode, message: outcome.message };
    Object.assign(session, { status: 'expired', url: null });
    emit('payment_intent.payment_failed', intent);
    emit('checkout.session.expired', session);
    return { ok: false, redirect: session.cancel_url.replace('{CHECKOUT_SESSION_ID}', session.id), message: outcome.message };
  }

  const app = express();
  app.disable('x-powered-by');
  const form = express.urlencoded({ extended: true, limit: '100kb' });

  // The hosted page (a browser, no API key).
  app.get('/pay/:id', (req, res) => {
    const session = state.sessions.get(String(req.params.id));
    if (!session) return void res.status(404).type('text/plain').send('No such test payment.');
    res.type('html').send(hostedPageHtml(session));
  });
  app.post('/pay/:id', form, async (req, res, next) => {
    try {
      const id = String(req.params.id);
      if (!state.sessions.has(id)) return void res.status(404).type('text/plain').send('No such test payment.');
      const body = req.body as { card?: string; action?: string };
      const card = body.action === 'decline' ? '4000000000000002' : String(body.card ?? '');
      const result = await submitCard(id, card);
      res.redirect(303, result.redirect);
    } catch (err) {
      next(err);
    }
  });

  const api = express.Router();
  api.use((req, res, next) => {
    const auth = req.get('authorization') ?? '';
    if (!/^Bearer sk_(test|live)_\S+$/.test(auth)) return stripeError(res, 401, 'No valid API key provided (Authorization: Bearer sk_test_…).');
    next();
  });
  // Replays of a POST with the same Idempotency-Key get the first answer (the SDK retries that way).
  api.use((req, res, next) => {
    const key = req.get('idempotency-key');
    if (req.method !== 'POST' || !key) return next();
    const seen = state.idempotent.get(key);
    if (seen) return void res.status(seen.status).json(seen.body);
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      state.idempotent.set(key, { status: res.statusCode, body });
      return json(body);
    };
    next();
  });

  api.post('/v1/checkout/sessions', form, (req, res) => {
    const b = req.body as Record<string, any>;
    const items = Array.isArray(b.line_items) ? b.line_items : b.line_items ? Object.values(b.line_items) : [];
    const item = items[0] as { quantity?: string; price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } } } | undefined;
    const unit = Number(item?.price_data?.unit_amount);
    const quantity = Number(item?.quantity ?? 1);
    const currency = String(item?.price_data?.currency ?? '').toLowerCase();
    if (items.length !== 1) return stripeError(res, 400, 'This fake takes exactly one line item with price_data.', { param: 'line_items' });
    if (!Number.isInteger(unit) || unit <= 0) return stripeError(res, 400, 'line_items[0][price_data][unit_amount] must be a positive integer (smallest currency unit).', { param: 'line_items[0][price_data][unit_amount]' });
    if (!Number.isInteger(quantity) || quantity < 1) return stripeError(res, 400, 'line_items[0][quantity] must be a positive integer.', { param: 'line_items[0][quantity]' });
    if (!/^[a-z]{3}$/.test(currency)) return stripeError(res, 400, 'line_items[0][price_data][currency] must be a three-letter code.', { param: 'line_items[0][price_data][currency]' });
    if (b.mode !== 'payment') return stripeError(res, 400, 'This fake supports mode=payment only.', { param: 'mode' });
    if (!b.success_url || !b.cancel_url) return stripeError(res, 400, 'success_url and cancel_url are required.', { param: 'success_url' });
    const id = fakeId('cs_test');
    const session: FakeCheckoutSession = {
      id, object: 'checkout.session', mode: 'payment', status: 'open', payment_status: 'unpaid', amount_total: unit * quantity, currency,
      description: String(item?.price_data?.product_data?.name ?? 'Payment'), quantity, success_url: String(b.success_url), cancel_url: String(b.cancel_url),
      client_reference_id: b.client_reference_id ? String(b.client_reference_id) : null, customer_email: b.customer_email ? String(b.customer_email) : null,
      metadata: asRecord(b.metadata), payment_intent_metadata: asRecord(b.payment_intent_data?.metadata), payment_intent: null,
      url: `${baseUrl}/pay/${id}`, created: nowSeconds(), expires_at: nowSeconds() + 24 * 3600, livemode: false,
    };
    state.sessions.set(id, session);
    res.json(session);
  });
  api.get('/v1/checkout/sessions/:id', (req, res) => {
    const session = state.sessions.get(String(req.params.id));
    if (!session) return stripeError(res, 404, `No such checkout.session: '${req.params.id}'`, { code: 'resource_missing' });
    res.json(session);
  });
  api.post('/v1/checkout/sessions/:id/expire', form, (req, res) => {
    const session = state.sessions.get(String(req.params.id));
    if (!session) return stripeError(res, 404, `No such checkout.session: '${req.params.id}'`, { code: 'resource_missing' });
    if (session.status !== 'open') return stripeError(res, 400, `Only open sessions can be expired; this one is ${session.status}.`);
    Object.assign(session, { status: 'expired', url: null });
    emit('checkout.session.expired', session);
    res.json(session);
  });
  api.get('/v1/payment_intents/:id', (req, res) => {
    const intent = state.intents.get(String(req.params.id));
    if (!intent) return stripeError(res, 404, `No such payment_intent: '${req.params.id}'`, { code: 'resource_missing' });
    res.json(intent);
  });
  api.post('/v1/refunds', form, (req, res, next) => {
    const b = req.body as Record<string, any>;
    if (!b.payment_intent) return next(); // charge refunds: stripe-stateful-mock's
    const intent = state.intents.get(String(b.payment_intent));
    if (!intent) return stripeError(res, 404, `No such payment_intent: '${b.payment_intent}'`, { code: 'resource_missing', param: 'payment_intent' });
    if (intent.status !== 'succeeded') return stripeError(res, 400, 'This payment was not completed; there is nothing to refund.', { code: 'charge_not_refundable' });
    const already = [...state.refunds.values()].filter((r) => r.payment_intent === intent.id).reduce((s, r) => s + r.amount, 0);
    const amount = b.amount !== undefined ? Number(b.amount) : intent.amount - already;
    if (!Number.isInteger(amount) || amount <= 0 || amount + already > intent.amount) {
      return stripeError(res, 400, `Refund amount must be a positive integer of at most ${intent.amount - already}.`, { code: 'amount_too_large', param: 'amount' });
    }
    const refund = { id: fakeId('re'), object: 'refund' as const, amount, currency: intent.currency, payment_intent: intent.id, status: 'succeeded' as const, metadata: asRecord(b.metadata), created: nowSeconds() };
    state.refunds.set(refund.id, refund);
    emit('refund.created', refund);
    res.json(refund);
  });
  app.use(api);

  // The rest of /v1 (customers, charges, products, prices…) from stripe-stateful-mock.
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const { createExpressApp } = require('stripe-stateful-mock') as { createExpressApp: () => express.Express };
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  require('loglevel').setLevel('silent');
  app.use(createExpressApp());

  app.use((err: unknown, _req: Request, res: Response, _next: NextFunction) => {
    stripeError(res, 500, `fake payment server error: ${(err as Error).message}`);
  });

  const server = http.createServer(app);
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port, '127.0.0.1', () => resolve());
  });
  const port = (server.address() as AddressInfo).port;
  baseUrl = `http://127.0.0.1:${port}`;

  return {
    url: baseUrl,
    port,
    state,
    setWebhookUrl: (url) => {
      webhookUrl = url;
    },
    submitCard,
    async redeliver(eventId, times = 1) {
      const event = state.events.find((e) => e.id === eventId);
      if (!event) throw new Error(`no event ${eventId}`);
      const statuses: number[] = [];
      for (let i = 0; i < times; i++) {
        const status = await track(post(event));
        event.deliveries.push(status);
        statuses.push(status);
      }
      return statuses;
    },
    async settled() {
      while (pending.size > 0) await Promise.allSettled([...pending]);
    },
    async close() {
      webhookUrl = null;
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeAllConnections(); // the SDK keeps connections alive
      await closed;
    },
  };
}
