/**
 * Web benchmark (`npx tsx tests/bench/web.ts`, part of `npm run bench`): the exported web app
 * served by the real server on loopback (test profile's MariaDB/Redis, its own database
 * `spinyard_web`, the demo organisation), Debian's Chromium at phone size, throttled through the
 * DevTools protocol like a mid-range phone on a slow mobile link (common practice in page-speed
 * audits: 150 ms round trip, 1.6 Mbit/s down, 750 kbit/s up, CPU slowed 4×). Measures
 *  1. first visit (empty cache): time to the sign-in form, bytes transferred;
 *     signing in → the networks list: time and bytes;
 *  2. repeat visit (same browser cache, signed out): the same;
 *  3. an open run screen while a real worker solves the run: API requests per minute.
 * Each visit is measured --repeat times (fresh browser context each); the table shows medians.
 * Services first: `bash -c 'source server/scripts/services.sh; profile_env test; start_mariadb; start_redis'`.
 * The web app is (re)built when stale (server/scripts/build-web.sh); --web-dir serves another export.
 *
 *   npx tsx tests/bench/web.ts [--repeat 3] [--live-seconds 20] [--web-dir dist/web] [--compare-with OLD_EXPORT_DIR] [--quick] [--no-write] [--no-throttle]
 * (an export folder must not sit under a dot-folder such as .data: Express will not send files there).
 * Prints one line `WEB-METRICS {json}` for tests/bench/all.ts and rewrites `## Web` in docs/benchmarks.md.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Browser, BrowserContext, CDPSession, Page } from 'playwright-core';
import { launchBrowser, PHONE } from '../support/browser';
import { applyTestEnv } from '../support/env';

const ROOT = path.resolve(__dirname, '..', '..');
const DOC = path.join(ROOT, 'docs', 'benchmarks.md');
const args = process.argv.slice(2);
const opt = (name: string, fallback: string): string => {
  const i = args.indexOf(name);
  return i >= 0 ? args[i + 1] : fallback;
};
const quick = args.includes('--quick');
const REPEAT = Number(opt('--repeat', quick ? '1' : '3'));
const LIVE_SECONDS = Number(opt('--live-seconds', quick ? '10' : '20'));
const WEB_DIR = path.resolve(ROOT, opt('--web-dir', 'dist/web'));
/** Another export (an earlier build) measured first in the same run, for a before/after table. */
const COMPARE = args.includes('--compare-with') ? path.resolve(ROOT, opt('--compare-with', '')) : null;
const write = !args.includes('--no-write') && !quick;
const throttled = !args.includes('--no-throttle'); // for finding faults only: the targets hold under throttling
const PORT = 3133;

/** Targets (issue 16): first visit ≤ 3 s and ≤ 1 MB; repeat visit ≤ 1 s; sign-in → list ≤ 2 s. */
export const WEB_TARGETS = { firstFormSeconds: 3, firstBytes: 1_000_000, repeatFormSeconds: 1, signInToListSeconds: 2 } as const;

/**
 * The mobile lab profile (common practice, the "slow 4G" row of page-speed audits): DevTools
 * applies the latency per request and the throughputs in bytes per second.
 */
export const THROTTLE = { latencyMs: 150, downBitsPerSecond: 1.6e6, upBitsPerSecond: 750e3, cpuSlowdown: 4 } as const;

applyTestEnv();
const tag = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
Object.assign(process.env, {
  DB_NAME: 'spinyard_web',
  RUN_QUEUE_NAME: `web-${tag}`,
  RUN_MAIL_AFTER_SECONDS: '100000',
  LOG_LEVEL: 'silent',
  PORT: String(PORT),
  HOST: '127.0.0.1',
});

interface Transfer { url: string; type: string; bytes: number; encoding: string; fromCache: boolean }

/** Throttle one page and record every response's bytes on the wire (headers included). */
async function throttle(page: Page, context: BrowserContext): Promise<{ cdp: CDPSession; transfers: Transfer[] }> {
  const cdp = await context.newCDPSession(page);
  const transfers: Transfer[] = [];
  const pending = new Map<string, Transfer>();
  await cdp.send('Network.enable');
  if (throttled) await cdp.send('Network.emulateNetworkConditions', {
    offline: false,
    latency: THROTTLE.latencyMs,
    downloadThroughput: THROTTLE.downBitsPerSecond / 8,
    uploadThroughput: THROTTLE.upBitsPerSecond / 8,
  });
  if (throttled) await cdp.send('Emulation.setCPUThrottlingRate', { rate: THROTTLE.cpuSlowdown });
  cdp.on('Network.responseReceived', (e) => {
    const h = Object.fromEntries(Object.entries(e.response.headers).map(([k, v]) => [k.toLowerCase(), String(v)]));
    pending.set(e.requestId, { url: e.response.url, type: e.type ?? '', bytes: 0, encoding: h['content-encoding'] ?? '', fromCache: !!e.response.fromDiskCache || !!e.response.fromPrefetchCache });
  });
  cdp.on('Network.requestServedFromCache', (e) => {
    const t = pending.get(e.requestId);
    if (t) t.fromCache = true;
  });
  cdp.on('Network.loadingFinished', (e) => {
    const t = pending.get(e.requestId);
    if (!t) return;
    t.bytes = e.encodedDataLength;
    transfers.push(t);
    pending.delete(e.requestId);
  });
  return { cdp, transfers };
}

const sum = (ts: Transfer[]) => ts.reduce((s, t) => s + t.bytes, 0);
const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length % 2 ? s[(s.length - 1) / 2] : (s[s.length / 2 - 1] + s[s.length / 2]) / 2;
};
const LIST = '[data-testid="networks-list"], [data-testid="networks-table"]';

/** Where a visit's time went, in seconds from navigation: HTML received, last script received, first paint, the driver saw the form; main-thread seconds in script, style + layout, all tasks. */
interface Breakdown { html: number; scripts: number; fcp: number; seen: number; script: number; style: number; task: number }
interface Visit { formSeconds: number; usableSeconds: number; formBytes: number; listSeconds: number; listBytes: number; transfers: Transfer[]; breakdown: Breakdown }

interface Metrics {
  firstFormSeconds: number; firstUsableSeconds: number; firstBytes: number; firstListSeconds: number; firstListBytes: number;
  repeatFormSeconds: number; repeatUsableSeconds: number; repeatBytes: number; repeatListSeconds: number; repeatListBytes: number;
  runScreenRequestsPerMinute: number;
}
interface Measured { metrics: Metrics; largest: Transfer[]; liveNote: string; first: Breakdown; repeat: Breakdown }

async function main() {
  execFileSync('bash', [path.join(ROOT, 'server', 'scripts', 'build-web.sh')], { cwd: ROOT, stdio: 'inherit' });
  for (const dir of [WEB_DIR, ...(COMPARE ? [COMPARE] : [])]) if (!fs.existsSync(path.join(dir, 'index.html'))) throw new Error(`no web export in ${dir}`);
  const { loadConfig } = await import('../../server/config');
  const { createDatabase } = await import('../../server/db');
  const admin = createDatabase({ ...loadConfig(), DB_NAME: 'mysql' });
  await admin.query('CREATE DATABASE IF NOT EXISTS `spinyard_web` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
  await admin.close();
  const browser = await launchBrowser();
  const chromium = browser.version();
  const before = COMPARE ? await measure(browser, COMPARE) : null;
  const now = await measure(browser, WEB_DIR);
  await browser.close();

  const m = now.metrics;
  const cpu = os.cpus()[0]?.model ?? 'unknown CPU';
  const when = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const kb = (b: number) => `${(b / 1000).toFixed(0)} kB`;
  const sec = (x: number) => `${x.toFixed(2)} s`;
  const ratio = (x: number, t: number) => (x / t).toFixed(2);
  const was = (f: (x: Metrics) => string) => (before ? ` | ${f(before.metrics)}` : '');
  const section = [
    '## Web',
    '',
    `Written by \`npx tsx tests/bench/web.ts${COMPARE ? ` --compare-with ${path.relative(ROOT, COMPARE).startsWith('..') ? COMPARE : path.relative(ROOT, COMPARE)}` : ''}\` on ${when} UTC — ${cpu}, ${os.cpus().length} cores (load average ${os.loadavg().map((l) => l.toFixed(1)).join(' / ')} when it ended: the machine was shared, so times carry that load), ${(os.totalmem() / 2 ** 30).toFixed(1)} GiB RAM, Node ${process.version}, Chromium ${chromium}.`,
    '',
    `The exported web app served by the API server on loopback; Chromium at ${PHONE.width}×${PHONE.height}${throttled ? `, throttled through the DevTools protocol: ${THROTTLE.latencyMs} ms latency per request, ${THROTTLE.downBitsPerSecond / 1e6} Mbit/s down, ${THROTTLE.upBitsPerSecond / 1e3} kbit/s up, CPU slowed ${THROTTLE.cpuSlowdown}× (the mobile row of page-speed audits, common practice)` : ', NOT throttled'}. Median of ${REPEAT} fresh browser contexts; bytes are on the wire, headers included. Repeat visit = the same browser cache, signed out. Signing in includes the server's password check at the test profile's bcrypt cost.${before ? ' "Before" is the export in the --compare-with folder (an earlier build), measured in the same run.' : ''}`,
    '',
    `| metric${before ? ' | before' : ''} | now | target | ratio (now / target) |`,
    `|---${before ? '|---' : ''}|---|---|---|`,
    `| first visit: sign-in form shown (largest paint)${was((x) => sec(x.firstFormSeconds))} | ${sec(m.firstFormSeconds)} | ≤ ${WEB_TARGETS.firstFormSeconds} s | ${ratio(m.firstFormSeconds, WEB_TARGETS.firstFormSeconds)} |`,
    `| first visit: sign-in form usable (app started)${was((x) => sec(x.firstUsableSeconds ?? NaN))} | ${sec(m.firstUsableSeconds)} | — | — |`,
    `| first visit: bytes to the sign-in form${was((x) => kb(x.firstBytes))} | ${kb(m.firstBytes)} | ≤ ${kb(WEB_TARGETS.firstBytes)} | ${ratio(m.firstBytes, WEB_TARGETS.firstBytes)} |`,
    `| first visit: signing in → networks list${was((x) => `${sec(x.firstListSeconds)} (${kb(x.firstListBytes)})`)} | ${sec(m.firstListSeconds)} (${kb(m.firstListBytes)}) | ≤ ${WEB_TARGETS.signInToListSeconds} s | ${ratio(m.firstListSeconds, WEB_TARGETS.signInToListSeconds)} |`,
    `| repeat visit: sign-in form shown (largest paint)${was((x) => `${sec(x.repeatFormSeconds)} (${kb(x.repeatBytes)})`)} | ${sec(m.repeatFormSeconds)} (${kb(m.repeatBytes)}) | ≤ ${WEB_TARGETS.repeatFormSeconds} s | ${ratio(m.repeatFormSeconds, WEB_TARGETS.repeatFormSeconds)} |`,
    `| repeat visit: sign-in form usable (app started)${was((x) => sec(x.repeatUsableSeconds ?? NaN))} | ${sec(m.repeatUsableSeconds)} | — | — |`,
    `| repeat visit: signing in → networks list${was((x) => `${sec(x.repeatListSeconds)} (${kb(x.repeatListBytes)})`)} | ${sec(m.repeatListSeconds)} (${kb(m.repeatListBytes)}) | ≤ ${WEB_TARGETS.signInToListSeconds} s | ${ratio(m.repeatListSeconds, WEB_TARGETS.signInToListSeconds)} |`,
    `| open run screen while solving: API requests per minute${was((x) => x.runScreenRequestsPerMinute.toFixed(1))} | ${m.runScreenRequestsPerMinute.toFixed(1)} | — | — |`,
    '',
    ...(before ? [`Run screen before: ${before.liveNote}.`, ''] : []),
    `Run screen now: ${now.liveNote}.`,
    '',
    'Where the time goes to the sign-in form (medians; seconds from navigation, then main-thread seconds of the throttled CPU, Chromium\'s own counters up to the app having started):',
    '',
    `| visit | HTML received | last script received | first paint | form seen by the driver | in script | in style + layout | all main-thread tasks |`,
    '|---|---|---|---|---|---|---|---|',
    ...([['first', 'first'], ['repeat', 'repeat']] as const).flatMap(([label, k]) => [...(before ? [[`${label} (before)`, before[k]] as const] : []), [`${label}${before ? ' (now)' : ''}`, now[k]] as const]).map(([label, b]) => `| ${label} | ${sec(b.html)} | ${sec(b.scripts)} | ${sec(b.fcp)} | ${sec(b.seen)} | ${sec(b.script)} | ${sec(b.style)} | ${sec(b.task)} |`),
    '',
    'Largest responses of the first visit (now):',
    '',
    '| response | type | encoding | bytes |',
    '|---|---|---|---|',
    ...now.largest.map((t) => `| \`${new URL(t.url).pathname.replace(/[0-9a-f]{32}/, '…')}\` | ${t.type} | ${t.encoding || 'none'} | ${kb(t.bytes)} |`),
    '',
  ].join('\n');
  console.log('\n' + section);
  console.log(`WEB-METRICS ${JSON.stringify(m)}`);
  if (write) {
    const doc = fs.existsSync(DOC) ? fs.readFileSync(DOC, 'utf8') : '# Benchmarks\n';
    const re = /## Web\n[\s\S]*?(?=\n## |$)/;
    fs.writeFileSync(DOC, re.test(doc) ? doc.replace(re, section) : `${doc.trimEnd()}\n\n${section}`);
    console.log(`updated ${path.relative(process.cwd(), DOC)}`);
  }
}

/** Serve one web export and measure it: visits, then an open run screen. */
async function measure(browser: Browser, webDir: string): Promise<Measured> {
  process.env.WEB_DIR = webDir;
  console.log(`measuring ${path.relative(ROOT, webDir) || webDir}`);
  const { startServer } = await import('../../server/index');
  const { ensureDemoOrganisation, DEMO_PASSWORD } = await import('../../server/services/seed-demo');
  const { ensureDemoNetworks } = await import('../../server/services/demo-networks');
  const { createRun } = await import('../../server/services/runs');
  const { closeSolveQueue } = await import('../../server/services/queue');
  const { startWorkerProcess } = await import('../support/worker-process');
  const started = await startServer({ seedDemo: false });
  const { deps } = started;
  const base = `http://127.0.0.1:${PORT}`;
  const demo = await ensureDemoOrganisation(deps);
  await ensureDemoNetworks(deps, demo.organisationId);
  const analyst = demo.users.analyst;
  /** Open /sign-in on a throttled page, then sign in and wait for the networks list. */
  async function visit(context: BrowserContext): Promise<Visit> {
    const page = await context.newPage();
    page.on('console', (m) => m.type() === 'error' && console.error(`page console: ${m.text()}`));
    page.on('pageerror', (e) => console.error(`page error: ${e.message}`));
    const { cdp, transfers } = await throttle(page, context);
    await cdp.send('Performance.enable');
    const t0 = performance.now();
    await page.goto(`${base}/sign-in`, { waitUntil: 'commit' });
    await page.getByTestId('sign-in-email').first().waitFor({ state: 'visible', timeout: 120_000 });
    const seenSeconds = (performance.now() - t0) / 1000;
    // Usable: the app's own form is there (a prerendered copy, if any, has been taken over).
    await page.waitForFunction(() => !document.getElementById('prerendered') && !!document.querySelector('#root [data-testid="sign-in-email"]'), null, { timeout: 120_000, polling: 50 });
    const usableSeconds = (performance.now() - t0) / 1000;
    await new Promise((r) => setTimeout(r, 300)); // responses still finishing count with the form
    const timeline = await page.evaluate(() => new Promise<{ html: number; scripts: number; fcp: number; lcp: number }>((resolve) => {
      const nav = performance.getEntriesByType('navigation')[0] as PerformanceNavigationTiming;
      const scripts = performance.getEntriesByType('resource').filter((r) => r.name.endsWith('.js')).map((r) => (r as PerformanceResourceTiming).responseEnd);
      const fcp = performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? NaN;
      new PerformanceObserver((list) => {
        const all = list.getEntries();
        resolve({ html: nav.responseEnd, scripts: Math.max(0, ...scripts), fcp, lcp: all.length ? all[all.length - 1].startTime : NaN });
      }).observe({ type: 'largest-contentful-paint', buffered: true });
    }));
    // Main-thread time by kind, from Chromium's own counters (seconds of throttled CPU).
    const counters = Object.fromEntries(((await cdp.send('Performance.getMetrics')).metrics as Array<{ name: string; value: number }>).map((x) => [x.name, x.value]));
    const formBytes = sum(transfers);
    const mark = transfers.length;
    await page.getByTestId('sign-in-email').fill(analyst.email);
    await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
    const t1 = performance.now();
    await page.getByTestId('sign-in-submit').click();
    await page.locator(LIST).first().waitFor({ state: 'visible', timeout: 120_000 });
    const listSeconds = (performance.now() - t1) / 1000;
    await new Promise((r) => setTimeout(r, 300));
    const listBytes = sum(transfers.slice(mark));
    const all = [...transfers];
    await page.close();
    const breakdown: Breakdown = {
      html: timeline.html / 1000, scripts: timeline.scripts / 1000, fcp: timeline.fcp / 1000, seen: seenSeconds,
      script: counters.ScriptDuration ?? NaN, style: (counters.RecalcStyleDuration ?? 0) + (counters.LayoutDuration ?? 0), task: counters.TaskDuration ?? NaN,
    };
    // Shown = the largest paint of the page (Core Web Vitals' LCP, by the browser's clock): the driver's
    // own check can only run between the page's long tasks, so it lags a painted form.
    const painted = Number.isFinite(timeline.lcp) ? timeline.lcp / 1000 : seenSeconds;
    return { formSeconds: painted, usableSeconds, formBytes, listSeconds, listBytes, transfers: all, breakdown };
  }

  const first: Visit[] = [];
  const repeat: Visit[] = [];
  for (let i = 0; i < REPEAT; i++) {
    const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
    first.push(await visit(context));
    await context.clearCookies(); // signed out, cache kept: a returning visitor
    repeat.push(await visit(context));
    await context.close();
    console.log(`visit ${i + 1} (load ${os.loadavg()[0].toFixed(1)}): first shown ${first[i].formSeconds.toFixed(2)} s, usable ${first[i].usableSeconds.toFixed(2)} s, ${(first[i].formBytes / 1e6).toFixed(2)} MB; sign-in → list ${first[i].listSeconds.toFixed(2)} s; repeat shown ${repeat[i].formSeconds.toFixed(2)} s, usable ${repeat[i].usableSeconds.toFixed(2)} s, ${(repeat[i].formBytes / 1e3).toFixed(0)} kB; sign-in → list ${repeat[i].listSeconds.toFixed(2)} s`);
    console.log(`  where the time went (first / repeat): ${JSON.stringify(first[i].breakdown)} / ${JSON.stringify(repeat[i].breakdown)}`);
  }

  // An open run screen while a worker solves the run: count the page's API requests while live.
  const core = await deps.models.Network.findOne({ where: { organisationId: demo.organisationId, demoKey: 'quillmere-core' } })
    ?? (await deps.models.Network.findOne({ where: { organisationId: demo.organisationId }, order: [['id', 'ASC']] }))!;
  const version = (await deps.models.NetworkVersion.findOne({ where: { networkId: core.get('id') as number }, order: [['number', 'DESC']] }))!;
  const worker = startWorkerProcess({ WORKER_CONCURRENCY: '1' });
  await new Promise((r) => setTimeout(r, 4000)); // the worker loads the engine first
  const liveSeconds = LIVE_SECONDS;
  const { id: runId } = await createRun(deps, { organisationId: demo.organisationId, userId: analyst.id, role: 'analyst' }, {
    versionId: version.get('id') as number, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: liveSeconds + 15, seed: 1,
  } as never);
  const context = await browser.newContext({ viewport: PHONE, deviceScaleFactor: 2, isMobile: true, hasTouch: true });
  const page = await context.newPage();
  await throttle(page, context);
  await page.goto(`${base}/sign-in`);
  await page.getByTestId('sign-in-email').fill(analyst.email);
  await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.locator(LIST).first().waitFor({ state: 'visible', timeout: 120_000 });
  await page.goto(`${base}/runs/${runId}`);
  await page.getByText(/tabu/i).first().waitFor({ timeout: 60_000 });
  const requests: string[] = [];
  page.on('request', (r) => {
    const u = new URL(r.url());
    if (u.pathname.startsWith('/api/')) requests.push(`${r.method()} ${u.pathname}`);
  });
  const s0 = performance.now();
  let stillLive = true;
  while (performance.now() - s0 < liveSeconds * 1000) {
    await new Promise((r) => setTimeout(r, 1000));
    const status = (await deps.models.Run.findByPk(runId))!.get('status') as string;
    if (!['queued', 'running'].includes(status)) { stillLive = false; break; }
  }
  const watched = (performance.now() - s0) / 1000;
  const perMinute = (60 * requests.length) / watched;
  const kinds = [...new Set(requests)].map((k) => `${k} ×${requests.filter((r) => r === k).length}`).join(', ');
  console.log(`run screen: ${requests.length} API requests in ${watched.toFixed(1)} s (${perMinute.toFixed(1)}/min${stillLive ? '' : ', run ended early'}): ${kinds}`);
  await context.close();
  await worker.stop();
  await closeSolveQueue(deps).catch(() => undefined);
  await started.stop();

  const metrics: Metrics = {
    firstFormSeconds: median(first.map((v) => v.formSeconds)),
    firstUsableSeconds: median(first.map((v) => v.usableSeconds)),
    firstBytes: median(first.map((v) => v.formBytes)),
    firstListSeconds: median(first.map((v) => v.listSeconds)),
    firstListBytes: median(first.map((v) => v.listBytes)),
    repeatFormSeconds: median(repeat.map((v) => v.formSeconds)),
    repeatUsableSeconds: median(repeat.map((v) => v.usableSeconds)),
    repeatBytes: median(repeat.map((v) => v.formBytes)),
    repeatListSeconds: median(repeat.map((v) => v.listSeconds)),
    repeatListBytes: median(repeat.map((v) => v.listBytes)),
    runScreenRequestsPerMinute: perMinute,
  };
  // The heaviest responses of the first visit, to show where the bytes go.
  const largest = first[0].transfers.filter((t) => t.bytes > 0).sort((a, b) => b.bytes - a.bytes).slice(0, 8);
  const mid = (vs: Visit[]): Breakdown => Object.fromEntries(Object.keys(vs[0].breakdown).map((k) => [k, median(vs.map((v) => v.breakdown[k as keyof Breakdown]))])) as unknown as Breakdown;
  return { metrics, largest, first: mid(first), repeat: mid(repeat), liveNote: `tabu on the demo network, one worker, watched ${watched.toFixed(0)} s${stillLive ? '' : ' (the run ended early)'}: ${kinds || 'no API requests'}` };
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
