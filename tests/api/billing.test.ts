/**
 * Billing end to end: the real API listening on loopback, the official SDK (stripe 23.1)
 * talking to our payment fake, webhooks signed by the fake and checked by the SDK's
 * constructEvent, the SMTP fake for receipts, the test MariaDB for the ledger.
 *
 * Outside references: the webhook signature scheme is the SDK's own (stripe-node,
 * "Verify webhook signatures": a wrong secret or an edited body must be rejected); prices are
 * checked against the price table in shared/plans.ts worked by hand (free plan: 2.00 € per large
 * solve + 0.25 € × (2^(extra qubits) − 1)); ledger invariants are accounting common practice
 * (append-only entries, balance = sum, never below zero).
 */
import http from 'node:http';
import request from 'supertest';
import Stripe from 'stripe';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payments/payment-fake';
import { TEST_CARDS } from '../../server/fakes/payments/state';
import { RUN_LIMITS } from '../../shared/plans';
import { applyRunsEnv, createTestApp, networkBody, orgWithTokens, randomEdges, saveNetwork, waitFor, type TestApp } from './runs-support';

const APP_PORT = 3141; // billing suites own 3140–3149
const SMTP_PORT = 3149;
const PAYMENTS_PORT = 12112; // the test profile's payment fake port
const WEBHOOK_SECRET = 'whsec_billing_api_test';
applyRunsEnv({ smtpPort: SMTP_PORT, queue: 'billing-test', extra: { STRIPE_API_PORT: String(PAYMENTS_PORT), STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET, PUBLIC_URL: `http://127.0.0.1:${APP_PORT}` } });

let t: TestApp;
let server: http.Server;
let fake: PaymentFake;
let mail: MailCatcher;
let org: Awaited<ReturnType<typeof orgWithTokens>>;
let twenty: { id: number; versionId: number };
const sdk = new Stripe('sk_test_billing_suite', { host: '127.0.0.1', port: PAYMENTS_PORT, protocol: 'http' });

const as = (token: string) => ({
  get: (p: string) => request(t.app).get(`/api${p}`).set('Authorization', `Bearer ${token}`),
  post: (p: string, body: object = {}) => request(t.app).post(`/api${p}`).set('Authorization', `Bearer ${token}`).send(body),
});

/** A 20-depot max-cut with QAOA: 20 qubits, 4 above the free plan's 16 → a paid run. */
const paidRunBody = () => ({ versionId: twenty.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa' }] });
// Free plan, 4 extra qubits: 200 + 25 × (2⁴ − 1) = 575 cents (worked by hand from the price table).
const PAID_RUN_CENTS = 575;

async function ledgerRows(organisationId: number) {
  return t.deps.models.LedgerEntry.findAll({ where: { organisationId }, order: [['id', 'ASC']] });
}

async function buyCredits(token: string, euros: number) {
  const checkout = await as(token).post('/billing/checkout', { purpose: 'credits', quantity: euros });
  expect(checkout.status).toBe(201);
  const paid = await fake.submitCard(checkout.body.sessionId, TEST_CARDS.pays);
  expect(paid.ok).toBe(true);
  await fake.settled();
  return checkout.body as { sessionId: string; paymentId: number; url: string; amount: number };
}

beforeAll(async () => {
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  fake = await startPaymentFake({ port: PAYMENTS_PORT, webhookUrl: `http://127.0.0.1:${APP_PORT}/api/billing/webhook`, webhookSecret: WEBHOOK_SECRET, retryDelaysMs: [50, 100] });
  t = await createTestApp();
  const { migrate } = await import('../../server/migrate');
  await migrate(t.deps.db);
  server = http.createServer(t.app);
  await new Promise<void>((resolve) => server.listen(APP_PORT, '127.0.0.1', () => resolve()));
  org = await orgWithTokens(t.deps, 'Billing yard', 'free');
  twenty = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Twenty depots', 20, randomEdges(20, 0.3, 5)));
}, 120_000);

afterAll(async () => {
  await fake?.close();
  server?.closeAllConnections();
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
  await mail?.close();
});

describe('webhook', () => {
  test('a bad signature is refused with 400 and nothing is recorded', async () => {
    const checkout = await as(org.tokens.owner).post('/billing/checkout', { purpose: 'credits', quantity: 10 });
    expect(checkout.status).toBe(201);
    const session = await sdk.checkout.sessions.retrieve(checkout.body.sessionId);
    const payload = JSON.stringify({ id: 'evt_forged', object: 'event', type: 'checkout.session.completed', data: { object: { ...session, payment_status: 'paid', status: 'complete' } } });
    const forged = sdk.webhooks.generateTestHeaderString({ payload, secret: 'whsec_not_ours' });
    const before = (await ledgerRows(org.organisationId)).length;
    const bad = await request(t.app).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', forged).send(payload);
    expect(bad.status).toBe(400);
    expect(bad.body.code).toBe('bad_signature');
    const none = await request(t.app).post('/api/billing/webhook').set('content-type', 'application/json').send(payload);
    expect(none.status).toBe(400);
    // A valid signature over a different body is refused too.
    const good = sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET });
    const tampered = await request(t.app).post('/api/billing/webhook').set('content-type', 'application/json').set('stripe-signature', good).send(payload.replace('evt_forged', 'evt_forgeD'));
    expect(tampered.status).toBe(400);
    expect((await ledgerRows(org.organisationId)).length).toBe(before);
    expect((await t.deps.models.Payment.findByPk(checkout.body.paymentId))!.status).toBe('open');
  });

  test('buying credits: the paid checkout credits the ledger once even when the event arrives 5 times; the receipt is e-mailed once', async () => {
    const start = (await as(org.tokens.owner).get('/billing')).body.balance.amount as number;
    const bought = await buyCredits(org.tokens.owner, 25);
    expect(bought.amount).toBe(2500);
    expect(bought.url).toBe(`${fake.url}/pay/${bought.sessionId}`);
    const completed = fake.state.events.find((e) => e.type === 'checkout.session.completed' && (e.data.object as { id: string }).id === bought.sessionId)!;
    expect(completed.deliveries).toEqual([200]);
    expect(await fake.redeliver(completed.id, 5)).toEqual([200, 200, 200, 200, 200]);
    const summary = await as(org.tokens.owner).get('/billing');
    expect(summary.body.balance).toEqual({ amount: start + 2500, currency: 'eur' });
    const entries = (await ledgerRows(org.organisationId)).filter((e) => e.paymentId === bought.paymentId);
    expect(entries).toHaveLength(1);
    expect(entries[0]).toMatchObject({ kind: 'credit_purchase', amount: 2500, eventId: completed.id });
    const receipt = await mail.waitFor((m) => m.to.includes(org.users.owner.email) && /receipt/i.test(m.subject) && m.text.includes('€25.00'), 10_000);
    expect(receipt.text).toContain('Card: •••• 4242');
    await new Promise((r) => setTimeout(r, 300));
    expect(mail.messages.filter((m) => m.subject === receipt.subject)).toHaveLength(1);
    const payments = await as(org.tokens.admin).get('/billing/payments');
    expect(payments.body.find((p: { id: number }) => p.id === bought.paymentId)).toMatchObject({ status: 'paid', amount: 2500, receiptSent: true, cardLast4: '4242' });
  });

  test('a signed event stating another amount than the checkout is refused, logged in the audit trail, and credits nothing', async () => {
    const checkout = await as(org.tokens.owner).post('/billing/checkout', { purpose: 'credits', quantity: 10 });
    expect(checkout.status).toBe(201);
    expect(checkout.body.amount).toBe(1000);
    const session = await sdk.checkout.sessions.retrieve(checkout.body.sessionId);
    const before = (await ledgerRows(org.organisationId)).length;
    const send = (object: object, id: string) => {
      const payload = JSON.stringify({ id, object: 'event', type: 'checkout.session.completed', data: { object } });
      return request(t.app).post('/api/billing/webhook').set('content-type', 'application/json')
        .set('stripe-signature', sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET })).send(payload);
    };
    const inflated = await send({ ...session, payment_status: 'paid', status: 'complete', amount_total: 1_000_000 }, 'evt_inflated');
    expect(inflated.status).toBe(400);
    expect(inflated.body.code).toBe('amount_mismatch');
    const otherCurrency = await send({ ...session, payment_status: 'paid', status: 'complete', currency: 'usd' }, 'evt_currency');
    expect(otherCurrency.status).toBe(400);
    expect((await ledgerRows(org.organisationId)).length).toBe(before);
    expect((await t.deps.models.Payment.findByPk(checkout.body.paymentId))!.get({ plain: true })).toMatchObject({ status: 'open', amount: 1000 });
    const audit = await t.deps.models.AuditEvent.findAll({ where: { organisationId: org.organisationId, action: 'billing.payment_event_refused', targetId: String(checkout.body.paymentId) } });
    expect(audit).toHaveLength(2);
    expect(JSON.parse(audit[0].get('detail') as string)).toMatchObject({ eventId: 'evt_inflated', stated: { amount: 1_000_000 }, recorded: { amount: 1000 } });
    // The genuine payment still goes through, for the checkout's own amount.
    const paid = await fake.submitCard(checkout.body.sessionId, TEST_CARDS.pays);
    expect(paid.ok).toBe(true);
    await fake.settled();
    const entries = (await ledgerRows(org.organisationId)).filter((e) => e.paymentId === checkout.body.paymentId);
    expect(entries.map((e) => [e.kind, e.amount])).toEqual([['credit_purchase', 1000]]);
  });

  test('a signed event with no usable object is a 400 (bad_event), not a server error', async () => {
    const post = (event: object) => {
      const payload = JSON.stringify(event);
      return request(t.app).post('/api/billing/webhook').set('content-type', 'application/json')
        .set('stripe-signature', sdk.webhooks.generateTestHeaderString({ payload, secret: WEBHOOK_SECRET })).send(payload);
    };
    for (const type of ['checkout.session.completed', 'payment_intent.payment_failed', 'checkout.session.expired']) {
      const nullData = await post({ id: `evt_null_${type}`, object: 'event', type, data: null });
      expect([nullData.status, nullData.body.code]).toEqual([400, 'bad_event']);
      const noId = await post({ id: `evt_noid_${type}`, object: 'event', type, data: { object: { metadata: null } } });
      expect([noId.status, noId.body.code]).toEqual([400, 'bad_event']);
    }
    expect((await post({ object: 'event', type: 'checkout.session.completed' })).status).toBe(400);
    // Types billing does not handle are acknowledged whatever their data.
    const other = await post({ id: 'evt_other', object: 'event', type: 'customer.created', data: null });
    expect(other.status).toBe(200);
    expect(other.body.outcome).toBe('ignored');
  });

  test('concurrent deliveries of one event still write one entry', async () => {
    const bought = await buyCredits(org.tokens.owner, 5);
    const completed = fake.state.events.find((e) => e.type === 'checkout.session.completed' && (e.data.object as { id: string }).id === bought.sessionId)!;
    await Promise.all([fake.redeliver(completed.id), fake.redeliver(completed.id), fake.redeliver(completed.id), fake.redeliver(completed.id), fake.redeliver(completed.id)]);
    expect((await ledgerRows(org.organisationId)).filter((e) => e.paymentId === bought.paymentId)).toHaveLength(1);
  });
});

describe('paid runs', () => {
  test('a run over the free limits is held with its price; the preview shows the same price', async () => {
    const preview = await as(org.tokens.dispatcher).post('/runs/preview', paidRunBody());
    expect(preview.status).toBe(200);
    expect(preview.body.price).toMatchObject({ amount: PAID_RUN_CENTS, currency: 'eur', label: '€5.75' });
    expect(preview.body.limitProblem).toBeNull();
    const created = await as(org.tokens.dispatcher).post('/runs', paidRunBody());
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ status: 'awaiting_payment', price: { amount: PAID_RUN_CENTS, currency: 'eur' } });
    const run = await as(org.tokens.viewer).get(`/runs/${created.body.id}`);
    expect(run.body.status).toBe('awaiting_payment');
    // Paid runs queue with the priority of the plan whose limits they use (lower runs first).
    const row = await t.deps.models.Run.findByPk(created.body.id);
    expect(row!.get('priority')).toBe(RUN_LIMITS.team.priority);
    expect(RUN_LIMITS.team.priority).toBeLessThan(RUN_LIMITS.free.priority);
    const charge = await as(org.tokens.dispatcher).get(`/billing/runs/${created.body.id}`);
    expect(charge.body).toMatchObject({ status: 'awaiting', paidWith: null, price: { amount: PAID_RUN_CENTS } });
    // A run inside the included size stays free and is not held.
    const quote = await as(org.tokens.dispatcher).post('/billing/quote', { depots: 20, secondsPerSolver: 10, solvers: [{ family: 'heuristic', qubits: null }] });
    expect(quote.body.price).toBeNull();
  });

  test('a declined card leaves the run unpaid with a clear message; paying by card then releases it to the queue', async () => {
    const created = await as(org.tokens.dispatcher).post('/runs', paidRunBody());
    const runId = created.body.id as number;
    const first = await as(org.tokens.dispatcher).post('/billing/checkout', { purpose: 'run', runId });
    expect(first.status).toBe(201);
    expect(first.body.amount).toBe(PAID_RUN_CENTS);
    const declined = await fake.submitCard(first.body.sessionId, TEST_CARDS.declined);
    expect(declined.ok).toBe(false);
    expect(declined.redirect).toBe(`http://127.0.0.1:${APP_PORT}/runs/${runId}?payment=cancelled`);
    await fake.settled();
    const afterDecline = await as(org.tokens.dispatcher).get(`/billing/runs/${runId}`);
    expect(afterDecline.body).toMatchObject({ status: 'awaiting', failureMessage: 'Card payment failed: Your card was declined.' });
    expect((await as(org.tokens.viewer).get(`/runs/${runId}`)).body.status).toBe('awaiting_payment');
    expect((await t.deps.models.Payment.findByPk(first.body.paymentId))!.status).toBe('failed');
    expect((await ledgerRows(org.organisationId)).filter((e) => e.runId === runId)).toHaveLength(0);

    const second = await as(org.tokens.dispatcher).post('/billing/checkout', { purpose: 'run', runId });
    const paid = await fake.submitCard(second.body.sessionId, TEST_CARDS.pays);
    expect(paid.redirect).toBe(`http://127.0.0.1:${APP_PORT}/runs/${runId}?payment=success&session=${second.body.sessionId}`);
    await fake.settled();
    const run = await waitFor('run released', async () => {
      const r = await as(org.tokens.viewer).get(`/runs/${runId}`);
      return r.body.status !== 'awaiting_payment' ? r.body : null;
    });
    expect(['queued', 'running', 'succeeded']).toContain(run.status);
    const entries = (await ledgerRows(org.organisationId)).filter((e) => e.runId === runId);
    expect(entries.map((e) => [e.kind, e.amount])).toEqual([['run_payment', PAID_RUN_CENTS], ['run_spend', -PAID_RUN_CENTS]]);
    expect((await as(org.tokens.dispatcher).get(`/billing/runs/${runId}`)).body).toMatchObject({ status: 'paid', paidWith: 'card', failureMessage: null });
    // Paying again is refused.
    expect((await as(org.tokens.dispatcher).post('/billing/checkout', { purpose: 'run', runId })).status).toBe(409);
  });

  test('paying from credits: admins and owners only; 402 when the credits do not cover it', async () => {
    const poor = await orgWithTokens(t.deps, 'Poor yard', 'free');
    const net = await saveNetwork(t.app, poor.tokens.dispatcher, networkBody('Twenty', 20, randomEdges(20, 0.3, 5)));
    const created = await as(poor.tokens.dispatcher).post('/runs', { ...paidRunBody(), versionId: net.versionId });
    const runId = created.body.id as number;
    expect((await as(poor.tokens.dispatcher).post(`/runs/${runId}/pay`)).status).toBe(403);
    const broke = await as(poor.tokens.admin).post(`/runs/${runId}/pay`);
    expect(broke.status).toBe(402);
    expect(broke.body).toMatchObject({ code: 'insufficient_credits', balance: 0, amount: PAID_RUN_CENTS });
    expect((await as(poor.tokens.viewer).get(`/runs/${runId}`)).body.status).toBe('awaiting_payment');
    await buyCredits(poor.tokens.owner, 10);
    expect((await as(poor.tokens.dispatcher).get(`/billing/runs/${runId}`)).body).toMatchObject({ affordable: true, balance: { amount: 1000 } });
    const ok = await as(poor.tokens.admin).post(`/runs/${runId}/pay`);
    expect(ok.status).toBe(200);
    expect(ok.body.balance).toEqual({ amount: 1000 - PAID_RUN_CENTS, currency: 'eur' });
    expect((await as(poor.tokens.viewer).get(`/runs/${runId}`)).body.status).not.toBe('awaiting_payment');
    expect((await as(poor.tokens.admin).post(`/runs/${runId}/pay`)).status).toBe(409);
    // Another organisation cannot pay for (or even see) this run.
    expect((await as(org.tokens.owner).post(`/runs/${runId}/pay`)).status).toBe(404);
  });

  test('10 concurrent spends against credits that cover 3: exactly 3 succeed, the balance never goes below zero', async () => {
    const yard = await orgWithTokens(t.deps, 'Busy yard', 'free');
    const net = await saveNetwork(t.app, yard.tokens.dispatcher, networkBody('Twenty', 20, randomEdges(20, 0.3, 5)));
    const runIds: number[] = [];
    for (let i = 0; i < 10; i++) runIds.push((await as(yard.tokens.dispatcher).post('/runs', { ...paidRunBody(), versionId: net.versionId })).body.id);
    await buyCredits(yard.tokens.owner, 18); // 1800 cents: 3 × 575 = 1725 fit, 4 × 575 = 2300 do not
    const answers = await Promise.all(runIds.map((id) => as(yard.tokens.owner).post(`/runs/${id}/pay`)));
    const statuses = answers.map((a) => a.status).sort();
    expect(statuses).toEqual([200, 200, 200, 402, 402, 402, 402, 402, 402, 402]);
    const rows = await ledgerRows(yard.organisationId);
    // Running balance over the append-only entries, oldest first, never below zero.
    let running = 0;
    for (const r of rows) {
      running += r.amount;
      expect(running).toBeGreaterThanOrEqual(0);
    }
    expect(running).toBe(1800 - 3 * PAID_RUN_CENTS);
    expect((await as(yard.tokens.owner).get('/billing')).body.balance.amount).toBe(running);
    const paidCharges = await t.deps.models.RunCharge.count({ where: { organisationId: yard.organisationId, status: 'paid' } });
    expect(paidCharges).toBe(3);
  });

  test('a paid run that fails is refunded once: back to the card through the SDK, both legs in the ledger', async () => {
    const created = await as(org.tokens.dispatcher).post('/runs', paidRunBody());
    const runId = created.body.id as number;
    const checkout = await as(org.tokens.dispatcher).post('/billing/checkout', { purpose: 'run', runId });
    await fake.submitCard(checkout.body.sessionId, TEST_CARDS.pays);
    await fake.settled();
    await waitFor('run paid', async () => (await t.deps.models.RunCharge.findOne({ where: { runId, status: 'paid' } })) ?? null);
    // The solver fails (written as a worker would), then the run service recomputes the status.
    await t.deps.models.RunJob.update({ status: 'failed', error: 'simulated solver failure', finishedAt: new Date() }, { where: { runId } });
    const { refreshRunStatus } = await import('../../server/services/runs-status');
    expect(await refreshRunStatus(t.deps, runId)).toBe('failed');
    await refreshRunStatus(t.deps, runId); // a second recompute must not refund twice
    const entries = (await ledgerRows(org.organisationId)).filter((e) => e.runId === runId).map((e) => [e.kind, e.amount]);
    expect(entries).toEqual([['run_payment', PAID_RUN_CENTS], ['run_spend', -PAID_RUN_CENTS], ['run_refund', PAID_RUN_CENTS], ['card_refund', -PAID_RUN_CENTS]]);
    const intent = (await sdk.checkout.sessions.retrieve(checkout.body.sessionId)).payment_intent as string;
    const refunds = [...fake.state.refunds.values()].filter((r) => r.payment_intent === intent);
    expect(refunds.map((r) => r.amount)).toEqual([PAID_RUN_CENTS]);
    expect((await as(org.tokens.dispatcher).get(`/billing/runs/${runId}`)).body.status).toBe('refunded');
  });
});

describe('refund rule: only when no solver produced an answer; a refunded run is paid again before it runs again', () => {
  /** A paid run released from credits (the organisation buys what it needs first). */
  async function paidAndReleased(yard: Awaited<ReturnType<typeof orgWithTokens>>, versionId: number, solvers: object[]) {
    const created = await as(yard.tokens.dispatcher).post('/runs', { versionId, problem: { kind: 'maxcut' }, solvers });
    expect(created.status).toBe(201);
    const runId = created.body.id as number;
    const balance = (await as(yard.tokens.owner).get('/billing')).body.balance.amount as number;
    if (balance < created.body.price.amount) await buyCredits(yard.tokens.owner, Math.ceil(created.body.price.amount / 100) + 5);
    expect((await as(yard.tokens.admin).post(`/runs/${runId}/pay`)).status).toBe(200);
    expect((await as(yard.tokens.viewer).get(`/runs/${runId}`)).body.status).toBe('queued');
    const jobs = (await as(yard.tokens.viewer).get(`/runs/${runId}`)).body.jobs as { id: number; solver: string }[];
    return { runId, jobs, price: created.body.price.amount as number };
  }
  const answer = (n: number) => JSON.stringify({ value: 7, assignment: Array.from({ length: n }, (_, i) => i % 2), bound: null, gap: null, energy: null, expectation: null, params: null, seconds: 1, evaluations: 10, shots: 0, provenOptimal: false });
  const runLedger = async (organisationId: number, runId: number) => (await ledgerRows(organisationId)).filter((e) => e.runId === runId).map((e) => [e.kind, e.amount, e.sourceKey]);

  test('one solver fails, the user cancels the other after it found an answer: no refund, the answer downloads, a retry of the failed solver is covered by the price paid', async () => {
    const yard = await orgWithTokens(t.deps, 'Answer yard', 'free');
    const net = await saveNetwork(t.app, yard.tokens.dispatcher, networkBody('Twenty', 20, randomEdges(20, 0.3, 5)));
    const { runId, jobs, price } = await paidAndReleased(yard, net.versionId, [{ solver: 'qaoa' }, { solver: 'tabu' }]);
    const [failing, stopped] = jobs;
    // As the workers would write it: the first solver fails, the second is running…
    await t.deps.models.RunJob.update({ status: 'failed', error: 'simulated solver failure', finishedAt: new Date() }, { where: { id: failing.id } });
    await t.deps.models.RunJob.update({ status: 'running', startedAt: new Date() }, { where: { id: stopped.id } });
    // …the user cancels it, and its worker stores the best answer found so far.
    expect((await as(yard.tokens.dispatcher).post(`/runs/${runId}/cancel`)).status).toBe(200);
    await t.deps.models.RunJob.update({ status: 'cancelled', result: answer(20), finishedAt: new Date() }, { where: { id: stopped.id } });
    const { refreshRunStatus } = await import('../../server/services/runs-status');
    expect(await refreshRunStatus(t.deps, runId)).toBe('failed');
    await as(yard.tokens.admin).get('/billing/ledger'); // the billing pages' refund sweep agrees
    expect((await as(yard.tokens.dispatcher).get(`/billing/runs/${runId}`)).body.status).toBe('paid');
    expect(await runLedger(yard.organisationId, runId)).toEqual([['run_spend', -price, `run:${runId}:spend`]]);
    const csv = await as(yard.tokens.viewer).get(`/runs/${runId}/assignment.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split('\r\n')[1]).toBe('d1,Depot 1,0');
    // The price was kept, so running the failed solver again needs no new payment.
    const retried = await as(yard.tokens.dispatcher).post(`/runs/${runId}/retry`);
    expect(retried.status).toBe(200);
    expect(retried.body.status).toBe('queued');
    expect(await runLedger(yard.organisationId, runId)).toEqual([['run_spend', -price, `run:${runId}:spend`]]);
  });

  test('a paid run that failed with no answer is refunded; Retry then waits for a new payment, which is a new ledger round', async () => {
    const yard = await orgWithTokens(t.deps, 'Retry yard', 'free');
    const net = await saveNetwork(t.app, yard.tokens.dispatcher, networkBody('Twenty', 20, randomEdges(20, 0.3, 5)));
    const { runId, jobs, price } = await paidAndReleased(yard, net.versionId, [{ solver: 'qaoa' }]);
    await t.deps.models.RunJob.update({ status: 'failed', error: 'simulated solver failure', finishedAt: new Date() }, { where: { id: jobs[0].id } });
    const { refreshRunStatus } = await import('../../server/services/runs-status');
    expect(await refreshRunStatus(t.deps, runId)).toBe('failed');
    expect((await as(yard.tokens.dispatcher).get(`/billing/runs/${runId}`)).body.status).toBe('refunded');
    const balanceAfterRefund = (await as(yard.tokens.owner).get('/billing')).body.balance.amount as number;

    const retried = await as(yard.tokens.dispatcher).post(`/runs/${runId}/retry`);
    expect(retried.status).toBe(200);
    expect(retried.body.status).toBe('awaiting_payment');
    expect((await as(yard.tokens.dispatcher).get(`/billing/runs/${runId}`)).body).toMatchObject({ status: 'awaiting', price: { amount: price }, paidWith: null, refundedAt: null });
    // Nothing was queued for free: the new generation has no queue entry, and the balance is unchanged.
    const { solveQueue, queueEntryId } = await import('../../server/services/queue');
    expect(await solveQueue(t.deps).queue.getJob(queueEntryId(jobs[0].id, 1))).toBeUndefined();
    expect((await as(yard.tokens.owner).get('/billing')).body.balance.amount).toBe(balanceAfterRefund);

    expect((await as(yard.tokens.admin).post(`/runs/${runId}/pay`)).status).toBe(200);
    expect((await as(yard.tokens.viewer).get(`/runs/${runId}`)).body.status).toBe('queued');
    expect(await solveQueue(t.deps).queue.getJob(queueEntryId(jobs[0].id, 1))).toBeTruthy();
    expect(await runLedger(yard.organisationId, runId)).toEqual([
      ['run_spend', -price, `run:${runId}:spend`],
      ['run_refund', price, `run:${runId}:refund`],
      ['run_spend', -price, `run:${runId}:spend:2`],
    ]);
    // Failing again without an answer refunds the second round too, once.
    await t.deps.models.RunJob.update({ status: 'failed', error: 'simulated solver failure', finishedAt: new Date() }, { where: { id: jobs[0].id } });
    await refreshRunStatus(t.deps, runId);
    await refreshRunStatus(t.deps, runId);
    expect((await runLedger(yard.organisationId, runId)).slice(3)).toEqual([['run_refund', price, `run:${runId}:refund:2`]]);
  });
});

describe('seats', () => {
  test('an invitation refused at the seat limit succeeds after buying a seat', async () => {
    const yard = await orgWithTokens(t.deps, 'Seat yard', 'free'); // 5 members, the free plan has 3 seats
    const invite = { email: `newcomer.${yard.tag}@seat-yard.example`, role: 'viewer' };
    const refused = await as(yard.tokens.admin).post('/invitations', invite);
    expect(refused.status).toBe(402);
    expect(refused.body.code).toBe('seat_limit');
    const before = (await as(yard.tokens.owner).get('/billing')).body.seats;
    expect(before).toMatchObject({ used: 5, included: 3, purchased: 0, limit: 3 });
    expect((await as(yard.tokens.dispatcher).post('/billing/checkout', { purpose: 'seats', quantity: 3 })).status).toBe(403);
    const checkout = await as(yard.tokens.admin).post('/billing/checkout', { purpose: 'seats', quantity: 3 });
    expect(checkout.status).toBe(201);
    expect(checkout.body.amount).toBe(3 * 900); // free plan seat price, shared/plans.ts
    await fake.submitCard(checkout.body.sessionId, TEST_CARDS.pays);
    await fake.settled();
    const after = (await as(yard.tokens.owner).get('/billing')).body.seats;
    expect(after).toMatchObject({ purchased: 3, limit: 6 });
    const accepted = await as(yard.tokens.admin).post('/invitations', invite);
    expect(accepted.status).toBe(201);
    // Seats are not credits: the ledger is untouched.
    expect(await ledgerRows(yard.organisationId)).toHaveLength(0);
  });
});

describe('access and input', () => {
  test('dispatchers cannot read the billing page or buy credits; bad checkout bodies name the field', async () => {
    expect((await as(org.tokens.dispatcher).get('/billing')).status).toBe(403);
    expect((await as(org.tokens.analyst).get('/billing/ledger')).status).toBe(403);
    expect((await as(org.tokens.dispatcher).post('/billing/checkout', { purpose: 'credits', quantity: 10 })).status).toBe(403);
    const noRun = await as(org.tokens.owner).post('/billing/checkout', { purpose: 'run' });
    expect(noRun.status).toBe(400);
    expect(Object.keys(noRun.body.fields)).toContain('runId');
    const tiny = await as(org.tokens.owner).post('/billing/checkout', { purpose: 'credits', quantity: 2 });
    expect(tiny.status).toBe(400);
    const ledger = await as(org.tokens.admin).get('/billing/ledger');
    expect(ledger.status).toBe(200);
    for (const e of ledger.body.entries) expect(Number.isInteger(e.amount)).toBe(true);
    expect(ledger.body.entries[0].balanceAfter).toBe(ledger.body.balance);
  });
});
