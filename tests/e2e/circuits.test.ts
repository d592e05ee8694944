/**
 * "What it would take on a real device", in the browser at phone and wide size: the 20-depot demo
 * network (Quillmere Valley — west, max-cut: 20 qubits) shows the circuit resources before launch
 * (the dispatcher's line, the analyst's table per layout); the finished QAOA job shows the same
 * counts for the three layouts, the time on a device, the noisy vs noiseless comparison, and both
 * OpenQASM downloads, whose files are checked (first line OPENQASM 3.0 / OPENQASM 2.0; the
 * read-out of all 20 qubits). A real worker process solves the jobs.
 * Screenshots of the setup summary and the run screen's panel go to .data/screenshots (ignored by git).
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, WIDE, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { useOwnDatabase } from '../support/own-database';
import { startWorkerProcess } from '../support/worker-process';

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let worker: ReturnType<typeof startWorkerProcess>;
let password = '';
const ANALYST = 'analyst@quillmere.example';
const SHOTS = path.resolve(__dirname, '..', '..', '.data', 'screenshots');

beforeAll(async () => {
  await useOwnDatabase('circuits');
  server = await startTestServer(3193);
  worker = startWorkerProcess();
  const { ensureDemoOrganisation, DEMO_PASSWORD } = await import('../../server/services/seed-demo');
  const { ensureDemoNetworks } = await import('../../server/services/demo-networks');
  const { organisationId } = await ensureDemoOrganisation(server.deps);
  await ensureDemoNetworks(server.deps, organisationId);
  password = DEMO_PASSWORD;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
});

/** What the screen shows with this part in the middle of the viewport (as a person would scroll). */
async function shot(page: Page, name: string, testID: string) {
  fs.mkdirSync(SHOTS, { recursive: true });
  await page.getByTestId(testID).evaluate((el) => el.scrollIntoView({ block: 'center' }));
  await page.waitForTimeout(200);
  await page.screenshot({ path: path.join(SHOTS, `${name}.png`) });
}

/** A row as text (its cells joined by " | "): phone rows are "name: value" lines, wide rows table cells. */
const rowText = async (page: Page, testID: string) =>
  (await page.getByTestId(testID).evaluate((el) => Array.from(el.children, (c) => c.textContent ?? '').join(' | '))).replace(/\s+/g, ' ');
/** A resources row's numbers in order (one-qubit gates, two-qubit gates, two-qubit depth, depth, swaps). */
const numbersOf = (text: string) => text.split(' | ').slice(1).map((cell) => Number(cell.replace(/,/g, '').replace(/^.*: /, '')));

describe.each([
  ['phone', PHONE, true],
  ['wide', WIDE, false],
])('%s', (label, viewport, touch) => {
  test('20-depot demo: resources before launch = after; device time, noise and both OpenQASM files', async () => {
    const context = await browser.newContext({ viewport, hasTouch: touch, isMobile: touch, acceptDownloads: true });
    const page = await context.newPage();
    const errors = watchPageErrors(page);
    await page.goto(`${server.url}/sign-in`);
    await page.getByTestId('sign-in-email').fill(ANALYST);
    await page.getByTestId('sign-in-password').fill(password);
    await page.getByTestId('sign-in-submit').click();
    await page.waitForURL((u) => u.pathname === '/networks');

    await page.getByRole('link', { name: /Quillmere Valley — west/ }).first().click();
    await page.getByTestId('network-screen').waitFor();
    await page.getByTestId('new-run').click();
    await page.waitForURL((u) => u.pathname === '/runs/new');
    await page.getByTestId('kind-maxcut').click();
    await expect(page.getByTestId('solver-qaoa').getAttribute('aria-checked')).resolves.toBe('true');
    if ((await page.getByTestId('solver-vqe').getAttribute('aria-checked')) === 'true') await page.getByTestId('solver-vqe').click();

    // Analyst: one QAOA layer and the noise comparison.
    await page.getByTestId('advanced-toggle').click();
    await page.getByRole('textbox', { name: 'Circuit layers (QAOA p, VQE depth)' }).fill('1');
    await page.getByTestId('adv-noise').click();
    await expect(page.getByTestId('adv-noise').getAttribute('aria-checked')).resolves.toBe('true');

    // Before launch, in plain words: 20 qubits and the two-qubit gates on a line.
    const line = page.getByTestId('circuit-line-qaoa');
    await line.getByText(/^QAOA on a real device: 20 qubits and [\d,]+ two-qubit gates with the qubits in a line/).waitFor();
    // Behind the details control, the table per layout.
    await page.getByTestId('encoding-details-toggle').click();
    await page.getByTestId('enc-resources-qaoa').waitFor();
    await page.getByTestId('start-run').getByText(/^Start run/).waitFor(); // the preview of this body is in
    const before: Record<string, number[]> = {};
    for (const l of ['all', 'line', 'grid']) before[l] = numbersOf(await rowText(page, `enc-qaoa-${l}`));
    for (const l of ['all', 'line', 'grid']) expect(before[l].length === 5 && before[l].every(Number.isInteger)).toBe(true);
    expect(before.all[4]).toBe(0); // all-to-all needs no swaps
    expect(before.line[1]).toBeGreaterThan(before.all[1]); // a line needs swaps
    expect(before.grid[1]).toBeLessThanOrEqual(before.line[1]); // the grid never needs more than the line
    await shot(page, `circuits-setup-line-${label}`, 'circuit-line-qaoa');
    await shot(page, `circuits-setup-table-${label}`, 'enc-resources');

    await page.getByTestId('start-run').click();
    await page.waitForURL((u) => /^\/runs\/\d+$/.test(u.pathname));
    const runId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByTestId('percent-qaoa').getByText('100 %').waitFor({ timeout: 240_000 });
    await page.getByTestId('score-qaoa').click();
    const panel = page.getByTestId('circuit-panel');
    await panel.waitFor();

    // The finished job's counts equal the preview's, for every layout.
    for (const l of ['all', 'line', 'grid']) expect(numbersOf(await rowText(page, `resources-${l}`))).toEqual(before[l]);
    await panel.getByText('Circuit resources · 20 qubits').waitFor();
    // Time on a device per layout.
    for (const l of ['all', 'line', 'grid']) expect(await rowText(page, `time-${l}`)).toMatch(/(ns|µs|ms|s|min|h|days)/);
    // Noiseless vs noisy: the depolarizing estimate and the trajectory simulation (≤ 20 qubits).
    await page.getByTestId('noise-noiseless').waitFor();
    expect(await rowText(page, 'noise-depolarizing')).toMatch(/fidelity \d+(\.\d)? %/);
    expect(await rowText(page, 'noise-trajectories')).toMatch(/± /);
    await page.getByTestId('noisy-best').waitFor();
    for (const part of ['circuit-resources', 'device-time', 'noise-comparison', 'qasm-downloads']) await shot(page, `circuits-${part}-${label}`, part);

    // Both OpenQASM versions download as files of this run's circuit.
    for (const [i, first] of [[0, 'OPENQASM 3.0;'], [2, 'OPENQASM 2.0;']] as const) {
      const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId(`qasm-${i}`).click()]);
      expect(download.suggestedFilename()).toMatch(new RegExp(`^run-${runId}-qaoa-line-bound-openqasm${first.includes('3') ? 3 : 2}\\.qasm$`));
      const text = fs.readFileSync((await download.path())!, 'utf8');
      expect(text.split('\n')[0]).toBe(first);
      expect(text.match(/^(c\[\d+\] = measure q\[\d+\];|measure q\[\d+\] -> c\[\d+\];)$/gm)).toHaveLength(20); // every depot's qubit read out
    }
    expect(errors).toEqual([]);
    await context.close();
  }, 420_000);
});
