/**
 * A ~300-depot network in the browser, phone and wide: run setup proposes recursive QAOA and QAOA
 * by blocks (the direct circuits would need 300 qubits) with their time and price, the run
 * finishes, and the run screen compares them with tabu, the bound and the best known answer
 * (unrefined and refined values), lists RQAOA's rounds and shows the blocks on the drawing.
 * A real worker process solves the jobs.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, screenshot, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { useOwnDatabase } from '../support/own-database';
import { startWorkerProcess } from '../support/worker-process';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let worker: ReturnType<typeof startWorkerProcess>;
let net: { id: number; versionId: number };
let password = '';
const ANALYST = 'analyst@quillmere.example';
const SHOTS = path.resolve(__dirname, '..', '..', '.data');
const DEPOTS = 300;

/** 20 × 15 depots of the Quillmere Valley on a jittered grid, lanes to the right and below (weights 1–9), seeded. */
function valley() {
  let s = 4242;
  const next = () => ((s = (s * 1103515245 + 12345) % 2 ** 31) / 2 ** 31);
  const depots = Array.from({ length: DEPOTS }, (_, i) => ({ id: `V${i + 1}`, name: `Quillmere yard ${i + 1}`, weight: 1, x: (i % 20) * 10 + next() * 4, y: Math.floor(i / 20) * 10 + next() * 4 }));
  const lanes: { from: string; to: string; weight: number }[] = [];
  for (let i = 0; i < DEPOTS; i++) {
    if (i % 20 < 19) lanes.push({ from: depots[i].id, to: depots[i + 1].id, weight: 1 + Math.floor(next() * 9) });
    if (i + 20 < DEPOTS) lanes.push({ from: depots[i].id, to: depots[i + 20].id, weight: 1 + Math.floor(next() * 9) });
    if (i % 20 < 19 && i + 21 < DEPOTS && next() < 0.3) lanes.push({ from: depots[i].id, to: depots[i + 21].id, weight: 1 + Math.floor(next() * 9) });
  }
  return { depots, lanes };
}

beforeAll(async () => {
  await useOwnDatabase('large');
  server = await startTestServer(3214);
  worker = startWorkerProcess();
  const { ensureDemoOrganisation, DEMO_PASSWORD } = await import('../../server/services/seed-demo');
  const { createNetwork } = await import('../../server/services/networks');
  const { organisationId } = await ensureDemoOrganisation(server.deps);
  password = DEMO_PASSWORD;
  const analyst = await server.deps.models.User.findOne({ where: { email: ANALYST } });
  const made = await createNetwork(server.deps, { organisationId, userId: analyst!.get('id') as number }, { name: `Quillmere Valley — ${DEPOTS} yards ${Date.now()}`, ...valley() }, { source: 'api' });
  net = { id: made.id, versionId: made.versionId };
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
});

async function signIn(page: Page) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(ANALYST);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
}

async function shot(page: Page, name: string) {
  await screenshot(page, name);
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`) });
}

/** A figure of the page once it is a number (a finished job's result may arrive a moment after its 100 %). */
async function numberAt(page: Page, testId: string): Promise<number> {
  await page.waitForFunction((id) => /^[\d,]+$/.test(document.querySelector(`[data-testid="${id}"]`)?.textContent ?? ''), testId, { timeout: 30_000 });
  return Number(((await page.getByTestId(testId).textContent()) ?? '').replace(/,/g, ''));
}

const checked = (page: Page, name: string) => page.getByTestId(`solver-${name}`).getAttribute('aria-checked');
let runsDone = 0;

describe.each([
  ['phone', PHONE],
  ['wide', WIDE],
])('%s', (label, viewport) => {
  test(`${DEPOTS} depots: rqaoa and qaoa-blocks proposed with time and price; rounds, blocks and the comparison after the run`, async () => {
    const context = await browser.newContext({ viewport });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await signIn(page);
    await page.goto(`${server.url}/runs/new?networkId=${net.id}&versionId=${net.versionId}`);
    await page.getByTestId('kind-maxcut').click();

    // Above the statevector limit: the proposal names both solvers with the preview's figures.
    const proposal = page.getByTestId('large-proposal');
    await proposal.getByText(`QAOA and VQE would simulate ${DEPOTS} qubits here`, { exact: false }).waitFor();
    await page.getByTestId('large-proposal-line-rqaoa').getByText(/^needs 16 qubits · about \d+ s · (free|.+ for its qubits|in the run price)$/).waitFor();
    await page.getByTestId('large-proposal-line-qaoa-blocks').getByText(/^needs 14 qubits · about \d+ s · (free|.+ for its qubits|in the run price)$/).waitFor();
    for (const name of ['tabu', 'rqaoa', 'qaoa-blocks']) await expect(checked(page, name)).resolves.toBe('true');
    expect(await page.getByTestId('solver-qaoa').count()).toBe(0); // not suggested (shown only under "all solvers")
    await proposal.scrollIntoViewIfNeeded();
    await shot(page, `large-setup-${label}`);

    await page.getByTestId('start-run').getByText(/^Start run with 3 solvers$/).waitFor({ timeout: 60_000 }); // free on the demo's Team plan
    await page.getByTestId('start-run').click();
    await page.waitForURL((u) => /^\/runs\/\d+$/.test(u.pathname));
    for (const name of ['tabu', 'rqaoa', 'qaoa-blocks']) await page.getByTestId(`percent-${name}`).getByText('100 %').waitFor({ timeout: 240_000 });
    runsDone++;

    // The comparison: best known named with its source, unrefined beside refined values.
    const cmp = page.getByTestId('large-comparison');
    await cmp.waitFor();
    for (const name of ['rqaoa', 'qaoa-blocks']) {
      const before = await numberAt(page, `large-unrefined-${name}`);
      const after = await numberAt(page, `large-value-${name}`);
      expect(before).toBeGreaterThan(0);
      expect(after).toBeGreaterThanOrEqual(before); // max-cut: 1-flip refinement never lowers the cut
      await expect(page.getByTestId(`large-refinement-${name}`).textContent()).resolves.toBe(after > before ? 'Changed the answer' : 'Ran, no change');
    }
    expect(await numberAt(page, 'large-value-tabu')).toBeGreaterThan(0);
    // Wide runs second: the server's best known then counts the phone's run too.
    await expect(page.getByTestId('best-known').textContent()).resolves.toMatch(new RegExp(`^Best known answer: [\\d,]+ — the best balanced answer any run on this network version has found for this question \\(${runsDone} runs? compared`));
    await cmp.scrollIntoViewIfNeeded();
    await shot(page, `large-comparison-${label}`);

    // RQAOA's rounds: 300 depots → one elimination per round (default rule up to 300), 16 left exactly.
    const rounds = page.getByTestId('rqaoa-rounds');
    await expect(page.getByTestId('rqaoa-summary').textContent()).resolves.toMatch(/^\d+ rounds? of one-layer QAOA; [\d,]+ depots? eliminated .* the last \d+ solved exactly/);
    expect(await rounds.getByTestId('rqaoa-round').count()).toBeGreaterThan(0);
    await rounds.scrollIntoViewIfNeeded();
    await shot(page, `large-rounds-${label}`);

    // The blocks: count, sizes, the drawing coloured by block.
    const blocks = page.getByTestId('blocks-view');
    await expect(page.getByTestId('blocks-summary').textContent()).resolves.toMatch(/^\d+ blocks, widest circuit 1[0-4] qubits; orientations by /);
    await expect(page.getByTestId('block-sizes').textContent()).resolves.toMatch(/× \d+ depots/);
    expect(await blocks.locator('circle').count()).toBeGreaterThanOrEqual(DEPOTS);
    await blocks.scrollIntoViewIfNeeded();
    await shot(page, `large-blocks-${label}`);
    expect(errors).toEqual([]);
    await context.close();
  }, 420_000);
});
