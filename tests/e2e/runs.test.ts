/**
 * Runs in the browser, phone and wide: from the demo network to a finished run with exact, tabu
 * and QAOA — progress to 100 %, the scorecard (exact proven optimal, QAOA's ratio to the bound),
 * the partition drawing, and the assignment CSV downloaded and checked against the network.
 * A real worker process solves the jobs.
 */
import fs from 'node:fs';
import Papa from 'papaparse';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { useOwnDatabase } from '../support/own-database';
import { startWorkerProcess } from '../support/worker-process';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let worker: ReturnType<typeof startWorkerProcess>;
let demo: { networkId: number; versionId: number; depots: { id: string; name?: string }[]; lanes: { from: string; to: string; weight: number }[] };
const ANALYST = 'analyst@quillmere.example';

beforeAll(async () => {
  await useOwnDatabase('runs');
  server = await startTestServer(3190);
  worker = startWorkerProcess();
  const { ensureDemoOrganisation, DEMO_PASSWORD } = await import('../../server/services/seed-demo');
  const { ensureDemoNetworks } = await import('../../server/services/demo-networks');
  const { organisationId } = await ensureDemoOrganisation(server.deps);
  await ensureDemoNetworks(server.deps, organisationId);
  password = DEMO_PASSWORD;
  const network = await server.deps.models.Network.findOne({ where: { organisationId, name: 'Quillmere Valley — core' } });
  const version = await server.deps.models.NetworkVersion.findOne({ where: { networkId: network!.get('id') as number }, order: [['number', 'DESC']] });
  const doc = JSON.parse(version!.get('document') as string);
  demo = { networkId: network!.get('id') as number, versionId: version!.get('id') as number, depots: doc.depots, lanes: doc.lanes };
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
});
let password = '';
const runIds: number[] = [];

async function signIn(page: Page, email = ANALYST) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
}

/** The independent cut of a CSV assignment: lane weight between depots on different sides. */
function cutOf(csv: string) {
  const rows = Papa.parse<Record<string, string>>(csv.trim(), { header: true, skipEmptyLines: true }).data;
  const side = new Map(rows.map((r) => [r.depot_id, r.side]));
  let cut = 0;
  for (const l of demo.lanes) if (side.get(l.from) !== side.get(l.to)) cut += l.weight;
  return { rows, cut };
}

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
])('%s', (label, viewport) => {
  test('demo network → run with exact, tabu and QAOA → 100 % → scorecard, partition, CSV', async () => {
    const context = await browser.newContext({ viewport, acceptDownloads: true, permissions: ['clipboard-read', 'clipboard-write'] });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await signIn(page);

    // Open the demo network and start setting up a run from it.
    await page.getByRole('link', { name: /Quillmere Valley — core/ }).first().click();
    await page.getByTestId('network-screen').waitFor();
    await page.getByTestId('new-run').click();
    await page.waitForURL((u) => u.pathname === '/runs/new' && u.searchParams.get('versionId') === String(demo.versionId));
    await page.getByTestId('kind-maxcut').waitFor();
    await page.getByTestId('kind-maxcut').click();
    // Size-based defaults for 12 depots: exact, tabu, QAOA, VQE — keep exact + tabu + QAOA.
    for (const name of ['exact', 'tabu', 'qaoa']) await expect(page.getByTestId(`solver-${name}`).getAttribute('aria-checked')).resolves.toBe('true');
    // Max-cut on the 12-depot network: one qubit per depot.
    // Plain words first; the encoding figures behind the details control.
    await page.getByTestId('run-cost').waitFor();
    await page.getByTestId('encoding-details-toggle').click();
    await page.getByTestId('enc-qubits').getByText(String(demo.depots.length), { exact: true }).waitFor();
    await page.getByTestId('solver-vqe').click();
    await expect(page.getByTestId('solver-vqe').getAttribute('aria-checked')).resolves.toBe('false');
    if (label === 'phone') {
      // Pin the first depot by tapping it on the drawing: it leaves the free qubits.
      await page.getByTestId('pin-picker').scrollIntoViewIfNeeded();
      const dot = await page.getByTestId('pin-picker').locator('circle').first().boundingBox();
      await page.mouse.click(dot!.x + dot!.width / 2, dot!.y + dot!.height / 2);
      await page.getByTestId(`pin-${demo.depots[0].id}`).waitFor();
      await page.getByTestId('enc-qubits').getByText(String(demo.depots.length - 1), { exact: true }).waitFor();
      await screenshot(page, `runs-setup-pins-${label}`);
    }
    if (label === 'wide') {
      // The analyst's advanced panel: QAOA with p = 1 and 512 shots per energy estimate, so this
      // run's chart carries the shot-noise band and the comparison gets a row of its own for it.
      await page.getByTestId('advanced-toggle').click();
      await page.getByRole('textbox', { name: 'Circuit layers (QAOA p, VQE depth)' }).fill('1');
      await page.getByRole('textbox', { name: 'Shots per energy estimate (0 = exact expectation)' }).fill('512');
    }
    await page.getByTestId('encoding-summary').waitFor();
    await screenshot(page, `runs-setup-${label}`);
    await page.getByTestId('encoding-summary').scrollIntoViewIfNeeded();
    await screenshot(page, `runs-setup-summary-${label}`);
    await page.getByTestId('start-run').click();
    await page.waitForURL((u) => /^\/runs\/\d+$/.test(u.pathname));
    const runId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByTestId('run-progress').waitFor();
    await screenshot(page, `runs-live-${label}`);

    // Progress reaches 100 % for every solver (the page polls while jobs run).
    for (const name of ['exact', 'tabu', 'qaoa']) await page.getByTestId(`percent-${name}`).getByText('100 %').waitFor({ timeout: 90_000 });

    // Scorecard: exact proven optimal and marked best; QAOA's ratio to the bound is a number ≤ 1.
    await page.getByTestId('scorecard').waitFor();
    await page.getByTestId('proven-exact').waitFor();
    await page.getByTestId('best-exact').waitFor();
    const ratio = (await page.getByTestId('ratio-qaoa').textContent()) ?? '';
    expect(ratio).toMatch(/^[01]\.\d{3}$/);
    expect(Number(ratio)).toBeLessThanOrEqual(1);
    await screenshot(page, `runs-scorecard-${label}`);
    // "Took" is never shorter than a solver's own time (run times are stored in whole seconds).
    const took = Number(((await page.getByTestId('run-elapsed').textContent()) ?? '').replace(/[^0-9.]/g, ''));
    expect(took).toBeGreaterThan(0);

    // The partition of QAOA's answer on the network.
    await page.getByTestId('score-qaoa').click();
    await page.getByTestId('partition-view').getByText(/QAOA/).waitFor();
    await page.getByTestId('partition-view').scrollIntoViewIfNeeded();
    await screenshot(page, `runs-partition-${label}`);
    // QAOA's sampled assignments and final parameters.
    await page.getByTestId('variational-detail').scrollIntoViewIfNeeded();
    await page.getByTestId('final-params').waitFor();
    await screenshot(page, `runs-samples-${label}`);
    // Each parameter's name stays on the line of its value (one line per item, even on phones).
    const paramHeights = await page.getByTestId('final-params').getByTestId('param').evaluateAll((els) => els.map((e) => e.getBoundingClientRect().height));
    expect(paramHeights.length).toBeGreaterThan(1);
    for (const h of paramHeights) expect(h).toBeLessThan(26);
    // The histogram has a count scale; the convergence chart explains restarts.
    expect(await page.getByTestId('histogram-tick').count()).toBeGreaterThan(1);
    await page.getByTestId('convergence-restarts').waitFor();
    // The answer's sides are named as the CSV numbers them (0 and 1).
    await page.getByTestId('region-0').getByText('Side 0', { exact: true }).waitFor();
    await page.getByTestId('region-1').getByText('Side 1', { exact: true }).waitFor();
    if (label === 'wide') await page.getByTestId('convergence-band').waitFor({ state: 'attached' });

    // The cost operator on request. Max-cut without pins: one ZZ term per lane, one qubit per
    // depot; with the phone run's pinned depot, one qubit fewer (its lanes become Z terms).
    await page.getByTestId('inspect-operator').click();
    const terms = label === 'wide' ? `${demo.lanes.length} terms on ${demo.depots.length} qubits` : `on ${demo.depots.length - 1} qubits`;
    await page.getByTestId('operator-inspector').getByText(terms, { exact: false }).waitFor();
    await page.getByTestId('operator-inspector').scrollIntoViewIfNeeded();
    await screenshot(page, `runs-operator-${label}`);

    // The CSV download: every depot once, and its cut (computed here) equals the best value shown.
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('download-csv').click()]);
    const file = await download.path();
    const { rows, cut } = cutOf(fs.readFileSync(file!, 'utf8'));
    expect(rows.map((r) => r.depot_id)).toEqual(demo.depots.map((d) => d.id));
    const exactValue = Number(((await page.getByTestId('value-exact').textContent()) ?? '').replace(/,/g, ''));
    expect(cut).toBeCloseTo(exactValue, 6);
    runIds.push(runId);

    // Share: the copied link is this run's page (members open the same read-only view).
    await page.getByTestId('copy-link').click();
    await page.getByTestId('copied').waitFor();
    await expect(page.evaluate(() => navigator.clipboard.readText())).resolves.toBe(`${server.url}/runs/${runId}`);

    // The printable report: same best value, every depot listed.
    await page.getByTestId('open-report').click();
    await page.waitForURL((u) => u.pathname === `/runs/${runId}/report`);
    await page.getByTestId('report-assignment').getByText(demo.depots[0].id, { exact: true }).waitFor();
    await screenshot(page, `runs-report-${label}`);
    // A printed page has no zoom buttons and no "Tap a depot" (nobody taps paper).
    expect(await page.getByTestId('zoom-in').count()).toBe(0);
    expect(await page.getByText(/Tap a depot/).count()).toBe(0);

    await page.goto(`${server.url}/runs`);
    await page.getByTestId(`run-item-${runId}`).waitFor();
    // Solvers by their registry labels, never their codes.
    await page.getByTestId(`run-item-${runId}`).getByText(/Exact enumeration, Tabu search/).waitFor();
    await screenshot(page, `runs-list-${label}`);
    if (runIds.length >= 2) {
      // Compare this run with the one from the phone test in one table (analysts: runs:compare).
      for (const id of runIds) await page.getByTestId(`tick-${id}`).click();
      await page.getByTestId('compare-runs').first().click();
      await page.waitForURL((u) => u.pathname === '/runs/compare');
      await page.getByTestId('compare-table').waitFor();
      for (const id of runIds) await expect(page.getByTestId(`cmp-${id}-Best answer`).textContent()).resolves.toMatch(new RegExp(`^${exactValue.toLocaleString('en-GB')} by `));
      await screenshot(page, `runs-compare-${label}`);
    }
    expect(errors).toEqual([]);
    await context.close();

    // Any member opens the shared link to the same read-only view: a viewer sees the scorecard,
    // no cancel, no comparison (analysts only).
    const member = await browser.newContext({ viewport });
    const viewerPage = await member.newPage();
    await signIn(viewerPage, 'viewer@quillmere.example');
    await viewerPage.goto(`${server.url}/runs/${runId}`);
    await viewerPage.getByTestId('proven-exact').waitFor();
    expect(await viewerPage.getByTestId('cancel-run').count()).toBe(0);
    expect(await viewerPage.getByTestId('compare-from-run').count()).toBe(0);
    await member.close();

    // The shared link is for members only: a signed-out visitor lands on the sign-in page.
    const stranger = await browser.newContext({ viewport });
    const other = await stranger.newPage();
    await other.goto(`${server.url}/runs/${runId}`);
    await other.getByTestId('sign-in-form').waitFor();
    await stranger.close();
  });
});
