/**
 * Load benchmark (`npx tsx tests/bench/load.ts`, part of `npm run bench`, not of `npm test`): the
 * real server on loopback (test profile's MariaDB/Redis, its own database `spinyard_load`), a
 * seeded organisation with networks and finished runs, then
 *  1. autocannon at 50 concurrent connections on the list/get routes (Bearer token, as an
 *     integration calls them): p50/p95/p99 latency from every response's own time, requests/s;
 *  2. 100 queued small runs (greedy, 24 depots) drained by 2 worker processes
 *     (`tsx server/worker.ts`): drain time, runs per minute, p50/p95 time from release to finish.
 * Services first: `bash -c 'source server/scripts/services.sh; profile_env test; start_mariadb; start_redis'`.
 *
 *   npx tsx tests/bench/load.ts [--seconds 8] [--connections 50] [--runs 100] [--quick] [--no-write] [--route /runs] [--no-drain]
 * --route keeps only the routes whose name contains the text, --no-drain skips part 2 (both for
 * looking into one route; they imply --no-write).
 * LOAD_SQL=1 prints the SQL of each counted answer; --explain also prints MariaDB's plan (EXPLAIN) of each of its SELECTs.
 * Prints one line `LOAD-METRICS {json}` for tests/bench/all.ts and rewrites `## Load` in docs/benchmarks.md.
 */
import fs from 'node:fs';
import path from 'node:path';
import os from 'node:os';
import { applyTestEnv } from '../support/env';

const args = process.argv.slice(2);
const opt = (name: string, fallback: number): number => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const quick = args.includes('--quick');
const SECONDS = opt('--seconds', quick ? 3 : 8);
const CONNECTIONS = opt('--connections', 50);
const RUNS = opt('--runs', quick ? 30 : 100);
const routeAt = args.indexOf('--route');
const ROUTE = routeAt >= 0 ? args[routeAt + 1] : null;
const DRAIN = !args.includes('--no-drain');
const EXPLAIN = args.includes('--explain');
const write = !args.includes('--no-write') && !quick && !ROUTE && DRAIN;
const PORT = 3131;
const DOC = path.join(__dirname, '../../docs/benchmarks.md');

/** Targets (our own service levels for a 2-core machine shared with MariaDB, Redis and workers). */
export const LOAD_TARGETS = { p95Ms: 250, p99Ms: 500, drainSeconds: 120 } as const;

applyTestEnv();
const tag = `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
Object.assign(process.env, {
  DB_NAME: 'spinyard_load', // its own database: test suites that reset spinyard_test cannot pull it away
  RUN_QUEUE_NAME: `load-${tag}`,
  RUN_MAIL_AFTER_SECONDS: '100000',
  RUN_PROGRESS_WRITE_MS: '1000',
  LOG_LEVEL: 'silent',
  PORT: String(PORT),
  HOST: '127.0.0.1',
});

const quantile = (xs: number[], q: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s.length ? s[Math.min(s.length - 1, Math.max(0, Math.ceil(q * s.length) - 1))] : NaN;
};

interface RouteRow { route: string; statements: number; requests: number; perSecond: number; p50: number; p95: number; p99: number; non2xx: number; errors: number; bytes: number }

async function main() {
  const { loadConfig } = await import('../../server/config');
  const { createDatabase } = await import('../../server/db');
  const admin = createDatabase({ ...loadConfig(), DB_NAME: 'mysql' });
  await admin.query('CREATE DATABASE IF NOT EXISTS `spinyard_load` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci');
  await admin.close();

  const { startServer } = await import('../../server/index');
  const { createNetwork } = await import('../../server/services/networks');
  const { createToken } = await import('../../server/services/tokens');
  const { createRun, releaseRun } = await import('../../server/services/runs');
  const { closeSolveQueue } = await import('../../server/services/queue');
  const { randomEdges, networkBody } = await import('../api/runs-support');
  const { startWorkerProcess } = await import('../support/worker-process');
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  const autocannon = require('autocannon') as (opts: Record<string, unknown>) => { on: (e: string, f: (...a: unknown[]) => void) => void } & PromiseLike<{ requests: { total: number; average: number }; non2xx: number; errors: number; throughput: { total: number } }>;

  const started = await startServer({ seedDemo: false });
  const { deps } = started;
  // Before any worker starts: they would re-enqueue what an interrupted earlier run left behind.
  const { endLeftoverJobs, describeLeftovers } = await import('./leftover-jobs');
  console.log(describeLeftovers('spinyard_load', await endLeftoverJobs(deps)));
  const base = `http://127.0.0.1:${PORT}`;

  // Seed: an organisation on the largest plan, its owner with a token, 12 networks (2 versions
  // each), 40 finished runs with results.
  const org = await deps.models.Organisation.create({ name: `Load ${tag}`, plan: 'fleet' });
  const { createUser } = await import('../../server/services/accounts');
  const password = 'load-bench-harbour-42';
  const user = await deps.db.transaction((transaction) => createUser(deps, { email: `load.${tag}@load.example`, name: 'Load owner', password }, transaction));
  await deps.models.Membership.create({ organisationId: org.id, userId: user.id, role: 'owner' });
  const actor = { organisationId: org.id, userId: user.id };
  const { token } = await createToken(deps, org.id, user.id, 'load benchmark', null);
  const networks: { id: number; versionId: number }[] = [];
  for (let i = 0; i < 12; i++) {
    const created = await createNetwork(deps, actor, networkBody(`Load yard ${i}`, 60, randomEdges(60, 0.08, 900 + i)), { source: 'api' });
    networks.push({ id: created.id, versionId: created.versionId });
  }
  const runIds: number[] = [];
  for (let i = 0; i < 40; i++) {
    const nw = networks[i % networks.length];
    const run = await deps.models.Run.create({
      organisationId: org.id, networkId: nw.id, versionId: nw.versionId, createdBy: user.id, problem: JSON.stringify({ kind: 'maxcut' }),
      status: 'succeeded', held: false, priority: 1, seed: i, timeLimitSeconds: 5, depotCount: 60, finishedAt: new Date(),
    });
    const runId = run.get('id') as number;
    const assignment = Array.from({ length: 60 }, (_, k) => (k + i) % 2);
    await deps.models.RunJob.bulkCreate(['exact', 'tabu', 'qaoa'].map((solver, position) => ({
      runId, organisationId: org.id, position, solver, settings: '{}', status: 'succeeded', attempt: 1, progress: 1, finishedAt: new Date(),
      result: JSON.stringify({ value: 100 + position, assignment, bound: 110, gap: 0.1, provenOptimal: false, energy: null, expectation: null, params: null, seconds: 1, evaluations: 100, shots: 0 }),
    })));
    runIds.push(runId);
  }

  const routes: [string, string][] = [
    ['GET /networks', '/api/networks'],
    ['GET /networks/:id', `/api/networks/${networks[0].id}`],
    ['GET /networks/:id/versions', `/api/networks/${networks[0].id}/versions`],
    ['GET /networks/:id/versions/:versionId', `/api/networks/${networks[0].id}/versions/${networks[0].versionId}`],
    ['GET /runs', '/api/runs'],
    ['GET /runs/:id', `/api/runs/${runIds[0]}`],
    ['GET /auth/me', '/api/auth/me'],
  ];
  // A browser session too: the same list through the cookie (the session store is touched per request).
  const csrf = await fetch(`${base}/api/auth/csrf`);
  const first = (csrf.headers.get('set-cookie') ?? '').split(';')[0];
  const signIn = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { cookie: first, 'x-csrf-token': ((await csrf.json()) as { csrfToken: string }).csrfToken, 'content-type': 'application/json' }, body: JSON.stringify({ email: user.email, password }) });
  if (signIn.status !== 200) throw new Error(`sign-in for the cookie route failed: ${signIn.status}`);
  const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
  // Untimed warm-up: JIT, connection pools and caches, so the first measured route is not penalised.
  await autocannon({ url: `${base}/api/networks`, connections: CONNECTIONS, duration: 2, headers: { authorization: `Bearer ${token}` } });
  const rows: RouteRow[] = [];
  for (const [route, url] of [...routes, ['GET /networks (cookie session)', '/api/networks'] as [string, string]].filter(([r]) => !ROUTE || r.includes(ROUTE))) {
    const headers: Record<string, string> = route.includes('cookie') ? { cookie } : { authorization: `Bearer ${token}` };
    // SQL statements for one answer (N+1 queries show here whatever the machine's load).
    await new Promise((r) => setTimeout(r, 1500)); // answers still in flight from the previous route finish first
    await fetch(base + url, { headers }); // warm: first touches and caches are not the steady state
    let statements = 0;
    const selects: string[] = [];
    const options = (deps.db as unknown as { options: { logging?: unknown } }).options;
    options.logging = (sql: string) => {
      statements++;
      if (process.env.LOAD_SQL) console.log(`  sql: ${sql.slice(0, 160)}`);
      const body = sql.replace(/^Executing \([^)]*\):\s*/, '');
      if (/^SELECT/i.test(body)) selects.push(body);
    };
    const check = await fetch(base + url, { headers });
    options.logging = false;
    if (EXPLAIN) for (const sql of selects) {
      const [plan] = await deps.db.query(`EXPLAIN ${sql}`);
      console.log(`  explain: ${sql.slice(0, 200)}`);
      for (const row of plan as Array<Record<string, unknown>>) console.log(`    ${['table', 'type', 'possible_keys', 'key', 'key_len', 'ref', 'rows', 'Extra'].map((k) => `${k}=${row[k] ?? ''}`).join(' ')}`);
    }
    if (check.status !== 200) throw new Error(`${route} answered ${check.status} before the load: ${await check.text()}`);
    const times: number[] = [];
    const instance = autocannon({ url: base + url, connections: CONNECTIONS, duration: SECONDS, headers });
    instance.on('response', (...a: unknown[]) => times.push(a[3] as number));
    const r = await instance;
    rows.push({ route, statements, requests: r.requests.total, perSecond: r.requests.average, p50: quantile(times, 0.5), p95: quantile(times, 0.95), p99: quantile(times, 0.99), non2xx: r.non2xx, errors: r.errors, bytes: r.requests.total ? r.throughput.total / r.requests.total : 0 });
    console.log(`${route}: ${r.requests.total} requests, p50 ${quantile(times, 0.5).toFixed(1)} ms, p95 ${quantile(times, 0.95).toFixed(1)} ms, p99 ${quantile(times, 0.99).toFixed(1)} ms`);
  }

  // Queue drain: runs created held (not timed), released at once, two worker processes.
  const drain = DRAIN ? await drainQueue() : { runs: 0, finished: 0, succeeded: 0, seconds: NaN, perMinute: NaN, p50: NaN, p95: NaN };
  async function drainQueue() {
    const small = networks.slice(0, 4);
    const smallVersions: number[] = [];
    for (let i = 0; i < small.length; i++) smallVersions.push((await createNetwork(deps, actor, networkBody(`Small ${i}`, 24, randomEdges(24, 0.2, 50 + i)), { source: 'api' })).versionId);
    const held: number[] = [];
    for (let i = 0; i < RUNS; i++) held.push((await createRun(deps, { ...actor, role: 'owner' } as never, { versionId: smallVersions[i % smallVersions.length], problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }], timeLimitSeconds: 1, seed: i }, { hold: true })).id);
    const workers = [startWorkerProcess({ WORKER_CONCURRENCY: '1' }), startWorkerProcess({ WORKER_CONCURRENCY: '1' })];
    await new Promise((r) => setTimeout(r, 4000)); // workers load the engine before the clock starts
    const t0 = performance.now();
    await Promise.all(held.map((id) => releaseRun(deps, id)));
    const finishedAt = new Map<number, number>();
    const deadline = Date.now() + 600_000;
    while (finishedAt.size < held.length && Date.now() < deadline) {
      const done = await deps.models.Run.findAll({ where: { id: held.filter((id) => !finishedAt.has(id)), status: ['succeeded', 'failed', 'partial', 'cancelled'] }, attributes: ['id'] });
      const now = performance.now();
      for (const d of done) finishedAt.set(d.get('id') as number, now - t0);
      await new Promise((r) => setTimeout(r, 100));
    }
    const drainSeconds = (performance.now() - t0) / 1000;
    const succeeded = await deps.models.Run.count({ where: { id: held, status: 'succeeded' } });
    await Promise.all(workers.map((w) => w.stop()));
    const finish = [...finishedAt.values()];
    const result = { runs: held.length, finished: finishedAt.size, succeeded, seconds: drainSeconds, perMinute: (60 * finishedAt.size) / drainSeconds, p50: quantile(finish, 0.5) / 1000, p95: quantile(finish, 0.95) / 1000 };
    console.log(`drain: ${result.finished}/${result.runs} runs in ${drainSeconds.toFixed(1)} s (${result.succeeded} succeeded)`);
    return result;
  }

  await closeSolveQueue(deps).catch(() => undefined);
  await started.stop();

  const worst = { p95: Math.max(...rows.map((r) => r.p95)), p99: Math.max(...rows.map((r) => r.p99)) };
  const cpu = os.cpus()[0]?.model ?? 'unknown CPU';
  const when = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const section = [
    '## Load',
    '',
    `Written by \`npx tsx tests/bench/load.ts\` on ${when} UTC — ${cpu}, ${os.cpus().length} cores (shared with MariaDB, Redis, the workers and other work), ${(os.totalmem() / 2 ** 30).toFixed(1)} GiB RAM, Node ${process.version}. The server, MariaDB, Redis and autocannon share the machine's cores, so these are upper bounds for a dedicated host.`,
    '',
    `### List and get routes, ${CONNECTIONS} concurrent connections, ${SECONDS} s each (autocannon 8, Bearer token, loopback)`,
    '',
    'Seed: one organisation with 12 networks of 60 depots and 40 finished runs of 3 jobs; 2 s untimed warm-up first. Latency per response (exact quantiles of every response time); SQL/answer counts the statements of one answer, token check included. Targets: p95 ≤ 250 ms, p99 ≤ 500 ms.',
    '',
    '| route | SQL/answer | requests | req/s | p50 ms | p95 ms | p99 ms | non-2xx | errors | bytes/answer |',
    '|---|---|---|---|---|---|---|---|---|---|',
    ...rows.map((r) => `| \`${r.route}\` | ${r.statements} | ${r.requests} | ${r.perSecond.toFixed(0)} | ${r.p50.toFixed(1)} | ${r.p95.toFixed(1)} | ${r.p99.toFixed(1)} | ${r.non2xx} | ${r.errors} | ${r.bytes.toFixed(0)} |`),
    '',
    `### Queue drain: ${drain.runs} small runs (greedy, 24 depots), 2 worker processes`,
    '',
    'Runs created held, then released at once; the clock runs from the release to the last finished run. Target: ≤ 120 s.',
    '',
    '| runs | finished | succeeded | drain s | runs/min | p50 finish s | p95 finish s |',
    '|---|---|---|---|---|---|---|',
    `| ${drain.runs} | ${drain.finished} | ${drain.succeeded} | ${drain.seconds.toFixed(1)} | ${drain.perMinute.toFixed(0)} | ${drain.p50.toFixed(1)} | ${drain.p95.toFixed(1)} |`,
    '',
  ].join('\n');
  console.log('\n' + section);
  console.log(`LOAD-METRICS ${JSON.stringify({ worstP95Ms: worst.p95, worstP99Ms: worst.p99, drainSeconds: drain.seconds, drainFinished: drain.finished, drainRuns: drain.runs, rows })}`);
  if (write) {
    const doc = fs.existsSync(DOC) ? fs.readFileSync(DOC, 'utf8') : '# Benchmarks\n';
    const re = /## Load\n[\s\S]*?(?=\n## |$)/;
    fs.writeFileSync(DOC, re.test(doc) ? doc.replace(re, section) : `${doc.trimEnd()}\n\n${section}`);
    console.log(`updated ${path.relative(process.cwd(), DOC)}`);
  }
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
