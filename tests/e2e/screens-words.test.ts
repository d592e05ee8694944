/**
 * Screens that speak plainly and work from the keyboard, at 390×844 (touch) and 1440×900:
 *  - the audit log says who was removed and writes billing events in words, not codes;
 *  - every date on the networks, versions, runs, team, audit and billing screens has one format;
 *  - keyboard per the WAI-ARIA Authoring Practices Guide (W3C, APG: Checkbox pattern — Space
 *    toggles; Radio Group pattern — arrow keys move focus and choice): solver checkboxes, the
 *    question cards, pins from the list beside the drawing; Tab reaches the drawing canvas and
 *    Enter there adds a depot;
 *  - compare on a phone leaves no run's values clipped off the right edge.
 * Screenshots: artifacts/screenshots/screens-words-*.png.
 */
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot } from '../support/browser';
import { startTestServer } from '../support/server';
import { startWorkerProcess } from '../support/worker-process';
import { signInAs, softChecks } from '../support/screens';
import { holdTestDatabase } from '../api/setup/db-lock';
import { createOrgWithRoles, type OrgWithRoles } from '../api/setup/test-app';
import { createNetwork, addVersion } from '../../server/services/networks';
import { createRun } from '../../server/services/runs';
import { recordAudit } from '../../server/services/audit';
import { removeMember } from '../../server/services/accounts-members';

let server: Awaited<ReturnType<typeof startTestServer>>;
let worker: ReturnType<typeof startWorkerProcess>;
let browser: Browser;
let releaseDatabase: (() => Promise<void>) | undefined;
let org: OrgWithRoles;
let networkId = 0;
let versionId = 0;
const runIds: number[] = [];
const NAMES = ['Harrowfen Yard', 'Ossel Bridge', 'Tarnwyth Hub', 'Lintmouth Quay', 'Quillmere North', 'Brackley Sidings'];

beforeAll(async () => {
  releaseDatabase = await holdTestDatabase();
  server = await startTestServer(3215);
  worker = startWorkerProcess();
  org = await createOrgWithRoles(server.deps, 'Words');
  const analyst = { organisationId: org.organisationId, userId: org.users.analyst.id };
  const depots = NAMES.map((name, i) => ({ id: `Q${i + 1}`, name }));
  const lanes = depots.flatMap((a, i) => depots.slice(i + 1).filter((_, j) => (i + j) % 2 === 0).map((b, j) => ({ from: a.id, to: b.id, weight: 5 + i + j })));
  const made = await createNetwork(server.deps, analyst, { name: 'Quillmere words', depots, lanes }, { source: 'api' });
  networkId = made.id;
  await addVersion(server.deps, analyst, networkId, { depots, lanes: lanes.map((l) => ({ ...l, weight: l.weight + 1 })) }, { source: 'api' });
  const latest = await server.deps.models.NetworkVersion.findOne({ where: { networkId }, order: [['number', 'DESC']] });
  versionId = latest!.get('id') as number;
  for (const kind of ['maxcut', 'bisection'] as const) {
    const run = await createRun(server.deps, { ...analyst, role: 'analyst' as const }, { versionId, problem: { kind }, solvers: [{ solver: 'exact' }, { solver: 'greedy' }], timeLimitSeconds: 5, seed: 7 });
    runIds.push(run.id);
  }
  // Who was removed, and a billing event, for the audit log.
  const owner = { userId: org.users.owner.id, role: 'owner' as const, ip: null };
  await removeMember(server.deps, org.organisationId, owner, org.users.viewer.membershipId);
  await recordAudit(server.deps, { organisationId: org.organisationId, actorUserId: null, action: 'billing.payment_succeeded', detail: { purpose: 'credits', amount: 2500 } });
  for (let i = 0; i < 240; i++) {
    const live = await server.deps.models.Run.count({ where: { id: runIds, status: ['queued', 'running'] } });
    if (live === 0) break;
    await new Promise((r) => setTimeout(r, 500));
  }
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
  await releaseDatabase?.();
});

const MONTH = '(?:Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)';
/** Anything that reads as a date or a time of day, in any common style. */
const DATE_LIKE = new RegExp(
  [
    '\\b\\d{4}-\\d{2}-\\d{2}(?:[ T]\\d{2}:\\d{2}(?::\\d{2})?)?',
    '\\b\\d{1,2}/\\d{1,2}/\\d{2,4}(?:,? \\d{1,2}:\\d{2}(?::\\d{2})?(?: ?[AP]M)?)?',
    `\\b\\d{1,2} ${MONTH}[a-z]*\\.?(?:,? \\d{4})?(?:,? (?:at )?\\d{1,2}:\\d{2}(?::\\d{2})?)?`,
    `\\b${MONTH}[a-z]* \\d{1,2}(?:,? \\d{4})?(?:,? \\d{1,2}:\\d{2}(?::\\d{2})?(?: ?[AP]M)?)?`,
  ].join('|'),
  'g',
);
/** The one style (components/ui/dates.ts): "2 Dec 2026" or "2 Dec 2026, 14:05". */
const ONE_STYLE = new RegExp(`^\\d{1,2} ${MONTH} \\d{4}(?:, \\d{2}:\\d{2})?$`);

async function datesOn(page: Page): Promise<string[]> {
  const text = await page.evaluate(() => document.body.innerText);
  return [...text.matchAll(DATE_LIKE)].map((m) => m[0]);
}

describe.each([
  ['phone', PHONE, true],
  ['wide', WIDE, false],
] as const)('words and keys, %s', (label, viewport, touch) => {
  let context: BrowserContext;
  beforeEach(async () => {
    context = await browser.newContext({ viewport, hasTouch: touch, isMobile: touch });
  });
  afterEach(async () => {
    await context.close();
  });

  test('audit log: says who was removed, and billing events in words', async () => {
    const page = await signInAs(context, server.url, org.users.admin);
    page.setDefaultTimeout(10_000);
    await page.goto(`${server.url}/team/audit`);
    await page.getByTestId('audit-row').first().waitFor({ timeout: 30_000 });
    const rows = await page.getByTestId('audit-row').allTextContents();
    await screenshot(page, `screens-words-audit-${label}`);
    const c = softChecks();
    await c.check('who was removed', () => expect(rows.filter((r) => r.includes('removed Words viewer'))).toHaveLength(1));
    await c.check('billing in words', () => {
      const text = rows.join('\n');
      expect(text).not.toMatch(/\b[a-z]+\.[a-z]+_[a-z_]+\b/); // no dotted codes such as billing.payment_succeeded
      expect(text).toMatch(/Card payment of €25\.00/);
    });
    expect(c.failed).toEqual({});
  });

  test('dates: one style on networks, versions, runs, team, audit and billing', async () => {
    const page = await signInAs(context, server.url, org.users.owner);
    page.setDefaultTimeout(15_000);
    const found: Record<string, string[]> = {};
    const visit = async (name: string, url: string, ready: () => Promise<unknown>) => {
      await page.goto(`${server.url}${url}`);
      await ready();
      await page.waitForLoadState('networkidle');
      await page.waitForTimeout(300);
      found[name] = await datesOn(page);
    };
    await visit('networks', '/networks', () => page.getByText('Quillmere words').first().waitFor());
    await visit('versions', `/networks/${networkId}`, async () => {
      await page.getByTestId('network-screen').waitFor();
      await page.getByText(/Version 2 of 2/).first().waitFor();
      await page.getByTestId('tab-versions').click();
      await page.getByTestId('version-1').waitFor();
    });
    await visit('runs', '/runs', () => page.getByText(/Finished/).first().waitFor({ timeout: 30_000 }));
    await screenshot(page, `screens-words-runs-${label}`);
    await visit('team', '/team', () => page.getByText('Words analyst').first().waitFor());
    await visit('audit', '/team/audit', () => page.getByTestId('audit-row').first().waitFor());
    await visit('billing', '/billing', () => page.getByText(/plan/i).first().waitFor());
    const odd = Object.entries(found).flatMap(([screen, dates]) => dates.filter((d) => !ONE_STYLE.test(d)).map((d) => `${screen}: "${d}"`));
    expect(odd).toEqual([]);
    // Checked where dates are shown (a screen without any proves nothing).
    for (const screen of ['versions', 'runs', 'audit']) expect({ screen, dates: found[screen].length > 0 }).toEqual({ screen, dates: true });
    if (label === 'wide') expect(found.networks.length).toBeGreaterThan(0);
  });

  test('keyboard: Space toggles a solver, arrows and Space choose the question, pins from the list', async () => {
    const page = await signInAs(context, server.url, org.users.analyst);
    page.setDefaultTimeout(10_000);
    await page.goto(`${server.url}/runs/new?networkId=${networkId}&versionId=${versionId}`);
    const box = page.getByRole('checkbox', { disabled: false }).first();
    await box.waitFor({ timeout: 30_000 });
    const checked = async (l: ReturnType<Page['getByRole']>) => (await l.getAttribute('aria-checked')) === 'true';
    const c = softChecks();
    await c.check('Space toggles a solver checkbox', async () => {
      const before = await checked(box);
      await box.focus();
      await page.keyboard.press('Space');
      await expect(checked(box)).resolves.toBe(!before);
      await page.keyboard.press('Space');
      await expect(checked(box)).resolves.toBe(before);
    });

    const radios = page.getByRole('radiogroup', { name: 'Question' }).getByRole('radio');
    await expect(radios.count()).resolves.toBe(3);
    const chosen = async () => {
      for (let i = 0; i < 3; i++) if (await checked(radios.nth(i))) return i;
      return -1;
    };
    const start = await chosen();
    await c.check('arrow keys move the question choice and the focus', async () => {
      await radios.nth(start).focus();
      await page.keyboard.press('ArrowDown');
      await expect(chosen()).resolves.toBe((start + 1) % 3);
      await expect(radios.nth((start + 1) % 3).evaluate((el) => el === document.activeElement)).resolves.toBe(true);
      await page.keyboard.press('ArrowUp');
      await expect(chosen()).resolves.toBe(start);
    });
    await c.check('Space chooses a question card', async () => {
      const other = (start + 2) % 3;
      await radios.nth(other).focus();
      await page.keyboard.press('Space');
      await expect(chosen()).resolves.toBe(other);
      await radios.nth(start).focus();
      await page.keyboard.press('Space');
      await expect(chosen()).resolves.toBe(start);
    });

    // Pins without the drawing: find a depot in the list, arrow keys choose its side.
    await c.check('pins from the list beside the drawing', async () => {
      await page.getByLabel('Find a depot to pin').fill('Ossel', { timeout: 5000 });
      const free = page.getByRole('radio', { name: 'Ossel Bridge (Q2): Free' });
      await free.focus();
      await page.keyboard.press('ArrowRight');
      await page.getByTestId('pin-Q2').waitFor();
      await expect(page.getByTestId('pin-Q2').textContent()).resolves.toMatch(/Ossel Bridge → Side 0/);
      await free.scrollIntoViewIfNeeded();
    });
    await screenshot(page, `screens-words-pins-${label}`);
    expect(c.failed).toEqual({});
  });

  test('keyboard: Tab reaches the drawing canvas; Enter there adds a depot', async () => {
    const page = await signInAs(context, server.url, org.users.dispatcher);
    page.setDefaultTimeout(10_000);
    await page.goto(`${server.url}/networks/new`);
    await page.getByTestId('drawing-canvas').waitFor({ timeout: 30_000 });
    await page.getByLabel('Network name', { exact: true }).focus();
    let reached = false;
    for (let i = 0; i < 40 && !reached; i++) {
      await page.keyboard.press('Tab');
      reached = await page.evaluate(() => document.activeElement?.getAttribute('data-testid') === 'drawing-canvas');
    }
    expect(reached).toBe(true);
    await screenshot(page, `screens-words-canvas-focus-${label}`);
    // The keys are said on screen while the canvas has keyboard focus, Enter among them.
    await expect(page.getByTestId('canvas-keys').textContent({ timeout: 3000 })).resolves.toMatch(/Enter or Space adds a depot.*arrow keys pan/);
    await expect(page.getByText(/place the first depot, or press Enter/).count()).resolves.toBe(1);
    await page.keyboard.press('Enter');
    const field = page.getByLabel('Depot name');
    await field.waitFor();
    await page.keyboard.type('Keyed Depot');
    await page.keyboard.press('Enter');
    await field.waitFor({ state: 'detached' });
    await page.getByRole('tab', { name: 'Depots (1)' }).waitFor();
    // The new depot is drawn on the canvas.
    await expect(page.locator('svg[aria-label^="Drawing of 1 depots"]').count()).resolves.toBe(1);
  });

  test('compare: every run\'s values are on screen (nothing clipped off the right edge)', async () => {
    const page = await signInAs(context, server.url, org.users.analyst);
    page.setDefaultTimeout(15_000);
    await page.goto(`${server.url}/runs/compare?ids=${runIds.join(',')}`);
    await page.getByText('Best answer').first().waitFor({ timeout: 30_000 });
    await page.waitForTimeout(300);
    await screenshot(page, `screens-words-compare-${label}`);
    const cells = await page.locator('[data-testid^="cmp-"]').evaluateAll((els) => els.map((e) => {
      const r = e.getBoundingClientRect();
      return { id: e.getAttribute('data-testid'), left: r.left, right: r.right };
    }));
    expect(cells.length).toBeGreaterThanOrEqual(8);
    for (const id of runIds) expect(cells.some((c) => c.id?.startsWith(`cmp-${id}-`))).toBe(true);
    expect(cells.filter((c) => c.right > viewport.width + 0.5 || c.left < -0.5).map((c) => c.id)).toEqual([]);
  });
});
