/**
 * Screens that match the data, at 390×844 (touch) and 1440×900: a duplicated version is what the
 * workspace shows; deleting a network leaves at once and a gone address says so at once; a removed
 * member gets a way forward; a tap on the phone's drawing opens the "New depot" dialog without the
 * same tap reaching it; the wide networks table keeps each number in its column.
 * Screenshots go to artifacts/screenshots (screens-*).
 */
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { holdTestDatabase } from '../api/setup/db-lock';
import { createOrgWithRoles, type OrgWithRoles } from '../api/setup/test-app';
import { createNetwork, addVersion } from '../../server/services/networks';
import type { Role } from '../../shared/permissions';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let releaseDatabase: (() => Promise<void>) | undefined;

beforeAll(async () => {
  releaseDatabase = await holdTestDatabase();
  server = await startTestServer(3205);
  browser = await launchBrowser();
});
afterAll(async () => {
  await releaseDatabase?.();
  await browser?.close();
  await server?.stop();
});

const depots = (n: number) => Array.from({ length: n }, (_, i) => ({ id: `D${i + 1}`, name: `Quillmere depot ${i + 1}` }));
const ring = (n: number) => Array.from({ length: n }, (_, i) => ({ from: `D${i + 1}`, to: `D${((i + 1) % n) + 1}`, weight: 10 + i }));

/** A network whose version 1 has 3 depots and version 2 has 5. */
async function twoVersionNetwork(org: OrgWithRoles, name: string) {
  const actor = { organisationId: org.organisationId, userId: org.users.owner.id };
  const n = await createNetwork(server.deps, actor, { name, depots: depots(3), lanes: ring(3) }, { source: 'api' });
  await addVersion(server.deps, actor, n.id, { depots: depots(5), lanes: ring(5) }, { source: 'api' });
  return n.id;
}

async function signIn(context: BrowserContext, org: OrgWithRoles, role: Role): Promise<Page> {
  const page = await context.newPage();
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(org.users[role].email);
  await page.getByTestId('sign-in-password').fill(org.users[role].password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
  return page;
}

describe.each([
  ['phone', PHONE, true],
  ['wide', WIDE, false],
] as const)('screens, %s', (label, viewport, touch) => {
  let org: OrgWithRoles;
  let context: BrowserContext;
  beforeAll(async () => {
    org = await createOrgWithRoles(server.deps, `Screens ${label}`);
  });
  beforeEach(async () => {
    context = await browser.newContext({ viewport, hasTouch: touch, isMobile: touch });
  });
  afterEach(async () => {
    await context.close();
  });

  test('Versions → Duplicate: header, summary and lanes all show the duplicated version', async () => {
    const id = await twoVersionNetwork(org, `Duplicate ${label}`);
    const page = await signIn(context, org, 'analyst');
    const errors = watchPageErrors(page);
    await page.goto(`${server.url}/networks/${id}`);
    await page.getByTestId('network-screen').waitFor();
    // The depots tab names its count: a check that reads the data shown, on any build.
    await page.getByRole('tab', { name: 'Depots (5)', exact: true }).waitFor({ timeout: 5000 });
    await expect(page.getByTestId('summary-depots').first().textContent()).resolves.toBe('5');
    await page.getByTestId('tab-versions').click();
    await page.getByTestId('version-1').getByRole('button', { name: 'Duplicate' }).click();
    await page.getByText(/Version 3 of 3/).waitFor();
    // The workspace follows the new latest version without a reload (version 1 has 3 depots).
    await page.getByRole('tab', { name: 'Depots (3)', exact: true }).waitFor({ timeout: 5000 });
    await page.waitForFunction(() => document.querySelector('[data-testid="summary-depots"]')?.textContent === '3', undefined, { timeout: 5000 });
    await page.getByTestId('tab-lanes').click();
    await page.getByRole('tab', { name: 'Lanes (3)' }).waitFor({ timeout: 5000 });
    await screenshot(page, `screens-duplicated-${label}`);
    expect(errors).toEqual([]);
  });

  test('Delete network: the dialog closes and the list shows at once; a gone address says so at once', async () => {
    const id = await twoVersionNetwork(org, `Delete ${label}`);
    const page = await signIn(context, org, 'admin');
    await page.goto(`${server.url}/networks/${id}`);
    await page.getByTestId('network-screen').waitFor();
    if (label === 'phone') await page.getByRole('button', { name: 'More' }).click();
    await page.getByRole('button', { name: 'Delete', exact: true }).click();
    const started = Date.now();
    await page.getByRole('button', { name: 'Delete network' }).click();
    await page.waitForURL((u) => u.pathname === '/networks', { timeout: 3000 });
    await page.getByRole('button', { name: 'Delete network' }).waitFor({ state: 'detached', timeout: 3000 });
    expect(Date.now() - started).toBeLessThan(3000);
    await expect(page.getByText(`Delete ${label}`, { exact: true }).count()).resolves.toBe(0);

    // Not found answers at once (no retries of a 404): well under TanStack Query's ~7 s of retries.
    const t0 = Date.now();
    await page.goto(`${server.url}/networks/${id}`);
    await page.getByText('This network cannot be shown').waitFor({ timeout: 3000 });
    await page.goto(`${server.url}/runs/987654321`);
    await page.getByText('Run not found').waitFor({ timeout: 3000 });
    expect(Date.now() - t0).toBeLessThan(6000);
    await screenshot(page, `screens-run-not-found-${label}`);
  });

  test('a removed member sees where they stand and a way forward on every page', async () => {
    const other = await createOrgWithRoles(server.deps, `Screens other ${label}`);
    // The viewer of `org` is also an analyst elsewhere; the dispatcher belongs nowhere else.
    await server.deps.models.Membership.create({ organisationId: other.organisationId, userId: org.users.viewer.id, role: 'analyst' });
    const page = await signIn(context, org, 'viewer');
    await page.getByTestId('networks-screen').waitFor();
    await server.deps.models.Membership.destroy({ where: { organisationId: org.organisationId, userId: org.users.viewer.id } });
    // Moving on in the app (no reload): the refused request refreshes who the user is.
    await page.getByTestId('nav-runs').first().click();
    // The way forward: their other organisation, offered by name.
    await page.getByRole('button', { name: `Open ${other.name}` }).waitFor({ timeout: 5000 });
    await expect(page.getByTestId('no-organisation').count()).resolves.toBe(1);
    await screenshot(page, `screens-removed-member-${label}`);
    await page.getByRole('button', { name: `Open ${other.name}` }).click();
    await page.getByTestId('networks-screen').waitFor({ timeout: 5000 });
    await expect(page.getByTestId('shell-org-name').first().textContent()).resolves.toContain(other.name);
  });

  test('a member removed from their only organisation is told how to get back in, and can sign out', async () => {
    const lonely = await signIn(context, org, 'dispatcher');
    await lonely.getByTestId('networks-screen').waitFor();
    await server.deps.models.Membership.destroy({ where: { organisationId: org.organisationId, userId: org.users.dispatcher.id } });
    await lonely.reload();
    await lonely.getByText(/An admin can invite you again/).waitFor({ timeout: 10_000 });
    await expect(lonely.getByTestId('no-organisation').count()).resolves.toBe(1);
    await screenshot(lonely, `screens-removed-alone-${label}`);
    await lonely.getByRole('button', { name: 'Sign out' }).click();
    await lonely.waitForURL((u) => u.pathname === '/sign-in', { timeout: 10_000 });
  });

  test('wide networks table: every number sits in its column on the row of its name', async () => {
    await twoVersionNetwork(org, `Columns ${label}`);
    const page = await signIn(context, org, 'owner');
    await page.getByTestId('networks-screen').waitFor();
    if (label === 'phone') {
      await page.getByTestId('networks-list').waitFor();
      await screenshot(page, `screens-networks-list-${label}`);
      return;
    }
    // The row is found from the name the user sees (the nearest box holding it and five more texts).
    const row = page.getByText(`Columns ${label}`, { exact: true }).locator('xpath=ancestor::*[count(.//div[@dir="auto"]) >= 6][1]');
    await row.waitFor();
    const boxes = await row.locator('div[dir="auto"]').evaluateAll((els) => els.map((e) => e.getBoundingClientRect()).map((r) => ({ x: r.x, y: r.y, h: r.height })));
    expect(boxes.length).toBe(6);
    const offRow = boxes.slice(1).filter((b) => Math.abs(b.y + b.h / 2 - (boxes[0].y + boxes[0].h / 2)) >= 6).length;
    expect({ offRow }).toEqual({ offRow: 0 });
    for (let i = 1; i < boxes.length; i++) expect(boxes[i].x).toBeGreaterThan(boxes[i - 1].x);
    await screenshot(page, `screens-networks-list-${label}`);
  });
});

/**
 * Draw: the tap (phone) or click (wide) that opens "New depot" must not reach the dialog that
 * opens under it. The fault was the phone's: the browser's emulated click after a touch landed on
 * the dialog's backdrop or its "Add depot" button. The wide run checks the same spots by mouse.
 */
test.each([
  ['phone', PHONE, true],
  ['wide', WIDE, false],
] as const)('Draw, %s: the tap that opens "New depot" does not reach the dialog (neither its backdrop nor its buttons)', async (label, viewport, touch) => {
  const org = await createOrgWithRoles(server.deps, `Screens tap ${label}`);
  const context = await browser.newContext({ viewport, hasTouch: touch, isMobile: touch });
  const page = await signIn(context, org, 'dispatcher');
  await page.goto(`${server.url}/networks/new`);
  const canvas = page.getByTestId('drawing-canvas');
  await canvas.evaluate((e) => e.scrollIntoView({ block: 'center' }));
  const box = (await canvas.boundingBox())!;
  const tap = (x: number, y: number) => (touch ? page.touchscreen.tap(x, y) : page.mouse.click(x, y));
  // Open the dialog once to learn where its button and backdrop appear, then tap the canvas at exactly those spots.
  await tap(box.x + box.width / 2, box.y + box.height / 2);
  const add = page.getByRole('button', { name: 'Add depot' });
  await add.waitFor();
  const addBox = (await add.boundingBox())!;
  await page.getByRole('button', { name: 'Cancel' }).click();
  await add.waitFor({ state: 'detached' });
  const spots = [
    { what: 'Add depot button', x: addBox.x + addBox.width / 2, y: addBox.y + addBox.height / 2 },
    { what: 'backdrop', x: box.x + box.width * 0.85, y: box.y + 24 }, // above the dialog, clear of the Undo/Redo row
  ].filter((s) => s.x > box.x && s.x < box.x + box.width && s.y > box.y && s.y < box.y + box.height);
  expect(spots.map((s) => s.what)).toContain('backdrop');
  if (label === 'phone') expect(spots).toHaveLength(2); // on the phone the dialog's button lies over the canvas
  for (const s of spots) {
    await tap(s.x, s.y);
    await page.getByLabel('Depot name').waitFor();
    await page.waitForTimeout(400); // the emulated click would have landed by now
    await expect(page.getByLabel('Depot name').isVisible()).resolves.toBe(true);
    await expect(page.getByRole('tab', { name: 'Depots (0)' }).count()).resolves.toBe(1);
    await page.getByLabel('Depot name').fill(`Tapped ${s.what}`);
    await page.getByRole('button', { name: 'Add depot' }).click();
    await page.getByLabel('Depot name').waitFor({ state: 'detached' });
    await page.getByRole('tab', { name: 'Depots (1)' }).waitFor();
    await screenshot(page, `screens-draw-tap-${s.what.replace(/\s/g, '-').toLowerCase()}-${label}`);
    // Undo, so the next spot is free of depots. Then pause as a person would before the next
    // click: a mouse click on the canvas within milliseconds of the Undo click (which disables
    // Undo) sometimes got its press but never its release from react-native-web's responder
    // system (seen in 3 of 9 runs here, with the page's own event log), so no dialog opened.
    await page.getByRole('button', { name: 'Undo' }).click();
    await page.getByRole('tab', { name: 'Depots (0)' }).waitFor();
    await page.waitForTimeout(300);
  }
  await context.close();
});
