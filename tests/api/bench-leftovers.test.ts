/**
 * The benchmarks that start workers (tests/bench/spread.ts, service.ts) first end the jobs an
 * interrupted earlier run left queued or running (tests/bench/leftover-jobs.ts): otherwise the new
 * workers' start-up reconcile (server/services/queue.ts) puts them on the new queue and solves
 * them beside the measured run. On a database of this file's own (the helper ends every such job
 * of its database), with the real MariaDB and Redis.
 */
import { applyRunsEnv, networkBody, randomEdges } from './runs-support';

const DB_NAME = 'spinyard_bench_leftovers_test';
// No mail is sent here (mail only after 100,000 s); the port is one no other suite uses.
applyRunsEnv({ smtpPort: 3196, queue: 'bench-leftovers', extra: { DB_NAME, RUN_MAIL_AFTER_SECONDS: '100000' } });

jest.setTimeout(120_000);

test('jobs left queued or running are ended as cancelled, their runs follow, the reconcile then re-enqueues nothing', async () => {
  const { loadConfig } = await import('../../server/config');
  const { createDatabase } = await import('../../server/db');
  const admin = createDatabase({ ...loadConfig(), DB_NAME: 'mysql' });
  await admin.query(`DROP DATABASE IF EXISTS \`${DB_NAME}\``);
  await admin.query(`CREATE DATABASE \`${DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.close();
  const { createDeps, closeDeps } = await import('../../server/deps');
  const { billingRunHooks } = await import('../../server/services/billing-run-hooks');
  const { migrate } = await import('../../server/migrate');
  const { createNetwork } = await import('../../server/services/networks');
  const { createRun } = await import('../../server/services/runs');
  const { closeSolveQueue, queueEntryId, reconcileQueue, solveQueue } = await import('../../server/services/queue');
  const { refreshRunStatus } = await import('../../server/services/runs-status');
  const { describeLeftovers, endLeftoverJobs, LEFTOVER_ERROR } = await import('../bench/leftover-jobs');
  const deps = createDeps(loadConfig(), { runHooks: billingRunHooks });
  try {
    await migrate(deps.db);
    const { Organisation, User, Run, RunJob } = deps.models;
    const org = await Organisation.create({ name: 'Leftover yard', plan: 'fleet' });
    const user = await User.create({ email: 'leftover@bench.example', name: 'Bench', passwordHash: 'x'.repeat(60) });
    const actor = { organisationId: org.id, userId: user.id, role: 'analyst' as const };
    const { versionId } = await createNetwork(deps, { organisationId: org.id, userId: user.id }, networkBody('Leftover', 12, randomEdges(12, 0.4, 3)), { source: 'api' });

    // The interrupted run: one job taken by a worker that is gone, one still queued; a third job
    // (another run) had failed before and must stay as it is.
    const interrupted = await createRun(deps, actor, { versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }, { solver: 'greedy' }], timeLimitSeconds: 60, seed: 1 });
    const other = await createRun(deps, actor, { versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }], timeLimitSeconds: 60, seed: 1 });
    const [running, queued] = (await RunJob.findAll({ where: { runId: interrupted.id }, order: [['position', 'ASC']] })).map((j) => j.get('id') as number);
    const failed = (await RunJob.findOne({ where: { runId: other.id } }))!.get('id') as number;
    await RunJob.update({ status: 'running', attempt: 1, startedAt: new Date(), worker: 'gone' }, { where: { id: running } });
    await RunJob.update({ status: 'failed', finishedAt: new Date(), error: 'an earlier fault' }, { where: { id: failed } });
    await refreshRunStatus(deps, interrupted.id);
    await refreshRunStatus(deps, other.id);
    expect((await Run.findByPk(interrupted.id))!.get('status')).toBe('running');
    // The next benchmark run has a queue of its own: the leftovers' entries are not on it.
    for (const id of [running, queued, failed]) await (await solveQueue(deps).queue.getJob(queueEntryId(id, 0)))?.remove();

    const ended = await endLeftoverJobs(deps);
    expect(ended.map((j) => [j.id, j.status])).toEqual([[running, 'running'], [queued, 'queued']]);
    const line = describeLeftovers(DB_NAME, ended);
    expect(line).toContain(`job ${running} (run ${interrupted.id}, tabu, running since`);
    expect(line).toContain(`job ${queued} (run ${interrupted.id}, greedy, queued)`);
    const rows = await RunJob.findAll({ where: { id: [running, queued, failed] }, order: [['id', 'ASC']] });
    expect(rows.map((r) => [r.get('status'), r.get('error')])).toEqual([['cancelled', LEFTOVER_ERROR], ['cancelled', LEFTOVER_ERROR], ['failed', 'an earlier fault']]);
    expect((await Run.findByPk(interrupted.id))!.get('status')).toBe('cancelled');
    // What a worker does first when it starts: nothing of the interrupted run goes back on the queue.
    expect(await reconcileQueue(deps)).toBe(0);
    expect(describeLeftovers(DB_NAME, await endLeftoverJobs(deps))).toBe(`${DB_NAME}: no jobs left queued or running by an earlier run`);
  } finally {
    await closeSolveQueue(deps);
    await closeDeps(deps);
  }
});
