/**
 * Solve-service benchmark (`npm run bench:service`): real worker processes on the test profile's
 * MariaDB and Redis (start them first: `bash -c 'source server/scripts/services.sh; profile_env
 * test; start_mariadb; start_redis'`).
 *
 * 1. Throughput: a burst of small runs (one `tabu` job of 1 s on a 60-depot network each, created held
 *    and released at once) with 1 and then 2 worker processes (one solve thread each); runs per
 *    minute and the 2-worker/1-worker ratio, measured in the same run.
 * 2. Queue latency, creation (release, for the burst) → a worker starts the job (the worker's "running" event on Redis
 *    pub/sub, millisecond clock of this process): p50/p95 for the burst (includes waiting behind
 *    the backlog) and for paced instant runs, one every 500 ms on an idle worker (dispatch alone).
 * 3. Cancel latency: a 60 s `tabu` run on a 300-depot network is cancelled once it reports
 *    progress; time from cancelRun to the run's `cancelled` status (target about 1 s).
 *
 *   npx tsx tests/bench/service.ts [--runs 24] [--paced 20] [--cancels 5] [--depots 60] [--job-seconds 1] [--no-write]
 * Rewrites the `## Service` section of docs/benchmarks.md.
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { applyTestEnv } from '../support/env';
import { uniqueTag } from '../api/setup/test-app';

const args = process.argv.slice(2);
const opt = (name: string, fallback: number): number => {
  const i = args.indexOf(name);
  return i >= 0 ? Number(args[i + 1]) : fallback;
};
const RUNS = opt('--runs', 24);
const PACED = opt('--paced', 20);
const CANCELS = opt('--cancels', 5);
const DEPOTS = opt('--depots', 60);
const JOB_SECONDS = opt('--job-seconds', 1);
const write = !args.includes('--no-write');
const DOC = path.join(__dirname, '../../docs/benchmarks.md');

applyTestEnv();
// Its own database on the test instance, so test suites that reset spinyard_test cannot pull it away.
const BENCH_DB = 'spinyard_bench';
Object.assign(process.env, {
  DB_NAME: BENCH_DB,
  RUN_QUEUE_NAME: `bench-${uniqueTag()}`,
  RUN_MAIL_AFTER_SECONDS: '100000', // no e-mails from the benchmark
  RUN_PROGRESS_WRITE_MS: '1000',
  LOG_LEVEL: 'silent',
});

const quantile = (xs: number[], q: number): number => {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(q * s.length) - 1))];
};

async function main() {
  const { loadConfig } = await import('../../server/config');
  const { createDeps, closeDeps } = await import('../../server/deps');
  const { migrate } = await import('../../server/migrate');
  const { createNetwork } = await import('../../server/services/networks');
  const { cancelRun, createRun, releaseRun } = await import('../../server/services/runs');
  const { closeSolveQueue } = await import('../../server/services/queue');
  const { startWorkerChild, randomEdges, networkBody } = await import('../api/runs-support');
  const { createDatabase } = await import('../../server/db');
  const admin = createDatabase({ ...loadConfig(), DB_NAME: 'mysql' });
  await admin.query(`CREATE DATABASE IF NOT EXISTS \`${BENCH_DB}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();
  const { billingRunHooks } = await import('../../server/services/billing-run-hooks');
  const deps = createDeps(loadConfig(), { runHooks: billingRunHooks });
  await migrate(deps.db);
  // Before any worker starts: they would re-enqueue what an interrupted earlier run left behind.
  const { endLeftoverJobs, describeLeftovers } = await import('./leftover-jobs');
  console.log(describeLeftovers(BENCH_DB, await endLeftoverJobs(deps)));
  const tag = uniqueTag();
  const org = await deps.models.Organisation.create({ name: `Bench ${tag}`, plan: 'fleet' });
  const user = await deps.models.User.create({ email: `bench.${tag}@bench.example`, name: 'Bench', passwordHash: 'x'.repeat(60) });
  const actor = { organisationId: org.id, userId: user.id, role: 'analyst' as const };
  const versions: number[] = [];
  for (let i = 0; i < 8; i++) {
    const doc = networkBody(`Bench ${i}`, DEPOTS, randomEdges(DEPOTS, 0.1, 500 + i));
    versions.push((await createNetwork(deps, { organisationId: org.id, userId: user.id }, doc, { source: 'api' })).versionId);
  }

  // Start times from the workers' "running" events.
  const sub = deps.redis.duplicate();
  const startedAt = new Map<number, number>(); // run id → ms
  sub.on('pmessage', (_p: string, _c: string, message: string) => {
    const e = JSON.parse(message) as { type: string; status?: string; runId: number };
    if (e.type === 'status' && e.status === 'running' && !startedAt.has(e.runId)) startedAt.set(e.runId, performance.now());
  });
  await sub.psubscribe('spinyard:run:*');

  const createdAt = new Map<number, number>();
  const body = (i: number) => ({ versionId: versions[i % versions.length], problem: { kind: 'maxcut' as const }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: JOB_SECONDS });
  /** One instant run (greedy), for the dispatch latency on an idle worker. */
  const start = async (i: number) => {
    const t0 = performance.now();
    const r = await createRun(deps, actor, { ...body(i), solvers: [{ solver: 'greedy' }] });
    createdAt.set(r.id, t0);
    return r.id;
  };
  /** A burst: runs created held (untimed), then all released at once; latency counts from release. */
  const burst = async (count: number) => {
    const ids: number[] = [];
    for (let i = 0; i < count; i++) ids.push((await createRun(deps, actor, body(i), { hold: true })).id);
    const t0 = performance.now();
    ids.forEach((id) => createdAt.set(id, t0));
    await Promise.all(ids.map((id) => releaseRun(deps, id)));
    return { ids, t0 };
  };
  const allDone = async (ids: number[], timeoutMs: number) => {
    const deadline = Date.now() + timeoutMs;
    for (;;) {
      const n = await deps.models.Run.count({ where: { id: ids, status: 'succeeded' } });
      if (n === ids.length) return;
      if (Date.now() > deadline) throw new Error(`only ${n}/${ids.length} runs succeeded in time`);
      await new Promise((r) => setTimeout(r, 50));
    }
  };
  const latencies = (ids: number[]) => ids.map((id) => startedAt.get(id)! - createdAt.get(id)!).filter(Number.isFinite);

  /** Cancel → `cancelled` for long runs already reporting progress on an idle worker (ms each). */
  const cancelLatencies = async (): Promise<number[]> => {
    const big = (await createNetwork(deps, { organisationId: org.id, userId: user.id }, networkBody('Bench cancel', 300, randomEdges(300, 0.02, 3)), { source: 'api' })).versionId;
    const out: number[] = [];
    for (let i = 0; i < CANCELS; i++) {
      const { id } = await createRun(deps, actor, { versionId: big, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: 60 });
      for (const deadline = Date.now() + 60_000; ;) {
        const job = await deps.models.RunJob.findOne({ where: { runId: id } });
        if (job && job.get('status') === 'running' && Number(job.get('progress')) > 0) break;
        if (Date.now() > deadline) throw new Error(`run ${id} did not start reporting progress in 60 s`);
        await new Promise((r) => setTimeout(r, 50));
      }
      const t0 = performance.now();
      await cancelRun(deps, org.id, id);
      for (const deadline = Date.now() + 60_000; ;) {
        if ((await deps.models.Run.findByPk(id))!.get('status') === 'cancelled') break;
        if (Date.now() > deadline) throw new Error(`run ${id} was not cancelled within 60 s`);
        await new Promise((r) => setTimeout(r, 20));
      }
      out.push(performance.now() - t0);
    }
    return out;
  };
  let cancelMs: number[] = [];

  const rows: { workers: number; seconds: number; perMinute: number; p50: number; p95: number }[] = [];
  for (const count of [1, 2]) {
    const workers = [];
    for (let w = 0; w < count; w++) workers.push(await startWorkerChild({ WORKER_CONCURRENCY: '1' }));
    // Warm-up: each solve thread loads the engine once.
    const warm = await burst(count * 2);
    await allDone(warm.ids, 120_000);
    const { ids, t0 } = await burst(RUNS);
    await allDone(ids, 600_000);
    const seconds = (performance.now() - t0) / 1000;
    const lat = latencies(ids);
    rows.push({ workers: count, seconds, perMinute: (60 * RUNS) / seconds, p50: quantile(lat, 0.5), p95: quantile(lat, 0.95) });
    console.log(`${count} worker(s): ${RUNS} runs in ${seconds.toFixed(1)} s`);
    if (count === 1) {
      const paced = [];
      for (let i = 0; i < PACED; i++) {
        paced.push(await start(i));
        await new Promise((r) => setTimeout(r, 500));
      }
      await allDone(paced, 120_000);
      const lat = latencies(paced);
      (rows as unknown as { paced?: number[] }).paced = [quantile(lat, 0.5), quantile(lat, 0.95)];
      cancelMs = await cancelLatencies();
    }
    await Promise.all(workers.map((w) => w.kill('SIGTERM')));
  }
  const paced = (rows as unknown as { paced: number[] }).paced;
  await sub.quit();
  await closeSolveQueue(deps);
  await closeDeps(deps);

  const ratio = rows[1].perMinute / rows[0].perMinute;
  const cpu = os.cpus()[0]?.model.split(' ').slice(0, 2).join(' ') ?? 'unknown CPU';
  const stamp = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const section = [
    '## Service',
    '',
    `Written by \`npm run bench:service\` on ${stamp} UTC — ${cpu}, ${os.cpus().length} cores (shared with other work while measuring), Node ${process.version}; MariaDB and Redis of the test profile on the same machine.`,
    '',
    `Each run is one \`tabu\` job with a ${JOB_SECONDS} s limit on a ${DEPOTS}-depot network (plus the orchestrator's bound, up to 0.5 s), so a job is CPU-bound for about ${JOB_SECONDS + 0.5} s. Worker processes run one solve thread each. The burst: ${RUNS} runs created held, then released at once (releaseRun), after a warm-up run per thread; latency counts from the release.`,
    '',
    '| workers | runs | seconds | runs per minute | queue latency p50 ms | p95 ms |',
    '|---|---|---|---|---|---|',
    ...rows.map((r) => `| ${r.workers} | ${RUNS} | ${r.seconds.toFixed(1)} | ${r.perMinute.toFixed(0)} | ${r.p50.toFixed(0)} | ${r.p95.toFixed(0)} |`),
    '',
    `2 workers / 1 worker throughput ratio: **${ratio.toFixed(2)}** (same run; 2 is the ceiling on 2 cores, which the API, MariaDB and Redis share). Burst latency includes waiting behind the backlog.`,
    '',
    `Paced runs (one instant \`greedy\` job every 500 ms, 1 idle worker, ${PACED} runs): creation → job start p50 **${paced[0].toFixed(0)} ms**, p95 **${paced[1].toFixed(0)} ms** (dispatch cost alone: commit, enqueue, the worker's blocking fetch, claim).`,
    '',
    ...(cancelMs.length ? [
      `Cancel latency (${cancelMs.length} runs of 60 s \`tabu\` on 300 depots, 1 worker, cancelled once progress shows; cancelRun → run \`cancelled\`, polled every 20 ms): median: **${quantile(cancelMs, 0.5).toFixed(0)} ms**, worst ${Math.max(...cancelMs).toFixed(0)} ms (target about 1 s: the solver's cancel check, the worker's store, the status refresh).`,
      '',
    ] : []),
  ].join('\n');
  console.log('\n' + section);
  if (write) {
    const doc = fs.existsSync(DOC) ? fs.readFileSync(DOC, 'utf8') : '# Benchmarks\n';
    const re = /## Service\n[\s\S]*?(?=\n## |$)/;
    const next = re.test(doc) ? doc.replace(re, section.trimEnd() + '\n') : doc.trimEnd() + '\n\n' + section;
    fs.writeFileSync(DOC, next);
    console.log(`updated ${path.relative(process.cwd(), DOC)}`);
  }
  process.exit(0);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
