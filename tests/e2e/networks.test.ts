/**
 * Networks in the browser at 390×844 and 1440×900: draw a 4-depot network with taps and drags,
 * save it, find it in the list; import a CSV with one bad row (refused, nothing saved), fix it,
 * import it, and see it in the tables. Screenshots go to artifacts/screenshots.
 */
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { applyTestEnv } from '../support/env';
import { createOrgWithRoles, type OrgWithRoles } from '../api/setup/test-app';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let releaseDatabase: () => Promise<void> = async () => {};

/**
 * api runs reset the shared test database unless another run holds the `spinyard_test_run` lock
 * (tests/api/setup/global-setup.ts); holding it while the browser works keeps our rows in place.
 * If an api run holds it already, that run has done its reset and we go ahead anyway.
 */
async function holdTestDatabase() {
  const mariadb = await import('mariadb');
  const { loadConfig } = await import('../../server/config');
  const c = loadConfig();
  const conn = await mariadb.createConnection({ host: c.DB_HOST, port: c.DB_PORT, user: c.DB_USER, password: c.DB_PASSWORD, connectTimeout: 5000 });
  // Set-ups (drop + migrate) are serialised by this lock; wait for one in progress to finish.
  await conn.query("SELECT GET_LOCK('spinyard_test_setup', 180)");
  await conn.query("SELECT GET_LOCK('spinyard_test_run', 0)");
  return {
    setupDone: async () => {
      await conn.query("SELECT RELEASE_LOCK('spinyard_test_setup')").catch(() => {});
    },
    release: async () => {
      await conn.query("SELECT RELEASE_LOCK('spinyard_test_run')").catch(() => {});
      await conn.end().catch(() => {});
    },
  };
}

beforeAll(async () => {
  applyTestEnv();
  const held = await holdTestDatabase();
  releaseDatabase = held.release;
  try {
    server = await startTestServer(3170); // migrates, while no other set-up can run
  } finally {
    await held.setupDone();
  }
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await releaseDatabase();
});

async function signIn(page: Page, org: OrgWithRoles) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(org.users.dispatcher.email);
  await page.getByTestId('sign-in-password').fill(org.users.dispatcher.password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
}

const counts = async (organisationId: number) => ({
  networks: await server.deps.models.Network.count({ where: { organisationId } }),
  versions: await server.deps.models.NetworkVersion.count({ where: { organisationId } }),
});

const BAD_LANES = 'from,to,weight\nHUB,EAST,40\nEAST,WEST,-5\nWEST,HUB,25\n';
const GOOD_LANES = 'from,to,weight\nHUB,EAST,40\nEAST,WEST,5\nWEST,HUB,25\n';

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
])('networks, %s', (label, viewport) => {
  let org: OrgWithRoles;
  beforeAll(async () => {
    org = await createOrgWithRoles(server.deps, `Yard ${label}`);
  });

  test('draw 4 depots by taps and 4 lanes by drags, save, see it in the list', async () => {
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await signIn(page, org);
    await page.getByTestId('networks-empty').waitFor();
    await screenshot(page, `networks-empty-${label}`);
    await page.getByRole('button', { name: 'Draw a network' }).click();
    await page.getByTestId('new-network-screen').waitFor();
    await page.getByLabel('Network name', { exact: true }).fill(`Drawn ${label}`);

    const canvas = page.getByTestId('drawing-canvas');
    await canvas.scrollIntoViewIfNeeded();
    // Positions are taken relative to the canvas at the moment of each gesture.
    const fractions = [[0.25, 0.3], [0.75, 0.3], [0.75, 0.75], [0.25, 0.75]];
    const spot = async (i: number) => {
      const box = (await canvas.boundingBox())!;
      return { x: box.x + box.width * fractions[i][0], y: box.y + box.height * fractions[i][1] };
    };
    const names = ['Harrowfen Yard', 'Ossel Bridge', 'Tarnwyth Hub', 'Lintmouth Quay'];
    for (let i = 0; i < 4; i++) {
      const p = await spot(i);
      await page.mouse.click(p.x, p.y);
      const field = page.getByLabel('Depot name');
      await field.waitFor();
      await field.fill(names[i]);
      await page.getByRole('button', { name: 'Add depot' }).click();
      await field.waitFor({ state: 'detached' });
    }
    await expect(page.getByRole('tab', { name: 'Depots (4)' }).isVisible()).resolves.toBe(true);
    const volumes = ['12', '7.5', '30', '4'];
    for (let i = 0; i < 4; i++) {
      const a = await spot(i), b = await spot((i + 1) % 4);
      await page.mouse.move(a.x, a.y);
      await page.mouse.down();
      await page.mouse.move((a.x + b.x) / 2, (a.y + b.y) / 2, { steps: 5 });
      await page.mouse.move(b.x, b.y, { steps: 5 });
      await page.mouse.up();
      const field = page.getByLabel('Volume', { exact: true });
      await field.waitFor();
      await field.fill(volumes[i]);
      await page.getByRole('button', { name: 'Add lane' }).click();
      await field.waitFor({ state: 'detached' });
    }
    await expect(page.getByRole('tab', { name: 'Lanes (4)' }).isVisible()).resolves.toBe(true);
    await expect(page.getByTestId('summary-total-volume').textContent()).resolves.toBe('53.5');

    // Tap a lane to change its volume (D1–D2: 12 → 13).
    const [p0, p1] = [await spot(0), await spot(1)];
    await page.mouse.click((p0.x + p1.x) / 2, (p0.y + p1.y) / 2);
    const volume = page.getByLabel('Volume', { exact: true });
    await expect(volume.inputValue()).resolves.toBe('12');
    await volume.fill('13');
    await page.getByRole('button', { name: 'Save volume' }).click();
    await volume.waitFor({ state: 'detached' });
    await expect(page.getByTestId('summary-total-volume').textContent()).resolves.toBe('54.5');
    // Select a depot and delete it (its two lanes go with it), then undo.
    const p2 = await spot(2);
    await page.mouse.click(p2.x, p2.y);
    await page.getByRole('button', { name: 'Delete (1)' }).click();
    await expect(page.getByRole('tab', { name: 'Depots (3)' }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('tab', { name: 'Lanes (2)' }).isVisible()).resolves.toBe(true);
    await page.getByRole('button', { name: 'Undo' }).click();
    await expect(page.getByRole('tab', { name: 'Lanes (4)' }).isVisible()).resolves.toBe(true);
    await expect(page.getByTestId('summary-degree').textContent()).resolves.toBe('2'); // a 4-cycle: every depot has 2 neighbours
    await screenshot(page, `networks-drawn-${label}`);
    const marks = () => page.evaluate(() => Array.from(document.querySelectorAll('svg[aria-label^="Drawing of"] circle[stroke-width]')).map((c) => `${c.getAttribute('cx')},${c.getAttribute('cy')}`).sort());
    const drawn = await marks();
    expect(drawn).toHaveLength(4);

    // Leaving through the navigation bar with unsaved changes asks first.
    await page.getByRole('link', { name: 'Runs' }).click();
    await page.getByText('Leave without saving?').waitFor();
    await page.getByRole('button', { name: 'Keep drawing' }).click();
    await page.getByText('Leave without saving?').waitFor({ state: 'detached' });
    expect(new URL(page.url()).pathname).toBe('/networks/new');

    await page.getByTestId('save-network').click();
    await page.waitForURL((u) => /^\/networks\/\d+$/.test(u.pathname));
    await page.getByTestId('network-screen').waitFor();
    const id = Number(new URL(page.url()).pathname.split('/').pop());
    const saved = await server.deps.models.NetworkVersion.findOne({ where: { networkId: id } });
    const doc = JSON.parse(saved!.get('document') as string);
    expect(doc.depots.map((d: { name: string }) => d.name)).toEqual(names);
    expect(doc.lanes).toEqual([
      { from: 'D1', to: 'D2', weight: 13 },
      { from: 'D2', to: 'D3', weight: 7.5 },
      { from: 'D3', to: 'D4', weight: 30 },
      { from: 'D4', to: 'D1', weight: 4 },
    ]);
    // Saving does not rearrange the drawing: the depots sit where they were drawn.
    await page.locator('svg[aria-label^="Drawing of"] circle[stroke-width]').first().waitFor();
    expect(await marks()).toEqual(drawn);
    await screenshot(page, `networks-saved-${label}`);

    await page.getByRole('button', { name: 'All networks' }).click();
    await page.waitForURL((u) => u.pathname === '/networks');
    const entry = page.getByRole('link', { name: new RegExp(`^Drawn ${label}`) });
    await entry.waitFor();
    await expect(entry.textContent()).resolves.toMatch(label === 'wide' ? /Drawn wide\s*4\s*4\s*54\.5\s*1/ : /4 depots · 4 lanes · volume 54\.5/);
    await screenshot(page, `networks-list-${label}`);
    expect(errors).toEqual([]);
    await context.close();
  });

  test('import a CSV with one bad row: error shown, nothing saved; fixed file imports and fills the tables', async () => {
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    const errors = watchPageErrors(page).filter(() => true);
    await signIn(page, org);
    await page.getByRole('button', { name: 'Import' }).click();
    await page.getByTestId('import-screen').waitFor();
    await expect(page.getByTestId('import-limits').textContent()).resolves.toMatch(/Up to 20 MB per file, 20,000 depots and 200,000 lanes/);
    const before = await counts(org.organisationId);

    const choose = async (content: string) => {
      const chooser = page.waitForEvent('filechooser');
      await page.getByTestId('choose-file').click();
      await (await chooser).setFiles({ name: 'yard-lanes.csv', mimeType: 'text/csv', buffer: Buffer.from(content) });
    };
    await choose(BAD_LANES);
    const problems = page.getByTestId('preview-errors');
    await problems.waitFor();
    await expect(problems.textContent()).resolves.toMatch(/yard-lanes\.csv line 3: lane EAST–WEST has volume -5; freight volumes must be ≥ 0/);
    await expect(page.getByTestId('import-save').isDisabled()).resolves.toBe(true);
    await problems.scrollIntoViewIfNeeded();
    await screenshot(page, `networks-import-error-${label}`);
    expect(await counts(org.organisationId)).toEqual(before);

    await choose(GOOD_LANES);
    await page.getByTestId('preview-ok').waitFor();
    await expect(page.getByTestId('preview-counts').textContent()).resolves.toMatch(/3 depots and 3 lanes passed every check/);
    await page.getByLabel('Network name', { exact: true }).fill(`Imported ${label}`);
    await screenshot(page, `networks-import-ok-${label}`);
    await page.getByTestId('import-save').click();
    await page.waitForURL((u) => /^\/networks\/\d+$/.test(u.pathname));
    await page.getByTestId('network-screen').waitFor();
    expect(await counts(org.organisationId)).toEqual({ networks: before.networks + 1, versions: before.versions + 1 });

    await page.getByTestId('tab-lanes').click();
    const table = page.getByTestId('lanes-table');
    await table.waitFor();
    await expect(page.getByLabel('Volume of lane EAST–WEST').inputValue()).resolves.toBe('5');
    await expect(page.getByRole('button', { name: 'WEST HUB', exact: true }).isVisible()).resolves.toBe(true);
    await page.getByTestId('tab-depots').click();
    await expect(page.getByTestId('depots-table').textContent()).resolves.toMatch(/HUB.*EAST.*WEST/s);
    await screenshot(page, `networks-imported-tables-${label}`);
    expect(errors).toEqual([]);
    await context.close();
  });

  test('open a demo from the empty state, edit a volume in the lanes table, save version 2, compare it with version 1', async () => {
    const fresh = await createOrgWithRoles(server.deps, `Demo ${label}`);
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await signIn(page, fresh);
    await page.getByRole('button', { name: 'Open demo: Quillmere Valley — full' }).click();
    await page.getByTestId('network-screen').waitFor();
    await expect(page.getByTestId('summary-depots').textContent()).resolves.toBe('40');
    await page.locator('svg[aria-label="Drawing of 40 depots and ' + (await page.getByTestId('summary-lanes').textContent()) + ' lanes"]').waitFor();
    await screenshot(page, `networks-demo-${label}`);

    // Zoom: the mouse wheel at the pointer on the wide screen, the + button on the phone; Fit brings the whole network back.
    const scale = async () => Number(/scale\(([\d.e-]+)\)/.exec((await page.locator('svg[aria-label^="Drawing of"] g[transform]').first().getAttribute('transform')) ?? '')?.[1]);
    const scaleIsNot = (k: number) => page.waitForFunction((k0) => /scale\(([\d.e-]+)\)/.exec(document.querySelector('svg[aria-label^="Drawing of"] g[transform]')?.getAttribute('transform') ?? '')?.[1] !== String(k0), k);
    const fitted = await scale();
    const canvas = page.getByTestId('drawing-canvas');
    if (label === 'wide') {
      const box = (await canvas.boundingBox())!;
      await page.mouse.move(box.x + box.width / 2, box.y + box.height / 3);
      await page.mouse.wheel(0, -400);
      await scaleIsNot(fitted);
      expect(await scale()).toBeGreaterThan(fitted * 1.5);
    } else {
      await page.getByTestId('zoom-in').click();
      await scaleIsNot(fitted);
      expect(await scale()).toBeCloseTo(fitted * 1.25, 9);
    }
    const zoomed = await scale();
    await page.getByRole('button', { name: 'Fit' }).click();
    await scaleIsNot(zoomed);
    expect(await scale()).toBe(fitted);

    await page.getByTestId('tab-lanes').click();
    const first = page.getByTestId('lane-volume-0');
    const before = await first.inputValue();
    await first.fill('-2');
    await first.press('Enter');
    await expect(page.getByTestId('lane-volume-error-0').textContent()).resolves.toMatch(/volume must be ≥ 0/);
    await first.fill('123');
    await first.press('Enter');
    await page.getByTestId('save-state').filter({ hasText: 'Unsaved changes' }).waitFor();
    await page.getByTestId('save-network').click();
    await page.getByTestId('save-state').filter({ hasText: 'All changes saved' }).waitFor();
    await page.getByText(/Version 2 of 2/).waitFor();

    await page.getByTestId('tab-versions').click();
    await page.getByTestId('compare-1').click();
    await page.getByTestId('compare-2').click();
    const comparison = page.getByTestId('version-comparison');
    await comparison.waitFor();
    await expect(comparison.textContent()).resolves.toMatch(new RegExp(`Volume changes \\(1\\).*: ${before} → 123`));
    await comparison.scrollIntoViewIfNeeded();
    await screenshot(page, `networks-compare-${label}`);

    // Opening version 1 shows it read-only, with its old volume.
    await page.getByTestId('version-1').getByRole('button', { name: 'Open' }).click();
    await page.getByTestId('older-version-notice').waitFor();
    await page.getByTestId('tab-lanes').click();
    await expect(page.getByTestId('lane-volume-0').count()).resolves.toBe(0);
    await expect(page.getByTestId('lane-row-0').textContent()).resolves.toContain(before);
    expect(errors).toEqual([]);
    await context.close();
  });
});
