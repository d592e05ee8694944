/**
 * axe-core 4 (Deque Systems, the `axe-core` npm package; rules tagged WCAG 2.0/2.1/2.2 level A and
 * AA) over every main screen, at 390×844 (touch) and 1440×900, as every role: zero violations.
 * The engine is injected into each page by this suite (CSP bypassed for the injection only).
 * Screenshots: artifacts/screenshots/axe-<screen>-<role>-<size>.png.
 */
import fs from 'node:fs';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot } from '../support/browser';
import { startTestServer } from '../support/server';
import { startWorkerProcess } from '../support/worker-process';
import { holdTestDatabase } from '../api/setup/db-lock';
import { createOrgWithRoles, type OrgWithRoles } from '../api/setup/test-app';
import { createNetwork } from '../../server/services/networks';
import { createRun } from '../../server/services/runs';
import type { Role } from '../../shared/permissions';

const AXE_SOURCE = fs.readFileSync(require.resolve('axe-core/axe.min.js'), 'utf8');
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
const ROLES: Role[] = ['owner', 'admin', 'analyst', 'dispatcher', 'viewer'];

let server: Awaited<ReturnType<typeof startTestServer>>;
let worker: ReturnType<typeof startWorkerProcess>;
let browser: Browser;
let releaseDatabase: (() => Promise<void>) | undefined;
let org: OrgWithRoles;
let networkId = 0;
let versionId = 0;
const runIds: number[] = [];

beforeAll(async () => {
  releaseDatabase = await holdTestDatabase();
  server = await startTestServer(3207);
  worker = startWorkerProcess();
  org = await createOrgWithRoles(server.deps, 'Axe');
  const names = ['Harrowfen Yard', 'Ossel Bridge', 'Tarnwyth Hub', 'Lintmouth Quay', 'Quillmere North', 'Brackley Sidings'];
  const depots = names.map((name, i) => ({ id: `Q${i + 1}`, name, weight: 1 }));
  const lanes = depots.flatMap((a, i) => depots.slice(i + 1).filter((_, j) => (i + j) % 2 === 0).map((b, j) => ({ from: a.id, to: b.id, weight: 5 + i + j })));
  const made = await createNetwork(server.deps, { organisationId: org.organisationId, userId: org.users.analyst.id }, { name: 'Quillmere axe', depots, lanes }, { source: 'api' });
  networkId = made.id;
  versionId = made.versionId;
  const actor = { organisationId: org.organisationId, userId: org.users.analyst.id, role: 'analyst' as const };
  for (const kind of ['maxcut', 'bisection'] as const) {
    const run = await createRun(server.deps, actor, { versionId, problem: { kind }, solvers: [{ solver: 'exact' }, { solver: 'qaoa' }], timeLimitSeconds: 5, seed: 7 });
    runIds.push(run.id);
  }
  // Wait for the worker to finish both runs (the run screen is audited with results on it).
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

const SCREENS: [string, () => string][] = [
  ['networks', () => '/networks'],
  ['network', () => `/networks/${networkId}`],
  ['draw', () => '/networks/new'],
  ['import', () => '/networks/import'],
  ['runs', () => '/runs'],
  ['run', () => `/runs/${runIds[0]}`],
  ['run-setup', () => `/runs/new?networkId=${networkId}&versionId=${versionId}`],
  ['compare', () => `/runs/compare?ids=${runIds.join(',')}`],
  ['team', () => '/team'],
  ['audit', () => '/team/audit'],
  ['billing', () => '/billing'],
  ['account', () => '/account'],
  ['api-docs', () => '/api-docs'],
];

async function signIn(context: BrowserContext, role: Role) {
  const page = await context.newPage();
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(org.users[role].email);
  await page.getByTestId('sign-in-password').fill(org.users[role].password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
  await page.close();
}

async function settle(page: Page) {
  await page.waitForLoadState('networkidle');
  // Audit the screen itself, not its loading state (a busy machine can take a while).
  await page.waitForFunction(() => document.body.innerText.trim().length > 0 && !/Loading/.test(document.body.innerText), undefined, { timeout: 45_000 });
  await page.evaluate(() => document.fonts.ready);
  await page.waitForTimeout(300);
}

/** axe's violations as "rule (impact): target — summary" lines, easy to read in a failure. */
async function axeViolations(page: Page): Promise<string[]> {
  await page.evaluate(AXE_SOURCE);
  const result = await page.evaluate(async (tags) => {
    const axe = (window as unknown as { axe: { run: (ctx: unknown, opts: unknown) => Promise<{ violations: { id: string; impact: string; nodes: { target: string[]; failureSummary: string }[] }[] }> } }).axe;
    return axe.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
  }, WCAG_TAGS);
  return result.violations.flatMap((v) => v.nodes.map((n) => `${v.id} (${v.impact}): ${n.target.join(' ')} — ${n.failureSummary.replace(/\s+/g, ' ').slice(0, 200)}`));
}

describe.each([
  ['phone', PHONE, true],
  ['wide', WIDE, false],
] as const)('%s', (label, viewport, touch) => {
  describe.each(ROLES)('%s', (role) => {
    let context: BrowserContext;
    beforeAll(async () => {
      context = await browser.newContext({ viewport, hasTouch: touch, isMobile: touch, bypassCSP: true });
      await signIn(context, role);
    });
    afterAll(async () => {
      await context?.close();
    });

    test.each(SCREENS)('%s: no WCAG 2 A/AA violation', async (name, url) => {
      const page = await context.newPage();
      await page.goto(`${server.url}${url()}`);
      await settle(page);
      if (role === 'analyst' || role === 'viewer') await screenshot(page, `axe-${name}-${role}-${label}`);
      expect(await axeViolations(page)).toEqual([]);
      await page.close();
    });
  });
});
