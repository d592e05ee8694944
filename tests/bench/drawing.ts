/**
 * Drawing benchmark: how much dearer is editing a 500-depot network than a 50-depot one in the
 * browser? Opens each network in Chromium (phone viewport), drags one depot across the canvas in
 * "Move depots" mode and measures the time per pointer move until the next animation frame, and
 * the time for the screen to show the drawing. Reports ratios measured in the same run (the
 * memoised marks should keep the per-move cost nearly flat while the depot count grows 10×).
 *
 *   npx tsx tests/bench/drawing.ts            (needs the test profile's MariaDB/Redis, and dist/web)
 */
import { launchBrowser, PHONE } from '../support/browser';
import { startTestServer } from '../support/server';
import { createOrgWithRoles } from '../api/setup/test-app';
import { createNetwork } from '../../server/services/networks';
import { createRng } from '../../shared/engine/random';

/** A random geometric network in a unit square (positions become lat/lon so no force layout runs). */
function geometric(n: number, seed: number) {
  const rng = createRng(seed);
  const pts = Array.from({ length: n }, () => [rng.next(), rng.next()] as const);
  const depots = pts.map(([x, y], i) => ({ id: `d${i}`, lat: 47 + y * 0.5, lon: -31 + x * 0.7 }));
  const lanes: { from: string; to: string; weight: number }[] = [];
  const r = Math.sqrt(5 / (Math.PI * n)); // about 5 neighbours each
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
    if (Math.hypot(pts[i][0] - pts[j][0], pts[i][1] - pts[j][1]) < r) lanes.push({ from: `d${i}`, to: `d${j}`, weight: 1 + rng.int(50) });
  }
  return { depots, lanes };
}

async function main() {
  const server = await startTestServer(3179);
  const org = await createOrgWithRoles(server.deps, 'Bench drawing');
  const actor = { organisationId: org.organisationId, userId: org.users.dispatcher.id };
  const sizes = [50, 500];
  const ids: number[] = [];
  for (const n of sizes) ids.push((await createNetwork(server.deps, actor, { name: `Bench ${n}`, ...geometric(n, n) }, { source: 'api' })).id);
  const browser = await launchBrowser();
  const page = await (await browser.newContext({ viewport: PHONE })).newPage();
  page.on('console', (m) => { if (m.type() === 'error') console.error('page:', m.text()); });
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(org.users.dispatcher.email);
  await page.getByTestId('sign-in-password').fill(org.users.dispatcher.password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');

  const results: { n: number; lanes: number; openMs: number; moveMs: number }[] = [];
  for (let k = 0; k < sizes.length; k++) {
    const t0 = Date.now();
    await page.goto(`${server.url}/networks/${ids[k]}`);
    await page.locator('svg[aria-label^="Drawing of"] circle').first().waitFor();
    const openMs = Date.now() - t0;
    const lanes = Number((await page.getByTestId('summary-lanes').textContent())?.replace(/\s/g, ''));
    await page.getByTestId('mode-move').click();
    const canvas = page.getByTestId('drawing-canvas');
    await canvas.scrollIntoViewIfNeeded();
    // Grab the depot drawn nearest the canvas centre.
    const target = await page.evaluate(() => {
      const svg = document.querySelector('svg[aria-label^="Drawing of"]')!;
      const box = svg.getBoundingClientRect();
      let best = { x: 0, y: 0, d: Infinity };
      for (const c of Array.from(svg.querySelectorAll('circle[stroke-width]'))) {
        const r = c.getBoundingClientRect();
        const x = r.left + r.width / 2, y = r.top + r.height / 2;
        const d = Math.hypot(x - (box.left + box.width / 2), y - (box.top + box.height / 2));
        if (d < best.d) best = { x, y, d };
      }
      return best;
    });
    const moves = 60;
    await page.mouse.move(target.x, target.y);
    await page.mouse.down();
    const m0 = Date.now();
    for (let i = 1; i <= moves; i++) {
      await page.mouse.move(target.x + i * 2, target.y + Math.sin(i / 6) * 30);
      await page.evaluate(() => new Promise((r) => requestAnimationFrame(() => r(null))));
    }
    const moveMs = (Date.now() - m0) / moves;
    await page.mouse.up();
    results.push({ n: sizes[k], lanes, openMs, moveMs });
  }
  await browser.close();
  await server.stop();
  const [small, large] = results;
  console.log('## Drawing (browser, 390×844)\n');
  console.log('| depots | lanes | open → drawing shown (ms) | per drag move incl. next frame (ms) |');
  console.log('| --- | --- | --- | --- |');
  for (const r of results) console.log(`| ${r.n} | ${r.lanes} | ${r.openMs} | ${r.moveMs.toFixed(1)} |`);
  console.log(`\nRatios 500 vs 50 depots (same run): open ${(large.openMs / small.openMs).toFixed(2)}×, per move ${(large.moveMs / small.moveMs).toFixed(2)}× for ${(large.n / small.n).toFixed(0)}× the depots.`);
  process.exit(0);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
