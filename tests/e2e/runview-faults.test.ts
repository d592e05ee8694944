/**
 * Run setup, payment and the run screen at 390×844 (touch) and 1440×900: each fault of the
 * "screens that match the data" list for these screens has an assertion here at both sizes
 * (docs/screens-checks.md, "Runs and payment", maps fault → assertion → whether it failed before
 * the fixes). Real server, real worker process, the local payment fake and mail catcher.
 * Screenshots: .data/screens/runview-*.png.
 *
 * Prices worked by hand from the price table in shared/plans.ts (free plan): 210 depots with tabu
 * only = large solve €2.00 + one started 100 depots above 200 × €0.50 = €2.50.
 */
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { applyTestEnv } from '../support/env';
import { startWorkerProcess } from '../support/worker-process';
import { faultChecks, moneyShown, nameStartsWithVisible, PERCENT, secondsOf, shot, splitAcrossLines } from '../support/page-checks';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import { startPaymentFake, type PaymentFake } from '../../server/fakes/payments/payment-fake';
import { createOrgWithRoles, TEST_PASSWORD, type OrgWithRoles } from '../api/setup/test-app';
import { colors } from '../../components/theme';

function rgbOf(hex: string) {
  const v = parseInt(hex.slice(1), 16);
  return `rgb(${(v >> 16) & 255}, ${(v >> 8) & 255}, ${v & 255})`;
}

const APP_PORT = 3231;
const SMTP_PORT = 3238;
const PAYMENTS_PORT = 12131;
const WEBHOOK_SECRET = 'whsec_runview_e2e';
const RING = 210;
/** colors.danger of components/theme.ts as the browser reports it. */
const DANGER_RGB = rgbOf(colors.danger);

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let worker: ReturnType<typeof startWorkerProcess>;
let fake: PaymentFake;
let mail: MailCatcher;

/** This file's own database, Redis index and queue (other suites reset or serve the shared ones). */
async function isolate() {
  applyTestEnv();
  Object.assign(process.env, {
    DB_NAME: 'spinyard_e2e_runview',
    REDIS_URL: 'redis://127.0.0.1:6391/10',
    RUN_QUEUE_NAME: `runview-e2e-${Date.now().toString(36)}`,
    SMTP_PORT: String(SMTP_PORT),
    STRIPE_API_PORT: String(PAYMENTS_PORT),
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    RUN_MAIL_AFTER_SECONDS: '3600',
  });
  const { loadConfig } = await import('../../server/config');
  const { createDatabase } = await import('../../server/db');
  const admin = createDatabase({ ...loadConfig(), DB_NAME: 'mysql' });
  try {
    await admin.query('CREATE DATABASE IF NOT EXISTS `spinyard_e2e_runview` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
  } finally {
    await admin.close();
  }
}

beforeAll(async () => {
  await isolate();
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  fake = await startPaymentFake({ port: PAYMENTS_PORT, webhookUrl: `http://127.0.0.1:${APP_PORT}/api/billing/webhook`, webhookSecret: WEBHOOK_SECRET });
  server = await startTestServer(APP_PORT);
  worker = startWorkerProcess();
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
  await fake?.close();
  await mail?.close();
});

const NAMES = ['Harrowfen Yard', 'Ossel Bridge', 'Tarnwyth Hub', 'Lintmouth Quay', 'Quillmere North', 'Brackley Sidings', 'Fennick Cross', 'Old Weir', 'Sallow Point', 'Corrin Gate', 'Drumlow Depot', 'Pikestaff End'];

/** Quillmere's twelve depots: a ring with chords, volumes 3…19 (no two equal, so one optimum is likely). */
async function twelveDepots(org: OrgWithRoles) {
  const { createNetwork } = await import('../../server/services/networks');
  const depots = NAMES.map((name, i) => ({ id: `Q${i + 1}`, name }));
  const lanes = depots.flatMap((_, i) => [
    { from: `Q${i + 1}`, to: `Q${((i + 1) % 12) + 1}`, weight: 3 + ((i * 7) % 13) },
    ...(i % 3 === 0 ? [{ from: `Q${i + 1}`, to: `Q${((i + 5) % 12) + 1}`, weight: 4 + i }] : []),
  ]);
  return createNetwork(server.deps, { organisationId: org.organisationId, userId: org.users.owner.id }, { name: 'Quillmere twelve', depots, lanes }, { source: 'api' });
}

/** A ring of 210 depots with chords: over the free plan's 200 included depots, so a run is paid. */
async function longRing(org: OrgWithRoles) {
  const { createNetwork } = await import('../../server/services/networks');
  const depots = Array.from({ length: RING }, (_, i) => ({ id: `d${i + 1}`, name: `Quillmere ring ${i + 1}` }));
  const lanes = depots.flatMap((_, i) => [
    { from: `d${i + 1}`, to: `d${((i + 1) % RING) + 1}`, weight: 1 },
    ...(i % 7 === 0 ? [{ from: `d${i + 1}`, to: `d${((i + 37) % RING) + 1}`, weight: 2 }] : []),
  ]);
  return createNetwork(server.deps, { organisationId: org.organisationId, userId: org.users.owner.id }, { name: 'Quillmere long ring', depots, lanes }, { source: 'api' });
}

async function signIn(context: BrowserContext, email: string): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(TEST_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
  return page;
}

async function waitForRun(id: number, seconds = 120) {
  for (let i = 0; i < seconds * 4; i++) {
    const run = await server.deps.models.Run.findByPk(id);
    if (run && !['queued', 'running', 'awaiting_payment'].includes(run.get('status') as string)) return run.get('status');
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`run ${id} still not finished after ${seconds} s`);
}

const enabled = async (page: Page, testId: string) => {
  const el = page.getByTestId(testId);
  return (await el.getAttribute('aria-disabled')) !== 'true' && (await el.isEnabled());
};

/** How many lines the text of `testId` takes from its first money amount to its end (1 = the price phrase stays together). */
function linesFromPrice(page: Page, testId: string) {
  return page.getByTestId(testId).evaluate((root) => {
    const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT);
    for (let n = walker.nextNode(); n; n = walker.nextNode()) {
      const text = n.nodeValue ?? '';
      const at = text.search(/€\s?\d/);
      if (at < 0) continue;
      const range = document.createRange();
      range.setStart(n, at);
      range.setEnd(n, text.length);
      const rects = Array.from(range.getClientRects()).filter((r) => r.width > 0 && r.height > 0);
      return new Set(rects.map((r) => Math.round(r.top / 4))).size;
    }
    return 0;
  });
}

/** Untick every chosen solver but `keep` (the size-based defaults differ by network). */
async function onlySolver(page: Page, keep: string) {
  await page.getByTestId(`solver-${keep}`).waitFor();
  // One at a time: each untick re-renders the list (a snapshot of the boxes would go stale).
  const others = page.locator(`[data-testid^="solver-"][aria-checked="true"]:not([data-testid="solver-${keep}"])`);
  for (let i = 0; i < 20 && (await others.count()) > 0; i++) await others.first().click();
  if ((await page.getByTestId(`solver-${keep}`).getAttribute('aria-checked')) !== 'true') await page.getByTestId(`solver-${keep}`).click();
}

describe.each([
  ['phone', PHONE, true],
  ['wide', WIDE, false],
] as const)('runs and payment, %s', (label, viewport, touch) => {
  let org: OrgWithRoles;
  let paying: OrgWithRoles;
  let twelve: { id: number; versionId: number };
  let ring: { id: number; versionId: number };
  let context: BrowserContext;
  beforeAll(async () => {
    org = await createOrgWithRoles(server.deps, `Runview ${label}`, 'team');
    paying = await createOrgWithRoles(server.deps, `Runview pay ${label}`, 'free');
    twelve = await twelveDepots(org);
    ring = await longRing(paying);
  });
  beforeEach(async () => {
    context = await browser.newContext({ viewport, hasTouch: touch, isMobile: touch, acceptDownloads: true });
    // A missing element fails its check in 15 s (checks go on after a failure; see faultChecks).
    context.setDefaultTimeout(15_000);
  });
  afterEach(async () => {
    await context.close();
  });

  test('run setup: plain lines first, no placeholders, a bad value marked on its field with Start disabled, cleared when fixed', async () => {
    const c = faultChecks();
    const page = await signIn(context, org.users.analyst.email);
    const errors = watchPageErrors(page);
    await page.goto(`${server.url}/runs/new?networkId=${twelve.id}&versionId=${twelve.versionId}`);
    await page.getByTestId('kind-maxcut').click();
    await page.getByTestId('encoding-summary').waitFor();
    await page.getByTestId('solver-qaoa').waitFor();
    await page.waitForFunction(() => /qubits/.test(document.querySelector('[data-testid="solver-qaoa"]')?.textContent ?? '')).catch(() => undefined);
    await shot(page, `runview-setup-plain-${label}`);

    await c.check('Run setup: a plain line per solver; no formula before the details control, the figures behind it', async () => {
      await expect(page.getByTestId('solver-qaoa').textContent()).resolves.toMatch(/needs 12 qubits · about \d+ (s|min) · free/);
      expect(await page.locator('body').innerText()).not.toMatch(/⌈|Σ|ε|2\^|S =|Shots for ±/);
      await page.getByTestId('encoding-details-toggle').click();
      await page.getByTestId('enc-qubits').getByText('12', { exact: true }).waitFor();
      await page.getByTestId('encoding-details-toggle').click();
    });

    await c.check('Run setup: no settings key ("at most blockSize depots") in any solver description', async () => {
      await page.getByTestId('all-solvers').click();
      await page.getByTestId('solver-qaoa-blocks').waitFor();
      const solverTexts = await page.locator('[data-testid^="solver-"]').allInnerTexts();
      await page.getByTestId('solver-qaoa-blocks').scrollIntoViewIfNeeded();
      await shot(page, `runview-setup-all-solvers-${label}`);
      await page.getByTestId('all-solvers').click();
      expect(solverTexts.length).toBeGreaterThan(5);
      for (const t of solverTexts) expect(t).not.toMatch(/\b[a-z]+[A-Z][A-Za-z]*\b|[{}]/);
    });

    // A bad advanced value: a sentence right under its field, the field marked, no API path,
    // Start disabled naming the reason; fixing the value clears all of them.
    await page.getByTestId('advanced-toggle').click();
    const layers = page.getByRole('textbox', { name: /^Circuit layers/ });
    await layers.fill('-3');
    await page.waitForTimeout(1500); // the preview of this body has answered
    await shot(page, `runview-setup-bad-value-${label}`);
    await c.check('Run setup: a bad advanced value is a sentence under its field, the field marked, no API path', async () => {
      const sentence = page.getByText(/^Circuit layers.*-3.*\.$/).first();
      await sentence.waitFor({ timeout: 10_000 });
      const field = (await layers.boundingBox())!;
      const said = (await sentence.boundingBox())!;
      expect(said.y).toBeGreaterThanOrEqual(field.y + field.height - 1);
      expect(said.y - (field.y + field.height)).toBeLessThan(40);
      expect(await page.locator('body').innerText()).not.toMatch(/solvers\.\d+\.settings/);
      // Marked: invalid for assistive technology, and edged in the error red (read without focus, whose ring would hide it).
      await layers.evaluate((e) => (e as HTMLInputElement).blur());
      await expect(layers.getAttribute('aria-invalid')).resolves.toBe('true');
      const edge = await layers.evaluate((e) => getComputedStyle(e).borderTopColor);
      const calm = await page.getByRole('textbox', { name: /^Shots per energy estimate/ }).evaluate((e) => getComputedStyle(e).borderTopColor);
      expect(edge).toBe(DANGER_RGB);
      expect(calm).not.toBe(DANGER_RGB);
    });
    await c.check('Run setup: Start stays disabled while the value is bad, naming the reason', async () => {
      await page.waitForFunction(() => /^Cannot start: Circuit layers/.test(document.querySelector('[data-testid="start-run"]')?.textContent ?? ''), undefined, { timeout: 10_000 });
      await expect(enabled(page, 'start-run')).resolves.toBe(false);
    });
    await layers.fill('2');
    await c.check('Run setup: fixing the value removes the sentence and enables Start', async () => {
      await page.waitForFunction(() => /^Start run with/.test(document.querySelector('[data-testid="start-run"]')?.textContent ?? ''), undefined, { timeout: 10_000 });
      await expect(page.getByText(/^Circuit layers.*\.$/).count()).resolves.toBe(0);
      await expect(page.getByText(/solvers\.\d+\.settings/).count()).resolves.toBe(0);
      await expect(enabled(page, 'start-run')).resolves.toBe(true);
    });
    await c.check('Run setup: no page errors', async () => expect(errors).toEqual([]));
    c.done(`setup-${label}`);
  });

  test('paid run: a refusal leaves with its cause, prices stay on one line, waiting for payment says so, a card payment is one history line', async () => {
    const c = faultChecks();
    const page = await signIn(context, paying.users.owner.email);
    const errors = watchPageErrors(page);
    await page.goto(`${server.url}/runs/new?networkId=${ring.id}&versionId=${ring.versionId}`);
    await page.getByTestId('kind-maxcut').click();
    await onlySolver(page, 'tabu');

    // A refused solver: named in the summary and on Start; unticking it removes both.
    await page.getByTestId('all-solvers').click();
    await page.getByTestId('solver-exact').click();
    await page.getByText(/will not run/).first().waitFor({ timeout: 10_000 });
    await shot(page, `runview-setup-refused-${label}`);
    await c.check('Run setup: a refused solver keeps Start disabled, naming it', async () => {
      await page.waitForFunction(() => /^Untick/.test(document.querySelector('[data-testid="start-run"]')?.textContent ?? ''), undefined, { timeout: 10_000 });
      await expect(enabled(page, 'start-run')).resolves.toBe(false);
    });
    // The reported case: the refused solver is the last one ticked. Unticking it leaves no body to
    // ask the server about, so the last summary stays on screen (kept while the next one loads);
    // its refusal must not.
    await page.getByTestId('solver-tabu').click();
    await page.getByTestId('refusal-exact').waitFor({ timeout: 10_000 });
    await page.getByTestId('solver-exact').click();
    await c.check('Run setup: the refusal leaves when its cause (the ticked solver) is removed', async () => {
      await page.waitForFunction(() => /^Choose at least one solver/.test(document.querySelector('[data-testid="start-run"]')?.textContent ?? ''), undefined, { timeout: 10_000 });
      await page.waitForTimeout(1000);
      await expect(page.getByTestId('encoding-summary').innerText()).resolves.not.toMatch(/will not run/);
    });
    // Tabu alone again: the paid run below.
    await page.getByTestId('solver-tabu').click();
    await page.waitForFunction(() => /^Start run with 1 solver/.test(document.querySelector('[data-testid="start-run"]')?.textContent ?? ''), undefined, { timeout: 10_000 });

    // The price of a real paid run, on one line wherever it shows (cost line, details, Start).
    await page.getByText(/€2\.50/).first().waitFor();
    if ((await page.getByTestId('encoding-details-toggle').count()) > 0) await page.getByTestId('encoding-details-toggle').click();
    await page.getByTestId('enc-price-lines').waitFor();
    await page.getByText(/€2\.50/).first().scrollIntoViewIfNeeded();
    await shot(page, `runview-setup-price-${label}`);
    await c.check('Run setup: every price shown stays on one line (paid run)', async () => {
      expect(await moneyShown(page)).toBeGreaterThanOrEqual(3);
      await expect(splitAcrossLines(page)).resolves.toEqual([]);
      // The reported case: Start's price phrase ("€2.50, pay next") broke onto a second line on phones.
      await expect(linesFromPrice(page, 'start-run')).resolves.toBe(1);
    });
    await page.getByTestId('start-run').scrollIntoViewIfNeeded();
    await shot(page, `runview-setup-start-${label}`);
    await page.getByTestId('start-run').click();
    await page.waitForURL((u) => /^\/runs\/\d+$/.test(u.pathname));
    const runId = Number(new URL(page.url()).pathname.split('/').pop());

    // Waiting for payment: the solver's line says so, and no clock counts.
    await page.getByTestId('run-payment').waitFor();
    await page.waitForTimeout(1000);
    await shot(page, `runview-awaiting-payment-${label}`);
    await c.check('Payment: while the run waits for payment its solver says so; no seconds count, no "Waiting for a worker"', async () => {
      const waiting = await page.getByTestId('status-tabu').innerText();
      expect(waiting).toBe('Waiting for payment');
      await page.waitForTimeout(2500);
      await expect(page.getByTestId('status-tabu').innerText()).resolves.toBe(waiting);
      await expect(page.getByTestId('run-elapsed').innerText()).resolves.toBe('');
      expect(await page.locator('body').innerText()).not.toMatch(/Waiting for a worker/);
    });
    await c.check('Payment: the price on the run screen stays on one line', async () => {
      expect(await moneyShown(page)).toBeGreaterThanOrEqual(1);
      await expect(splitAcrossLines(page)).resolves.toEqual([]);
    });

    // A declined card, then a paid one: back from the payment page the decline is gone.
    await page.getByTestId('run-pay-card').click();
    await page.waitForURL((u) => u.port === String(PAYMENTS_PORT) && u.pathname.startsWith('/pay/'));
    await page.getByRole('button', { name: 'Decline this payment' }).click();
    await page.waitForURL((u) => u.pathname === `/runs/${runId}` && u.searchParams.get('payment') === 'cancelled');
    await page.getByTestId('run-payment-failed').waitFor();
    await page.getByTestId('run-pay-card').click();
    await page.waitForURL((u) => u.pathname.startsWith('/pay/'));
    // The reported case: back on the run before the provider's confirmation has arrived. The
    // fake holds its events until the screen has been checked, then delivers them.
    const heldFrom = fake.state.events.length;
    fake.setWebhookUrl(null);
    await page.getByRole('button', { name: 'Pay €2.50' }).click();
    await page.waitForURL((u) => u.pathname === `/runs/${runId}` && u.searchParams.get('payment') === 'success');
    await c.check('Payment: back from a successful card payment, no old "Card payment failed"', async () => {
      try {
        await page.getByText(/Confirming the payment|Paid €2\.50 by card/).first().waitFor({ timeout: 20_000 });
        await page.waitForTimeout(1500);
        await shot(page, `runview-payment-returned-${label}`);
        await expect(page.getByText(/Card payment failed/).count()).resolves.toBe(0);
      } finally {
        fake.setWebhookUrl(`http://127.0.0.1:${APP_PORT}/api/billing/webhook`);
        for (const e of fake.state.events.slice(heldFrom)) await fake.redeliver(e.id);
      }
      await page.getByTestId('run-payment-done').getByText('Paid €2.50 by card', { exact: false }).waitFor({ timeout: 20_000 });
      await expect(page.getByText(/Card payment failed/).count()).resolves.toBe(0);
    });

    // Billing history: the card payment for the run is one line, not +€2.50 and −€2.50.
    await page.goto(`${server.url}/billing`);
    await page.getByTestId('billing-screen').waitFor();
    await page.getByText(/Run paid|Large solve|card/i).first().waitFor().catch(() => undefined);
    await c.check('Billing history: one card payment is one line', async () => {
      const history = page.getByTestId(/^ledger-(table|list)$/);
      await history.scrollIntoViewIfNeeded();
      await shot(page, `runview-billing-history-${label}`);
      const rows = await history.locator('[data-testid^="ledger-"]').allInnerTexts();
      expect(rows.filter((t) => /2\.50/.test(t))).toHaveLength(1);
    });
    await c.check('Paid run: no page errors', async () => expect(errors).toEqual([]));
    await waitForRun(runId, 60).catch(() => undefined); // leave the worker free for the next test
    c.done(`paid-${label}`);
  });

  test('run screen: an exact energy has no "± 0" while live', async () => {
    const c = faultChecks();
    const { createRun } = await import('../../server/services/runs');
    const actor = { organisationId: org.organisationId, userId: org.users.analyst.id, role: 'analyst' as const };
    // Signed in first: the run starts at once. Exact expectations (shots 0) with enough starts to
    // keep it running for its whole time limit.
    const page = await signIn(context, org.users.analyst.email);
    const run = await createRun(server.deps, actor, { versionId: twelve.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa', settings: { shots: 0, layers: 3, restarts: 20, maxIterations: 400 } }], timeLimitSeconds: 12, seed: 3 });
    await page.goto(`${server.url}/runs/${run.id}`);
    const seen: string[] = [];
    for (let i = 0; i < 300 && !seen.some((t) => /energy/.test(t)); i++) {
      const t = await page.getByTestId('status-qaoa').innerText().catch(() => '');
      if (t) seen.push(t);
      await page.waitForTimeout(100);
    }
    await shot(page, `runview-live-exact-energy-${label}`);
    await c.check('Run view: a live row of an exact evaluation has no "± 0"', async () => {
      const live = seen.filter((t) => /energy/.test(t));
      expect({ live: live.length > 0, seen: seen.slice(-5) }).toEqual({ live: true, seen: seen.slice(-5) });
      for (const t of live) expect(t).not.toMatch(/±\s*0(?![.,]?\d)/);
    });
    await waitForRun(run.id);
    c.done(`live-${label}`);
  });

  test('run screen: count scale, restart marks, visible band, θ with names, time to best without waiting for tabu, Side 0/1, report, labels', async () => {
    const c = faultChecks();
    const { createRun } = await import('../../server/services/runs');
    const actor = { organisationId: org.organisationId, userId: org.users.analyst.id, role: 'analyst' as const };
    // exact first: it proves the optimum, and tabu (10 s allowed) should stop on reaching it.
    const run = await createRun(server.deps, actor, {
      versionId: twelve.versionId,
      problem: { kind: 'maxcut' },
      solvers: [
        { solver: 'exact' },
        { solver: 'tabu' },
        { solver: 'qaoa', settings: { shots: 512, layers: 1, restarts: 3, maxIterations: 25 } },
        { solver: 'vqe', settings: { shots: 0, layers: 1, restarts: 1, maxIterations: 60 } },
      ],
      timeLimitSeconds: 10,
      seed: 11,
    });
    await waitForRun(run.id, 180);
    const page = await signIn(context, org.users.analyst.email);
    const errors = watchPageErrors(page);
    await page.goto(`${server.url}/runs/${run.id}`);
    await page.getByTestId('proven-exact').waitFor({ timeout: 20_000 });
    await page.getByTestId('scorecard').scrollIntoViewIfNeeded();
    await shot(page, `runview-scorecard-${label}`);

    await c.check('Run view: a 12-depot run does not wait for tabu once exact proved the optimum', async () => {
      const tabu = await server.deps.models.RunJob.findOne({ where: { runId: run.id, solver: 'tabu' } });
      const seconds = JSON.parse(tabu!.get('result') as string).seconds as number;
      expect(seconds).toBeLessThan(5);
    });
    await c.check('Run view: the scorecard shows time to best', async () => {
      const tabuTime = secondsOf(await page.getByTestId('time-tabu').innerText());
      expect(secondsOf(await page.getByTestId('toBest-tabu').innerText())).toBeLessThanOrEqual(tabuTime);
    });

    await page.getByTestId('score-qaoa').click();
    await c.check('Run view: the histogram has a count scale', async () => {
      await page.getByTestId('sample-histogram').scrollIntoViewIfNeeded();
      await shot(page, `runview-histogram-${label}`);
      const ticks = (await page.getByTestId('histogram-tick').allTextContents()).map((t) => Number(t.replace(/,/g, '')));
      expect(ticks.length).toBeGreaterThan(1);
      expect(ticks[0]).toBe(0);
      expect(ticks.every(Number.isInteger)).toBe(true);
    });

    // The energy chart: each restart marked where it begins (3 starts → 2 marks, unless the time
    // limit cut the starts short), the marks explained; the shot-noise band clearly visible.
    const card = page.getByTestId('convergence-card');
    await card.scrollIntoViewIfNeeded();
    await shot(page, `runview-convergence-${label}`);
    await c.check('Run view: the convergence chart marks each restart and explains it', async () => {
      const marks = await card.getByTestId('convergence-restart-marker').allTextContents();
      expect(marks.length).toBeGreaterThanOrEqual(1);
      expect(marks[0]).toBe('start 2');
      await expect(card.getByTestId('convergence-restarts').innerText()).resolves.toMatch(/start 2/);
    });
    await c.check('Run view: the ± standard-error band is clearly visible', async () => {
      const band = card.getByTestId('convergence-band');
      expect(Number(await band.getAttribute('fill-opacity'))).toBeGreaterThanOrEqual(0.45);
      expect((await band.boundingBox())!.height).toBeGreaterThan(4);
    });

    await page.getByTestId('score-vqe').click();
    await c.check("Run view: VQE's θ values stay with their names", async () => {
      await page.getByTestId('final-params').scrollIntoViewIfNeeded();
      await shot(page, `runview-vqe-params-${label}`);
      const params = page.getByTestId('final-params').getByTestId('param');
      expect(await params.count()).toBeGreaterThan(4);
      for (const h of await params.evaluateAll((els) => els.map((e) => e.getBoundingClientRect().height))) expect(h).toBeLessThan(26);
      for (const t of await params.allInnerTexts()) expect(t).toMatch(/^θ\S*\s=\s-?\d/);
    });

    await c.check('Run view: two-region results say Side 0/1 like the CSV', async () => {
      await page.getByTestId('partition-view').scrollIntoViewIfNeeded();
      await shot(page, `runview-partition-${label}`);
      await page.getByTestId('region-0').getByText('Side 0', { exact: true }).waitFor();
      await page.getByTestId('region-1').getByText('Side 1', { exact: true }).waitFor();
    });

    await page.goto(`${server.url}/runs/${run.id}/report`);
    await page.getByTestId('report-assignment').waitFor();
    await shot(page, `runview-report-${label}`);
    await c.check('Report: no zoom buttons, no "Tap a depot…"', async () => {
      expect(await page.getByTestId('zoom-in').count()).toBe(0);
      expect(await page.getByText(/Tap a depot/).count()).toBe(0);
    });

    await page.goto(`${server.url}/runs`);
    const item = page.getByTestId(`run-item-${run.id}`);
    await item.waitFor();
    const listed = await item.innerText();
    await shot(page, `runview-runs-list-${label}`);
    await c.check('Runs list: solver labels, not codes', async () => {
      expect(listed).toMatch(/Exact enumeration/);
      expect(listed).toMatch(/Tabu search/);
      expect(listed).not.toMatch(/\b(exact|tabu|qaoa|vqe)\b/);
    });
    await c.check('Run view: no page errors', async () => expect(errors).toEqual([]));
    c.done(`runview-${label}`);
  });

  test('k-way run: "Took" is never shorter than a solver\'s own time; the runs list shows fm by its label', async () => {
    const c = faultChecks();
    const { createRun } = await import('../../server/services/runs');
    const actor = { organisationId: org.organisationId, userId: org.users.analyst.id, role: 'analyst' as const };
    const run = await createRun(server.deps, actor, {
      versionId: twelve.versionId,
      problem: { kind: 'kway', k: 3, tolerance: 0.3 },
      solvers: [{ solver: 'exact' }, { solver: 'fm' }, { solver: 'qaoa', settings: { restarts: 1, maxIterations: 40 } }],
      timeLimitSeconds: 10,
      seed: 5,
    });
    await waitForRun(run.id, 180);
    const page = await signIn(context, org.users.analyst.email);
    await page.goto(`${server.url}/runs/${run.id}`);
    await page.getByTestId('scorecard').waitFor({ timeout: 20_000 });
    await page.getByTestId('run-progress').scrollIntoViewIfNeeded();
    await shot(page, `runview-kway-took-${label}`);
    await c.check('Run view: "Took" reflects the solvers\' time in a k-way run', async () => {
      const took = secondsOf(await page.getByTestId('run-elapsed').innerText());
      // The solvers' own times as stored (independent of the screen's formatting).
      const jobs = await server.deps.models.RunJob.findAll({ where: { runId: run.id } });
      const own = jobs.map((j) => JSON.parse(j.get('result') as string).seconds as number);
      expect(Math.max(...own)).toBeGreaterThan(0.01);
      expect(took).toBeGreaterThanOrEqual(Math.max(...own) - 0.005);
    });
    await c.check("Run view: each solver's percentage stays on one line beside its label", async () => {
      await expect(page.getByTestId('run-progress').innerText()).resolves.toMatch(/100 %/);
      await expect(splitAcrossLines(page, PERCENT)).resolves.toEqual([]);
    });
    await c.check('Run view: k regions named Region 0…k−1 like the CSV', async () => {
      await page.getByTestId('region-2').getByText('Region 2', { exact: true }).waitFor();
    });
    await page.goto(`${server.url}/runs`);
    await page.getByTestId(`run-item-${run.id}`).waitFor();
    const listed = await page.getByTestId(`run-item-${run.id}`).innerText();
    await c.check('Runs list: fm shown by its label', async () => expect(listed).not.toMatch(/\bfm\b/));
    c.done(`kway-${label}`);
  });

  test('lanes table: each row is named by what it shows, starting with it (WCAG 2.5.3 Label in Name)', async () => {
    const c = faultChecks();
    const page = await signIn(context, org.users.analyst.email);
    await page.goto(`${server.url}/networks/${twelve.id}`);
    await page.getByTestId('network-screen').waitFor();
    await page.getByTestId('tab-lanes').click();
    await page.getByTestId('lanes-table').waitFor();
    await page.getByTestId('lanes-table').scrollIntoViewIfNeeded();
    await shot(page, `runview-lanes-table-${label}`);
    await c.check('Lanes table: every row\'s accessible name starts with its visible text', async () => {
      const rows = page.locator('[data-testid^="lane-row-"]');
      expect(await rows.count()).toBe(16);
      for (const row of await rows.all()) {
        const button = row.getByRole('button');
        const visible = await button.innerText();
        const name = (await button.getAttribute('aria-label')) ?? visible;
        expect({ visible, name, ok: nameStartsWithVisible(name, visible) }).toEqual({ visible, name, ok: true });
      }
      // Speech users say what they see: the first lane is found by its two ends.
      await page.getByRole('button', { name: /^Q1\s*Q2$/ }).click();
      await expect(page.getByRole('button', { name: /^Q1\s*Q2$/ }).getAttribute('aria-pressed')).resolves.toBe('true');
    });
    c.done(`lanes-${label}`);
  });
});
