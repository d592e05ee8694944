import http from 'node:http';
import type { AddressInfo } from 'node:net';
import Stripe from 'stripe';
import { startPaymentFake, type PaymentFake } from '../../../server/fakes/payments/payment-fake';
import { TEST_CARDS } from '../../../server/fakes/payments/state';

/**
 * The payment fake spoken to through the official SDK (stripe 23.1), the way the product code
 * does. The reference for signatures is the SDK itself: `stripe.webhooks.constructEvent` must
 * accept what the fake sends and reject tampering (stripe-node documentation, "Verify webhook
 * signatures"). Card outcomes follow the fake's own test-card table (server/fakes/payments/state.ts).
 */
const SECRET = 'whsec_unit_test_secret';

interface Received {
  body: string;
  signature: string;
}

function startReceiver(statusFor: (n: number) => number = () => 200) {
  const received: Received[] = [];
  const server = http.createServer((req, res) => {
    let body = '';
    req.on('data', (c) => (body += c));
    req.on('end', () => {
      received.push({ body, signature: String(req.headers['stripe-signature'] ?? '') });
      res.statusCode = statusFor(received.length);
      res.end('{}');
    });
  });
  return new Promise<{ url: string; received: Received[]; close: () => Promise<void> }>((resolve) => {
    server.listen(0, '127.0.0.1', () => {
      const port = (server.address() as AddressInfo).port;
      resolve({ url: `http://127.0.0.1:${port}/hook`, received, close: () => new Promise((r) => { server.closeAllConnections(); server.close(() => r()); }) });
    });
  });
}

describe('payment fake through the official SDK', () => {
  let fake: PaymentFake;
  let stripe: Stripe;
  let receiver: Awaited<ReturnType<typeof startReceiver>>;

  beforeAll(async () => {
    receiver = await startReceiver();
    fake = await startPaymentFake({ port: 0, webhookUrl: receiver.url, webhookSecret: SECRET, retryDelaysMs: [20, 20] });
    stripe = new Stripe('sk_test_unit', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
  });
  afterAll(async () => {
    await fake.close();
    await receiver.close();
  });

  const createSession = (amount = 1250, quantity = 1, metadata: Record<string, string> = { purpose: 'credits' }) =>
    stripe.checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity, price_data: { currency: 'eur', unit_amount: amount, product_data: { name: 'Spinyard credits' } } }],
      success_url: 'http://127.0.0.1:1/ok?s={CHECKOUT_SESSION_ID}',
      cancel_url: 'http://127.0.0.1:1/cancel',
      metadata,
      payment_intent_data: { metadata },
    });

  it('creates and retrieves a checkout session with its hosted page URL and integer total', async () => {
    const s = await createSession(1250, 3);
    expect(s.id).toMatch(/^cs_test_/);
    expect(s.amount_total).toBe(3750);
    expect(s.status).toBe('open');
    expect(s.url).toBe(`${fake.url}/pay/${s.id}`);
    const again = await stripe.checkout.sessions.retrieve(s.id);
    expect(again.metadata).toEqual({ purpose: 'credits' });
    const page = await fetch(s.url!).then((r) => r.text());
    expect(page).toContain('Local test payment page');
    expect(page).toContain('€37.50');
  });

  it('rejects a non-integer amount with the SDK error type', async () => {
    await expect(createSession(12.5)).rejects.toMatchObject({ type: 'StripeInvalidRequestError', statusCode: 400 });
  });

  it('rejects a missing or malformed API key', async () => {
    const bad = new Stripe('not_a_key', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    await expect(bad.checkout.sessions.retrieve('cs_test_x')).rejects.toMatchObject({ statusCode: 401 });
  });

  it('a paid session delivers checkout.session.completed that constructEvent accepts; tampering is rejected', async () => {
    const s = await createSession(500, 1, { purpose: 'run', runId: '7' });
    const before = receiver.received.length;
    const result = await fake.submitCard(s.id, TEST_CARDS.pays);
    expect(result).toEqual({ ok: true, redirect: `http://127.0.0.1:1/ok?s=${s.id}` });
    await fake.settled();
    const mine = receiver.received.slice(before).map((r) => ({ r, e: stripe.webhooks.constructEvent(r.body, r.signature, SECRET) }));
    const completed = mine.find((m) => m.e.type === 'checkout.session.completed')!;
    const session = completed.e.data.object as Stripe.Checkout.Session;
    expect(session.id).toBe(s.id);
    expect(session.payment_status).toBe('paid');
    expect(session.metadata).toEqual({ purpose: 'run', runId: '7' });
    const intent = await stripe.paymentIntents.retrieve(session.payment_intent as string);
    expect(intent.status).toBe('succeeded');
    expect(intent.amount_received).toBe(500);
    // Wrong secret, edited body: both must fail the SDK's check.
    expect(() => stripe.webhooks.constructEvent(completed.r.body, completed.r.signature, 'whsec_other')).toThrow();
    expect(() => stripe.webhooks.constructEvent(completed.r.body.replace('"paid"', '"unpaid"'), completed.r.signature, SECRET)).toThrow();
  });

  it('a declined card fails the payment intent with a message and expires the session', async () => {
    const s = await createSession(900);
    const before = receiver.received.length;
    const result = await fake.submitCard(s.id, TEST_CARDS.declined);
    expect(result.ok).toBe(false);
    expect(result.message).toBe('Your card was declined.');
    expect(result.redirect).toBe('http://127.0.0.1:1/cancel');
    await fake.settled();
    const types = receiver.received.slice(before).map((r) => stripe.webhooks.constructEvent(r.body, r.signature, SECRET).type);
    expect(types).toEqual(['payment_intent.payment_failed', 'checkout.session.expired']);
    expect((await stripe.checkout.sessions.retrieve(s.id)).status).toBe('expired');
    // A closed session cannot be paid afterwards.
    expect((await fake.submitCard(s.id, TEST_CARDS.pays)).ok).toBe(false);
  });

  it('the hosted page form pays and redirects (303) to the success URL', async () => {
    const s = await createSession(300);
    const r = await fetch(`${fake.url}/pay/${s.id}`, { method: 'POST', body: new URLSearchParams({ card: TEST_CARDS.pays, action: 'pay' }), redirect: 'manual' });
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe(`http://127.0.0.1:1/ok?s=${s.id}`);
    expect((await stripe.checkout.sessions.retrieve(s.id)).payment_status).toBe('paid');
  });

  it('refunds a paid intent in full once, and refuses a second full refund', async () => {
    const s = await createSession(700);
    await fake.submitCard(s.id, TEST_CARDS.pays);
    const pi = (await stripe.checkout.sessions.retrieve(s.id)).payment_intent as string;
    const refund = await stripe.refunds.create({ payment_intent: pi, metadata: { reason: 'run failed' } });
    expect(refund).toMatchObject({ amount: 700, status: 'succeeded', payment_intent: pi });
    await expect(stripe.refunds.create({ payment_intent: pi })).rejects.toMatchObject({ statusCode: 400 });
  });

  it('honours Idempotency-Key: the same create twice gives the same session', async () => {
    const params = { mode: 'payment' as const, line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 100, product_data: { name: 'x' } } }], success_url: 'http://a/ok', cancel_url: 'http://a/no' };
    const a = await stripe.checkout.sessions.create(params, { idempotencyKey: 'same-key-1' });
    const b = await stripe.checkout.sessions.create(params, { idempotencyKey: 'same-key-1' });
    expect(b.id).toBe(a.id);
  });

  it('redelivers an event with the same id (fresh, valid signature each time)', async () => {
    const s = await createSession(200);
    await fake.submitCard(s.id, TEST_CARDS.pays);
    await fake.settled();
    const event = fake.state.events.find((e) => e.type === 'checkout.session.completed' && (e.data.object as { id: string }).id === s.id)!;
    const before = receiver.received.length;
    expect(await fake.redeliver(event.id, 4)).toEqual([200, 200, 200, 200]);
    const ids = receiver.received.slice(before).map((r) => stripe.webhooks.constructEvent(r.body, r.signature, SECRET).id);
    expect(ids).toEqual([event.id, event.id, event.id, event.id]);
  });

  it('customers (outside our subset) come from stripe-stateful-mock', async () => {
    const c = await stripe.customers.create({ email: 'depot@example.com' });
    expect(c.id).toMatch(/^cus_/);
    expect((await stripe.customers.retrieve(c.id)) as Stripe.Customer).toMatchObject({ email: 'depot@example.com' });
  });
});

describe('payment fake delivery retries', () => {
  it('retries a failing endpoint until it answers 2xx', async () => {
    const receiver = await startReceiver((n) => (n < 3 ? 500 : 200));
    const fake = await startPaymentFake({ port: 0, webhookUrl: receiver.url, webhookSecret: SECRET, retryDelaysMs: [10, 10, 10] });
    const stripe = new Stripe('sk_test_unit', { host: '127.0.0.1', port: fake.port, protocol: 'http', maxNetworkRetries: 0 });
    try {
      const s = await stripe.checkout.sessions.create({ mode: 'payment', line_items: [{ quantity: 1, price_data: { currency: 'eur', unit_amount: 100, product_data: { name: 'x' } } }], success_url: 'http://a/ok', cancel_url: 'http://a/no' });
      await stripe.checkout.sessions.expire(s.id);
      await fake.settled();
      const event = fake.state.events.find((e) => e.type === 'checkout.session.expired')!;
      expect(event.deliveries).toEqual([500, 500, 200]);
    } finally {
      await fake.close();
      await receiver.close();
    }
  });
});
