/**
 * One large `qaoa-blocks` run spread over worker processes (`npm run bench:spread`; part of
 * `npm run bench`): the same run (a 2,000-depot network, seed 1, default settings) with 1 and
 * then 2 worker processes of one solve thread each, on the test profile's MariaDB and Redis
 * (start them first, as for bench/service.ts). Wall time from creation to the run's `succeeded`,
 * the 1-worker / 2-worker ratio measured in the same run, the machine's load average beside each
 * (the machine is shared: other work on the cores lowers the ratio), and whether both runs gave
 * the same answer (they must: same seed, same stages). Before the workers start, the same solve
 * runs stage by stage in this process (stage-profile.ts): the engine's CPU seconds per stage, the
 * serial share (plan, merges, refinement, bound, stages too small to spread) and the Amdahl bound
 * on the ratio that follows from it — so a missed ratio can be told apart from a serial share.
 * Jobs an interrupted earlier run left queued or running in the benchmark database are ended
 * first (leftover-jobs.ts), so the new workers do not solve them beside the measured run.
 *
 * Network: the graph of G33 of the G-set (Helmberg & Rendl, "A spectral bundle method for
 * semidefinite programming", SIAM J. Optim. 10(3), 2000; tests/data/gset), a 2,000-depot toroidal
 * grid, with every lane at volume 1 (networks hold no negative volumes; unlike G32's, this graph
 * is not bipartite, so the blocks are real work) — sparse like a regional distribution network,
 * so the serial merge over ~170 blocks is short and the block solves (spread) are most of it.
 *
 *   npx tsx tests/bench/spread.ts [--instance G33] [--max-iterations 150] [--rounds N] [--no-profile] [--no-write]
 * Rewrites the `## Spread` section of docs/benchmarks.md. `--no-profile` leaves out the in-process
 * stage profile (CPU seconds, so it need not share a quiet window with the wall-time runs; run it
 * on its own with stage-profile.ts).
 */
import * as fs from 'node:fs';
import * as os from 'node:os';
import * as path from 'node:path';
import { applyTestEnv } from '../support/env';
import { uniqueTag } from '../api/setup/test-app';
import { readInstance } from '../data/load';

const args = process.argv.slice(2);
const opt = (name: string): string | undefined => { const i = args.indexOf(name); return i >= 0 ? args[i + 1] : undefined; };
const INSTANCE = opt('--instance') ?? 'G33';
const MAX_ITERATIONS = Number(opt('--max-iterations') ?? 150);
/** Descent rounds, set explicitly: fixes the run's work (the same for 1 and 2 workers) and its length; default: the solver's own. */
const ROUNDS = opt('--rounds') !== undefined ? Number(opt('--rounds')) : undefined;
const write = !args.includes('--no-write');
const PROFILE = !args.includes('--no-profile');
const DOC = path.join(__dirname, '../../docs/benchmarks.md');

applyTestEnv();
const BENCH_DB = 'spinyard_bench';
Object.assign(process.env, {
  DB_NAME: BENCH_DB,
  RUN_QUEUE_NAME: `bench-spread-${uniqueTag()}`,
  RUN_MAIL_AFTER_SECONDS: '100000',
  RUN_PROGRESS_WRITE_MS: '1000',
  LOG_LEVEL: 'silent',
});

const load = () => os.loadavg().map((x) => x.toFixed(2)).join(', ');
/** CPU seconds a process has used so far, all its threads (/proc/<pid>/stat utime + stime; Linux). */
const cpuOf = (pid: number): number => {
  try {
    const fields = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100; // clock ticks: USER_HZ = 100 on Linux
  } catch {
    return NaN;
  }
};

async function main() {
  const { loadConfig } = await import('../../server/config');
  const { createDeps, closeDeps } = await import('../../server/deps');
  const { migrate } = await import('../../server/migrate');
  const { createNetwork } = await import('../../server/services/networks');
  const { createRun } = await import('../../server/services/runs');
  const { closeSolveQueue } = await import('../../server/services/queue');
  const { startWorkerChild, networkBody } = await import('../api/runs-support');
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
  const { n, edges: signed } = readInstance('gset', INSTANCE);
  // Freight volumes are never negative: the graph's lanes at volume |w| (the block solves cost the same).
  const edges = signed.map(([a, b, w]) => [a, b, Math.abs(w)] as [number, number, number]);
  const versionId = (await createNetwork(deps, { organisationId: org.id, userId: user.id }, networkBody(`Bench ${INSTANCE}`, n, edges), { source: 'api' })).versionId;
  const small = (await createNetwork(deps, { organisationId: org.id, userId: user.id }, networkBody('Bench warm-up', 200, edges.filter(([a, b]) => a < 200 && b < 200)), { source: 'api' })).versionId;
  const settings = { maxIterations: MAX_ITERATIONS, ...(ROUNDS !== undefined ? { rounds: ROUNDS } : {}) };

  // The engine's own CPU per stage (one thread, no queue), on the same problem, seed and settings.
  const { bindProblem } = await import('../../shared/engine/problem/bind');
  const { compactFromEdges } = await import('../../shared/engine/network/build');
  const { simKernelsBackend } = await import('../../server/lib/sim-wasm');
  const { profileStages } = await import('./stage-profile');
  const { loadRunsConfig } = await import('../../server/services/queue-config');
  const runsConfig = loadRunsConfig();
  const loadBeforeProfile = load();
  const profile = PROFILE ? await profileStages(bindProblem(compactFromEdges(n, edges), { kind: 'maxcut' }), 'qaoa-blocks', settings, 1, runsConfig.RUN_SPREAD_MIN_TASKS, simKernelsBackend()) : null;
  if (profile) console.log(`stage profile: serial ${profile.serialSeconds.toFixed(2)} s, spread ${profile.parallelSeconds.toFixed(2)} s CPU, Amdahl bound at 2 workers ${profile.bound(2).toFixed(2)}`);

  const finished = async (id: number, timeoutMs: number) => {
    for (const deadline = Date.now() + timeoutMs; ;) {
      const status = (await deps.models.Run.findByPk(id))!.get('status');
      if (status === 'succeeded') return;
      if (status === 'failed' || status === 'cancelled') throw new Error(`run ${id} ended ${status}`);
      if (Date.now() > deadline) throw new Error(`run ${id} did not finish in ${timeoutMs / 1000} s`);
      await new Promise((r) => setTimeout(r, 200));
    }
  };
  const resultOf = async (id: number) => JSON.parse(String((await deps.models.RunJob.findOne({ where: { runId: id } }))!.get('result'))) as { value: number; assignment: number[]; spread?: { stages: number; batches: number; workers: Record<string, number> } };

  const rows: { workers: number; seconds: number; cpu: number; value: number; stages: number; batches: number; answeredBy: number[]; loadBefore: string; loadAfter: string; assignment: number[] }[] = [];
  // Workers in sessions of their own outlive this process unless stopped: stop them on any exit.
  const started: { pid: number; child: { pid?: number } }[] = []; // running now (emptied once stopped)
  process.on('exit', () => {
    for (const w of started) for (const pid of [w.pid, w.child.pid]) {
      try { if (pid) process.kill(pid, 'SIGKILL'); } catch { /* already gone */ }
    }
  });
  for (const count of [1, 2]) {
    const workers = [];
    // Each worker in a session of its own, as separately started worker services are: on a busy
    // machine Linux divides the cores between sessions first (autogroup), so workers sharing this
    // process's session would together get one session's share, 1 or 2 of them alike.
    for (let i = 0; i < count; i++) {
      const worker = await startWorkerChild({ WORKER_CONCURRENCY: '1' }, { ownSession: true });
      workers.push(worker);
      started.push(worker);
    }
    // Warm-up: every worker's solve thread loads the engine once (a 200-depot spread run).
    const warm = await createRun(deps, actor, { versionId: small, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa-blocks', settings: { maxIterations: 20 } }], timeLimitSeconds: 600, seed: 2 });
    await finished(warm.id, 600_000);
    const loadBefore = load();
    const cpu0 = workers.map((w) => cpuOf(w.pid));
    const t0 = performance.now();
    const run = await createRun(deps, actor, { versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa-blocks', settings }], timeLimitSeconds: 3600, seed: 1 });
    await finished(run.id, 3_600_000);
    const seconds = (performance.now() - t0) / 1000;
    const cpu = workers.reduce((sum, w, i) => sum + cpuOf(w.pid) - cpu0[i], 0);
    const r = await resultOf(run.id);
    rows.push({ workers: count, seconds, cpu, value: r.value, stages: r.spread?.stages ?? 0, batches: r.spread?.batches ?? 0, answeredBy: Object.values(r.spread?.workers ?? {}), loadBefore, loadAfter: load(), assignment: r.assignment });
    console.log(`${count} worker(s): ${seconds.toFixed(1)} s, workers' CPU ${cpu.toFixed(1)} s, cut ${r.value}, load ${load()}`);
    await Promise.all(workers.map((w) => w.kill('SIGTERM')));
    started.length = 0; // stopped and waited for: their pids are no longer ours
  }
  await closeSolveQueue(deps);
  await closeDeps(deps);

  const ratio = rows[0].seconds / rows[1].seconds;
  const same = rows[0].assignment.length === rows[1].assignment.length && rows[0].assignment.every((x, i) => x === rows[1].assignment[i]);
  const cpu = os.cpus()[0]?.model.split(' ').slice(0, 2).join(' ') ?? 'unknown CPU';
  const stamp = new Date().toISOString().slice(0, 16).replace('T', ' ');
  const section = [
    '## Spread',
    '',
    `Written by \`npm run bench:spread\` on ${stamp} UTC — ${cpu}, ${os.cpus().length} cores, Node ${process.version}; MariaDB, Redis and this process on the same machine. **The machine is shared with other engineers' work while measuring**: the load averages (1, 5, 15 min) beside each row show how busy it was; on a loaded 2-core machine the ratio is lower than on an idle one.`,
    '',
    `One \`qaoa-blocks\` run on the graph of ${INSTANCE} (${n} depots, ${edges.length} lanes, all at volume 1; Helmberg & Rendl 2000), seed 1, default settings except maxIterations ${MAX_ITERATIONS}${ROUNDS !== undefined ? ` and rounds ${ROUNDS}` : ''}, time limit 3600 s (never reached), with 1 and then 2 worker processes of one solve thread each, each worker in a session of its own like a separately started worker service (Linux's autogroup scheduling shares a busy machine's cores between sessions first; workers in the benchmark's own session would get one session's share together) (stages of ≥ ${runsConfig.RUN_SPREAD_MIN_TASKS} blocks spread as up to ${runsConfig.RUN_SPREAD_CHILDREN} child entries each, as this process's environment sets them for the workers; server/workers/spread-job.ts). Wall time from creation to \`succeeded\`.`,
    '',
    '| workers | seconds | workers\' CPU s | cores used (CPU / wall) | cut | stages | child batches | batches answered per worker | load before | load after |',
    '|---|---|---|---|---|---|---|---|---|---|',
    ...rows.map((r) => `| ${r.workers} | ${r.seconds.toFixed(1)} | ${r.cpu.toFixed(1)} | ${(r.cpu / r.seconds).toFixed(2)} | ${r.value} | ${r.stages} | ${r.batches} | ${r.answeredBy.join(' + ')} | ${r.loadBefore} | ${r.loadAfter} |`),
    '',
    `1-worker / 2-worker wall-time ratio: **${ratio.toFixed(2)}** (target ≥ 1.6 on 2 cores; same run). Same answer with 1 and 2 workers: **${same ? 'yes' : 'NO'}**. "Cores used" is the worker processes' CPU time over the wall time: on idle cores one worker uses up to 1 and two up to 2; under other work each gets a share of the cores, so the wall-time ratio then says as much about the load as about the spread.`,
    '',
    ...(profile ? [
      `Where the engine's CPU time goes (the same solve stage by stage in the benchmark's own process before the workers start, one thread, no queue; load before it ${loadBeforeProfile}; cut ${profile.value}${profile.value === rows[0].value ? ', the same as the workers\' runs' : `, NOT the workers' ${rows[0].value}`}). "Spread" stages go to the queue as children; everything else runs in the job's own thread, one worker at a time:`,
      '',
      '| stage | tasks | where the tasks run | tasks CPU s | then in the job\'s thread (merge, next plan, refinement, bound) CPU s |',
      '|---|---|---|---|---|',
      `| plan | – | – | – | ${profile.planSeconds.toFixed(2)} |`,
      ...profile.stages.map((st) => `| ${st.label} | ${st.tasks} | ${st.spread ? 'spread over the workers' : "the job's thread"} | ${st.taskSeconds.toFixed(2)} | ${st.resumeSeconds.toFixed(2)} |`),
      '',
      `Serial ${profile.serialSeconds.toFixed(2)} s of ${(profile.serialSeconds + profile.parallelSeconds).toFixed(2)} s CPU (${((100 * profile.serialSeconds) / (profile.serialSeconds + profile.parallelSeconds)).toFixed(1)} %): Amdahl's bound on the 2-worker ratio **${profile.bound(2).toFixed(2)}** (before queue traffic, stage tails and other work on the cores).`,
      '',
    ] : ['Stage profile not run here (`--no-profile`; tests/bench/stage-profile.ts gives it).', '']),
  ].join('\n');
  console.log('\n' + section);
  if (write) {
    const doc = fs.existsSync(DOC) ? fs.readFileSync(DOC, 'utf8') : '# Benchmarks\n';
    const re = /## Spread\n[\s\S]*?(?=\n## |$)/;
    const next = re.test(doc) ? doc.replace(re, section.trimEnd() + '\n') : doc.trimEnd() + '\n\n' + section;
    fs.writeFileSync(DOC, next);
    console.log(`updated ${path.relative(process.cwd(), DOC)}`);
  }
  process.exit(same ? 0 : 1);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
