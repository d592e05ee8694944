/**
 * Paying for a large solve in the browser at phone size: the run setup shows the price, the run
 * waits for payment, a declined test card leaves it unpaid with the reason, paying on the fake's
 * hosted page releases it to a real worker, the receipt e-mail arrives; the billing page shows
 * the history (phone and wide screenshots). The official SDK talks to our payment fake; its
 * webhooks are checked with the SDK's constructEvent.
 *
 * Expected price, worked by hand from the price table in shared/plans.ts (free plan): 210 depots
 * with tabu only = large solve 2.00 € + one started 100 depots above 200 × 0.50 € = 2.50 €.
 */
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { useOwnDatabase } from '../support/own-database';
import { startWorkerProcess } from '../support/worker-process';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payments/payment-fake';
import { createOrgWithRoles, TEST_PASSWORD, type OrgWithRoles } from '../api/setup/test-app';

const APP_PORT = 3142;
const SMTP_PORT = 3148;
const PAYMENTS_PORT = 12112;
const WEBHOOK_SECRET = 'whsec_billing_e2e';
const DEPOTS = 210;

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let worker: ReturnType<typeof startWorkerProcess>;
let fake: PaymentFake;
let mail: MailCatcher;
let org: OrgWithRoles;
let net: { id: number; versionId: number };

beforeAll(async () => {
  await useOwnDatabase('billing', {
    RUN_QUEUE_NAME: `billing-e2e-${Date.now().toString(36)}`,
    SMTP_PORT: String(SMTP_PORT),
    STRIPE_API_PORT: String(PAYMENTS_PORT),
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    RUN_MAIL_AFTER_SECONDS: '3600',
  });
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  fake = await startPaymentFake({ port: PAYMENTS_PORT, webhookUrl: `http://127.0.0.1:${APP_PORT}/api/billing/webhook`, webhookSecret: WEBHOOK_SECRET });
  server = await startTestServer(APP_PORT);
  worker = startWorkerProcess();
  org = await createOrgWithRoles(server.deps, 'Pay yard', 'free');
  const { createNetwork } = await import('../../server/services/networks');
  // A ring of 210 depots with chords: over the free plan's 200 included depots.
  const depots = Array.from({ length: DEPOTS }, (_, i) => ({ id: `d${i + 1}`, name: `Depot ${i + 1}` }));
  const lanes = depots.flatMap((_, i) => [
    { from: `d${i + 1}`, to: `d${((i + 1) % DEPOTS) + 1}`, weight: 1 },
    ...(i % 7 === 0 ? [{ from: `d${i + 1}`, to: `d${((i + 37) % DEPOTS) + 1}`, weight: 2 }] : []),
  ]);
  net = await createNetwork(server.deps, { organisationId: org.organisationId, userId: org.users.owner.id }, { name: 'Long ring', depots, lanes }, { source: 'api' });
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
  await fake?.close();
  await mail?.close();
});

async function signIn(page: Page, email: string) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(TEST_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
}

test('phone: a large run shows its price, a declined card keeps it unpaid, paying starts it, the receipt arrives', async () => {
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  await signIn(page, org.users.owner.email);

  // Set up: max-cut with tabu only; the preview prices it before launch.
  await page.goto(`${server.url}/runs/new?networkId=${net.id}&versionId=${net.versionId}`);
  await page.getByTestId('kind-maxcut').click();
  await page.getByTestId('solver-tabu').waitFor();
  // Untick every other suggested solver, one at a time (the list re-renders after each change;
  // above the statevector limit the suggestions include rqaoa and qaoa-blocks).
  const others = '[data-testid^="solver-"][aria-checked="true"]:not([data-testid="solver-tabu"])';
  const ticked = page.locator(others);
  for (let i = 0; i < 12 && (await ticked.count()) > 0; i++) {
    const before = await ticked.count();
    await ticked.first().click();
    await page.waitForFunction(([sel, n]) => document.querySelectorAll(sel as string).length < (n as number), [others, before] as const);
  }
  expect(await ticked.count()).toBe(0);
  if ((await page.getByTestId('solver-tabu').getAttribute('aria-checked')) !== 'true') await page.getByTestId('solver-tabu').click();
  await page.getByTestId('run-cost').getByText('This run costs €2.50', { exact: false }).waitFor();
  await page.getByTestId('encoding-details-toggle').click();
  const lines = page.getByTestId('enc-price-lines');
  await lines.getByText('Large solve: €2.00').waitFor();
  await lines.getByText(`${DEPOTS - 200} depots above 200: €0.50`).waitFor();
  // Dispatchers and analysts see whether the organisation can afford it before launch.
  await page.getByTestId('enc-price-note').getByText('do not cover it', { exact: false }).waitFor();
  await lines.scrollIntoViewIfNeeded();
  await screenshot(page, 'billing-setup-price-phone');
  await page.getByTestId('start-run').click();
  await page.waitForURL((u) => /^\/runs\/\d+$/.test(u.pathname));
  const runId = Number(new URL(page.url()).pathname.split('/').pop());

  // Held: the run screen shows the price and the ways to pay.
  await page.getByTestId('run-payment').waitFor();
  await expect(page.getByTestId('run-price').textContent()).resolves.toBe('€2.50');
  await page.getByTestId('run-credits').getByText('do not cover it', { exact: false }).waitFor();
  await screenshot(page, 'billing-run-awaiting-phone');

  // A declined card: back on the run, still unpaid, with the reason.
  await page.getByTestId('run-pay-card').click();
  await page.waitForURL((u) => u.port === String(PAYMENTS_PORT) && u.pathname.startsWith('/pay/'));
  await page.getByText('Local test payment page', { exact: false }).waitFor();
  await expect(page.getByTestId('fake-amount').textContent()).resolves.toBe('€2.50');
  await screenshot(page, 'billing-hosted-page-phone');
  await page.getByRole('button', { name: 'Decline this payment' }).click();
  await page.waitForURL((u) => u.pathname === `/runs/${runId}` && u.searchParams.get('payment') === 'cancelled');
  await page.getByTestId('run-payment-failed').getByText('Card payment failed: Your card was declined.', { exact: false }).waitFor();
  await screenshot(page, 'billing-run-declined-phone');
  const held = await server.deps.models.Run.findByPk(runId);
  expect(held!.get('status')).toBe('awaiting_payment');

  // Pay: the run is released to the worker and starts.
  await page.getByTestId('run-pay-card').click();
  await page.waitForURL((u) => u.pathname.startsWith('/pay/'));
  await page.getByRole('button', { name: 'Pay €2.50' }).click();
  await page.waitForURL((u) => u.pathname === `/runs/${runId}` && u.searchParams.get('payment') === 'success');
  // Back from a successful payment the earlier decline is history: never shown beside "Confirming".
  await expect(page.getByTestId('run-payment-failed').count()).resolves.toBe(0);
  await page.getByTestId('run-payment-done').getByText('Paid €2.50 by card', { exact: false }).waitFor({ timeout: 20_000 });
  await page.getByTestId('run-progress').waitFor({ timeout: 30_000 });
  await screenshot(page, 'billing-run-paid-phone');
  const started = await server.deps.models.RunJob.findAll({ where: { runId } });
  expect(started.length).toBe(1);
  await expect(
    (async () => {
      for (let i = 0; i < 120; i++) {
        const job = await server.deps.models.RunJob.findOne({ where: { runId } });
        if (job && job.get('status') !== 'queued') return job.get('status');
        await new Promise((r) => setTimeout(r, 250));
      }
      return 'still queued';
    })(),
  ).resolves.toMatch(/running|succeeded/);

  // The receipt e-mail.
  const receipt = await mail.waitFor((m) => m.to.includes(org.users.owner.email) && /receipt/i.test(m.subject), 15_000);
  expect(receipt.text).toContain(`Large solve, run #${runId}`);
  expect(receipt.text).toContain('Total: €2.50');

  // The billing page: balance unchanged (the card paid the run), one line for the payment — not +€2.50 and −€2.50.
  await page.goto(`${server.url}/billing`);
  await page.getByTestId('billing-screen').waitFor();
  await expect(page.getByTestId('billing-balance').textContent()).resolves.toBe('€0.00');
  await page.getByTestId('ledger-list').getByText('Run paid by card').waitFor();
  await page.getByTestId('ledger-list').getByText('€2.50 by card').waitFor();
  await expect(page.getByTestId('ledger-list').getByText('+€2.50').count()).resolves.toBe(0);
  await screenshot(page, 'billing-page-phone');
  await page.getByTestId('receipts').scrollIntoViewIfNeeded();
  await screenshot(page, 'billing-receipts-phone');
  expect(errors).toEqual([]);
  await context.close();
});

test('wide: buying credits adds them to the balance and the history table; buying seats raises the seat limit', async () => {
  const context = await browser.newContext({ viewport: WIDE });
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  await signIn(page, org.users.admin.email);
  await page.goto(`${server.url}/billing`);
  await page.getByTestId('billing-screen').waitFor();
  await screenshot(page, 'billing-page-wide-before');
  await page.getByTestId('buy-credits-2500').click();
  await page.waitForURL((u) => u.pathname.startsWith('/pay/'));
  await page.getByRole('button', { name: 'Pay €25.00' }).click();
  await page.waitForURL((u) => u.pathname === '/billing' && u.searchParams.get('checkout') === 'success');
  await page.getByTestId('checkout-success').waitFor();
  // The event may land a moment after the redirect; the page polls briefly after a checkout.
  await page.getByTestId('billing-balance').getByText('€25.00', { exact: true }).waitFor({ timeout: 15_000 });
  await page.getByTestId('ledger-table').getByText('Credits bought', { exact: true }).waitFor();
  await screenshot(page, 'billing-page-wide');

  // Seats: 5 members on a 3-seat plan; buying 2 raises the limit to 5.
  await expect(page.getByTestId('billing-seats-count').textContent()).resolves.toBe('5 of 3 in use');
  await page.getByRole('button', { name: 'One seat more' }).click();
  await page.getByRole('button', { name: 'Buy 2 seats · €18.00' }).click();
  await page.waitForURL((u) => u.pathname.startsWith('/pay/'));
  await page.getByRole('button', { name: 'Pay €18.00' }).click();
  await page.waitForURL((u) => u.pathname === '/billing' && u.searchParams.get('checkout') === 'success');
  await page.getByTestId('billing-seats-count').getByText('5 of 5 in use', { exact: true }).waitFor({ timeout: 15_000 });
  await screenshot(page, 'billing-seats-wide');
  expect(errors).toEqual([]);
  await context.close();
});
