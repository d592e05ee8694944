/**
 * How the web app reaches a phone: scripts served compressed (brotli, else gzip) with the right
 * Content-Encoding, Vary and caching; the sign-in page loads no server package and none of the
 * drawing, chart or API-documentation code (checked against the source maps of the very chunks it
 * loaded, dist/web-maps); the sign-in form is in the page's HTML (prerendered at build) and the app
 * takes over from it keeping what was typed; and an open run screen follows the run through the
 * server's progress stream instead of polling. A real worker process solves the run.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, PHONE, watchPageErrors } from '../support/browser';
import { startTestServer } from '../support/server';
import { useOwnDatabase } from '../support/own-database';
import { startWorkerProcess } from '../support/worker-process';

const ROOT = path.resolve(__dirname, '..', '..');
const MAPS = path.join(ROOT, 'dist', 'web-maps');
/** Packages that only the server may load (database, queue, HTTP server, logging, mail, payments, the MILP solver). */
const SERVER_ONLY = ['sequelize', 'bullmq', 'express', 'mariadb', 'pino', 'pino-http', 'highs', 'ioredis', 'nodemailer', 'stripe', 'bcryptjs', 'multer', 'umzug', 'smtp-server', 'mailparser', 'express-session', 'helmet'];
const serverPackage = new RegExp(`node_modules/(${SERVER_ONLY.join('|')})/`);
/** Code the sign-in page has no use for. */
const NOT_AT_SIGN_IN = [/\/components\/drawing\//, /\/components\/charts\//, /\/components\/api-docs\//, /node_modules\/d3-/];

let server: Awaited<ReturnType<typeof startTestServer>>;
let browser: Browser;
let worker: ReturnType<typeof startWorkerProcess>;
let organisationId = 0;
let versionId = 0;
let analyst = { id: 0, email: '' };
let password = '';

beforeAll(async () => {
  await useOwnDatabase('web');
  server = await startTestServer(3192);
  worker = startWorkerProcess();
  const { ensureDemoOrganisation, DEMO_PASSWORD } = await import('../../server/services/seed-demo');
  const { ensureDemoNetworks } = await import('../../server/services/demo-networks');
  const demo = await ensureDemoOrganisation(server.deps);
  organisationId = demo.organisationId;
  analyst = demo.users.analyst;
  password = DEMO_PASSWORD;
  await ensureDemoNetworks(server.deps, organisationId);
  const network = await server.deps.models.Network.findOne({ where: { organisationId, demoKey: 'quillmere-core' } });
  const version = await server.deps.models.NetworkVersion.findOne({ where: { networkId: network!.get('id') as number }, order: [['number', 'DESC']] });
  versionId = version!.get('id') as number;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await worker?.stop();
  await server?.stop();
});

/** Every module (source path) of one served chunk, from its source map. */
function modulesOf(scriptPath: string): string[] {
  const map = path.join(MAPS, `${scriptPath}.map`);
  if (!fs.existsSync(map)) throw new Error(`no source map for ${scriptPath} in dist/web-maps: rebuild with \`npm run build:web\``);
  return (JSON.parse(fs.readFileSync(map, 'utf8')) as { sources: string[] }).sources;
}

async function signIn(page: Page) {
  await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').fill(analyst.email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
}

test('the sign-in page gets compressed, cacheable scripts with no server package and no drawing, chart or API-docs code', async () => {
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  const scripts: Array<{ path: string; headers: Record<string, string> }> = [];
  page.on('response', (r) => {
    const u = new URL(r.url());
    if (u.pathname.endsWith('.js')) scripts.push({ path: u.pathname, headers: r.headers() });
  });
  const html = await page.goto(`${server.url}/sign-in`);
  await page.getByTestId('sign-in-email').waitFor();
  expect(html!.headers()['cache-control']).toBe('no-cache');
  expect(scripts.length).toBeGreaterThan(0);
  expect(scripts.filter((s) => s.headers['content-encoding'] === 'br').length).toBeGreaterThanOrEqual(3); // runtime, common, entry at least
  const loaded: string[] = [];
  for (const s of scripts) {
    // Chromium accepts brotli from 127.0.0.1; files under 1 KB get no compressed copy (static-assets.ts).
    if (s.headers['content-encoding'] === undefined) {
      expect([s.path, Number(s.headers['content-length']) < 1024]).toEqual([s.path, true]);
    } else {
      expect([s.path, s.headers['content-encoding']]).toEqual([s.path, 'br']);
      expect(s.headers.vary).toMatch(/accept-encoding/i);
    }
    expect(s.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(s.headers['content-type']).toMatch(/javascript/);
    loaded.push(...modulesOf(s.path));
  }
  expect(loaded.length).toBeGreaterThan(100);
  expect(loaded.filter((m) => serverPackage.test(m) || /\/server\//.test(m))).toEqual([]);
  expect(loaded.filter((m) => NOT_AT_SIGN_IN.some((re) => re.test(m)))).toEqual([]);
  // A client without brotli gets gzip; one that accepts neither gets the plain file.
  const entry = scripts.find((s) => s.path.includes('/entry-'))!.path;
  const gz = await fetch(`${server.url}${entry}`, { headers: { 'accept-encoding': 'gzip' } });
  expect(gz.headers.get('content-encoding')).toBe('gzip');
  const plain = await fetch(`${server.url}${entry}`, { headers: { 'accept-encoding': 'identity' } });
  expect(plain.headers.get('content-encoding')).toBeNull();
  expect((await plain.text()).length).toBeGreaterThan(Number(gz.headers.get('content-length')));
  expect(errors).toEqual([]);
  await context.close();
});

test('the sign-in page arrives with its form in the HTML: shown before any script runs, typing kept when the app takes over', async () => {
  // The page itself: compressed, revalidated, the form inside the prerendered layer, route chunks preloaded.
  const raw = await fetch(`${server.url}/sign-in?next=/runs`, { headers: { 'accept-encoding': 'br' } });
  expect(raw.headers.get('content-encoding')).toBe('br');
  expect(raw.headers.get('cache-control')).toBe('no-cache');
  expect(raw.headers.get('content-type')).toMatch(/text\/html/);
  const html = await raw.text();
  const layer = html.slice(html.indexOf('<div id="prerendered">'), html.indexOf('<div id="root"></div>'));
  expect(layer).toContain('data-testid="sign-in-email"');
  expect(layer).toContain('data-testid="sign-in-password"');
  expect(html).toMatch(/<link rel="preload" as="script" href="\/_expo\/static\/js\/web\/sign-in-[0-9a-f]{32}\.js"/);

  // Scripts held back: the form is on screen anyway, and takes typing.
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  let held = 0;
  let release = () => {};
  const gate = new Promise<void>((r) => (release = r));
  await page.route('**/*.js', async (route) => {
    held++;
    await gate;
    await route.continue();
  });
  await page.goto(`${server.url}/sign-in`, { waitUntil: 'commit' }); // DOMContentLoaded waits for the held (deferred) scripts
  await page.getByTestId('sign-in-email').waitFor({ state: 'visible' });
  expect(await page.evaluate(() => document.getElementById('root')!.childElementCount)).toBe(0); // no script has run
  expect(await page.getByTestId('sign-in-submit').getAttribute('aria-disabled')).toBe('true');
  await page.getByTestId('sign-in-email').fill(analyst.email);
  await page.getByTestId('sign-in-password').fill(password);
  expect(held).toBeGreaterThan(0);
  release();
  await page.waitForFunction(() => !document.getElementById('prerendered'));
  expect(await page.getByTestId('sign-in-email').inputValue()).toBe(analyst.email);
  expect(await page.getByTestId('sign-in-password').inputValue()).toBe(password);
  await page.getByTestId('sign-in-submit').click();
  await page.waitForURL((u) => u.pathname === '/networks');
  expect(errors).toEqual([]);
  await context.close();
});

test('no chunk of the whole app contains a server package (source maps of every chunk)', () => {
  const maps: string[] = [];
  const walk = (d: string) => fs.readdirSync(d, { withFileTypes: true }).forEach((e) => (e.isDirectory() ? walk(path.join(d, e.name)) : e.name.endsWith('.js.map') && maps.push(path.join(d, e.name))));
  walk(MAPS);
  expect(maps.length).toBeGreaterThan(5);
  const offending = maps.flatMap((m) => (JSON.parse(fs.readFileSync(m, 'utf8')) as { sources: string[] }).sources.filter((s) => serverPackage.test(s) || /\/server\//.test(s)));
  expect(offending).toEqual([]);
});

test('an open run screen follows the run through the progress stream, not by polling, to its result', async () => {
  const { createRun } = await import('../../server/services/runs');
  const context = await browser.newContext({ viewport: PHONE });
  const page = await context.newPage();
  const errors = watchPageErrors(page);
  await signIn(page);
  // Tabu searches until its time limit: a run that stays live for a few seconds.
  const { id } = await createRun(server.deps, { organisationId, userId: analyst.id, role: 'analyst' }, { versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: 8, seed: 3 } as never);
  const streams: string[] = [];
  const polls: number[] = [];
  page.on('request', (r) => {
    const u = new URL(r.url());
    if (u.pathname === `/api/runs/${id}/events`) streams.push(r.resourceType());
    if (u.pathname === `/api/runs/${id}`) polls.push(Date.now());
  });
  await page.goto(`${server.url}/runs/${id}`);
  await page.getByTestId('run-progress').waitFor();
  // Percentages seen while the job runs: more than one value means the screen moved while open.
  const seen = new Set<string>();
  const deadline = Date.now() + 60_000;
  while (Date.now() < deadline) {
    const text = (await page.getByTestId('percent-tabu').textContent()) ?? '';
    seen.add(text);
    if (text === '100 %') break;
    await page.waitForTimeout(250);
  }
  expect(seen.has('100 %')).toBe(true);
  expect([...seen].filter((t) => t !== '0 %' && t !== '100 %').length).toBeGreaterThan(0);
  await page.getByTestId('scorecard').waitFor({ timeout: 30_000 });
  expect(streams).toEqual(['eventsource']);
  // ≥ 8 s live: polling once a second would have asked ≥ 8 times. The stream needs the first
  // read, one read when the job finishes (its result), and at most one more.
  expect(polls.length).toBeLessThanOrEqual(3);
  const run = await server.deps.models.Run.findByPk(id);
  expect(run!.get('status')).toBe('succeeded');
  expect(errors).toEqual([]);
  await context.close();
});
