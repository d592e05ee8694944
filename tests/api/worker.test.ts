/**
 * Fault tolerance of the solve service with real worker processes on the test MariaDB and
 * Redis: a worker killed with SIGKILL mid-job (the job is recovered by another worker and its
 * result stored exactly once), an API restart with the queue entry lost (the reconciler puts it
 * back), Redis unreachable (503 for runs, reads still served), and the hard time limit of a
 * solve thread.
 */
import request from 'supertest';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import {
  applyRunsEnv, createTestApp, networkBody, orgWithTokens, randomEdges, saveNetwork, startWorkerChild, waitFor, type Edge, type TestApp, type WorkerChild,
} from './runs-support';

const SMTP_PORT = 3188;
applyRunsEnv({ smtpPort: SMTP_PORT, queue: 'worker-test', extra: { RUN_LOCK_MS: '4000' } });

let t: TestApp;
let mail: MailCatcher;
let org: Awaited<ReturnType<typeof orgWithTokens>>;
const workers: WorkerChild[] = [];

const as = (app: TestApp['app'], token: string) => ({
  get: (p: string) => request(app).get(`/api${p}`).set('Authorization', `Bearer ${token}`),
  post: (p: string, body: object = {}) => request(app).post(`/api${p}`).set('Authorization', `Bearer ${token}`).send(body),
});
const cutOf = (edges: Edge[], a: number[]) => edges.reduce((s, [u, v, w]) => s + (a[u] !== a[v] ? w : 0), 0);

async function jobRow(jobId: number) {
  return (await t.deps.models.RunJob.findByPk(jobId))!.get({ plain: true }) as { status: string; attempt: number; worker: string | null; result: string | null; startedAt: Date | null };
}

// Worker processes start slowly on a busy 2-core machine; these tests wait on real processes.
jest.setTimeout(240_000);

beforeAll(async () => {
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  t = await createTestApp();
  const { migrate } = await import('../../server/migrate');
  await migrate(t.deps.db);
  org = await orgWithTokens(t.deps, 'Worker yard', 'team');
}, 60_000);

afterAll(async () => {
  await Promise.allSettled(workers.map((w) => w.kill('SIGKILL')));
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
  await mail?.close();
});

test('a worker killed with SIGKILL mid-job: another worker takes the job over and stores its result once', async () => {
  const edges = randomEdges(200, 0.03, 41);
  const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Kill test', 200, edges));
  const first = await startWorkerChild();
  workers.push(first);
  const created = await as(t.app, org.tokens.analyst).post('/runs', { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: 4 }); // a time limit is an analyst's setting
  expect(created.status).toBe(201);
  const jobId = (await as(t.app, org.tokens.viewer).get(`/runs/${created.body.id}`)).body.jobs[0].id;
  await waitFor('the first worker to start the job', async () => {
    const row = await jobRow(jobId);
    return row.status === 'running' && row.worker?.endsWith(`#${first.pid}`);
  }, 90_000); // generous: a saturated 2-core machine can be slow to hand the job over
  await new Promise((r) => setTimeout(r, 700)); // mid-job
  process.kill(first.pid, 'SIGKILL');
  await first.kill('SIGKILL');
  expect((await jobRow(jobId)).status).toBe('running'); // nobody finished it

  const second = await startWorkerChild();
  workers.push(second);
  const run = await waitFor('the job to finish on the second worker', async () => {
    const r = await as(t.app, org.tokens.viewer).get(`/runs/${created.body.id}`);
    return r.body.status === 'succeeded' ? r.body : null;
  }, 60_000, 200);
  const row = await jobRow(jobId);
  // 2 normally; more only if the second worker's own lock lapsed on a starved machine (then the
  // attempt guard keeps the result single).
  expect(row.attempt).toBeGreaterThanOrEqual(2);
  expect(row.worker).toMatch(new RegExp(`#${second.pid}$`));
  const result = JSON.parse(row.result!);
  expect(cutOf(edges, result.assignment)).toBe(result.value);
  expect(run.jobs[0].result.value).toBe(result.value);
  // That a taken-over claim cannot write is tested through the processor in worker-claim.test.ts.
  await second.kill('SIGTERM');
});

test('an API restart with the queue entry lost loses no run: the reconciler puts it back', async () => {
  await Promise.allSettled(workers.map((w) => w.kill('SIGKILL'))); // no worker may take the entry meanwhile
  const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Restart test', 12, randomEdges(12, 0.4, 5)));
  const created = await as(t.app, org.tokens.dispatcher).post('/runs', { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }] });
  expect(created.status).toBe(201);
  const { solveQueue, queueEntryId, closeSolveQueue } = await import('../../server/services/queue');
  const jobId = (await as(t.app, org.tokens.viewer).get(`/runs/${created.body.id}`)).body.jobs[0].id;
  const entry = await solveQueue(t.deps).queue.getJob(queueEntryId(jobId, 0));
  expect(entry).toBeTruthy();
  await entry!.remove(); // as if Redis had been flushed
  expect(await solveQueue(t.deps).queue.getJob(queueEntryId(jobId, 0))).toBeUndefined();

  // "Restart": a fresh API process state (new deps), whose start hook reconciles.
  await closeSolveQueue(t.deps);
  await t.close();
  t = await createTestApp();
  const { afterStart } = await import('../../server/bootstrap');
  await afterStart(t.deps, { seedDemo: false });
  expect(await solveQueue(t.deps).queue.getJob(queueEntryId(jobId, 0))).toBeTruthy();

  const w = await startWorkerChild();
  workers.push(w);
  const run = await waitFor('the reconciled run to finish', async () => {
    const r = await as(t.app, org.tokens.viewer).get(`/runs/${created.body.id}`);
    return r.body.status === 'succeeded' ? r.body : null;
  }, 60_000, 200);
  expect(run.jobs[0].result.provenOptimal).toBe(true);
  expect(run.jobs[0].attempt).toBe(1);
  await w.kill('SIGTERM');
});

test('with Redis unreachable, starting runs answers 503 and saved runs can still be read', async () => {
  const { loadConfig } = await import('../../server/config');
  const { createDeps, closeDeps } = await import('../../server/deps');
  const { createApp } = await import('../../server/app');
  const { serverExtras } = await import('../../server/bootstrap');
  const deps = createDeps(loadConfig({ ...process.env, REDIS_URL: 'redis://127.0.0.1:1' }));
  const { app, dispose } = createApp(deps, serverExtras(deps));
  try {
    const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Redis down', 5, [[0, 1, 1], [1, 2, 1]]));
    const res = await as(app, org.tokens.dispatcher).post('/runs', { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }] });
    expect(res.status).toBe(503);
    expect(res.body.error).toMatch(/queue/);
    expect(await deps.models.Run.count({ where: { versionId: net.versionId } })).toBe(0); // nothing half-written
    const list = await as(app, org.tokens.viewer).get('/runs');
    expect(list.status).toBe(200);
    expect(list.body.length).toBeGreaterThan(0);
    expect((await as(app, org.tokens.viewer).get(`/runs/${list.body[0].id}`)).status).toBe(200);
  } finally {
    dispose();
    await closeDeps(deps);
  }
});

test('a solve thread past its hard limit is terminated and the slot starts a fresh thread', async () => {
  const { createThreadSlot } = await import('../../server/workers/thread-slot');
  const slot = createThreadSlot();
  const document = networkBody('Hard limit', 300, randomEdges(300, 0.02, 8));
  try {
    // tabu honours its own 30 s limit (it would answer 'done'); the hard limit (1.5 s here) must
    // stop it first, and the outcome says which one did — no wall time is asserted.
    const slow = slot.run({ document, problem: { kind: 'maxcut' }, solver: 'tabu', settings: {}, seed: 1, timeLimitSeconds: 30 }, { hardLimitMs: 1500, onProgress: () => {} });
    const outcome = await slow.outcome;
    expect(outcome).toMatchObject({ kind: 'killed', reason: 'timeout' });
    expect((outcome as { message: string }).message).toMatch(/time limit and grace/);
    const next = await slot.run({ document: networkBody('Tiny', 4, [[0, 1, 1], [1, 2, 1], [2, 3, 1]]), problem: { kind: 'maxcut' }, solver: 'exact', settings: {}, seed: 1, timeLimitSeconds: 5 }, { hardLimitMs: 30_000, onProgress: () => {} }).outcome;
    expect(next.kind).toBe('done');
    expect((next as { result: { value: number } }).result.value).toBe(3); // a path's max-cut is its lane count (bipartite, common practice)
  } finally {
    await slot.close();
  }
});

test('with MariaDB unreachable, the runs routes answer 503 with what to do', async () => {
  const { loadConfig } = await import('../../server/config');
  const { createDeps, closeDeps } = await import('../../server/deps');
  const { createApp } = await import('../../server/app');
  const deps = createDeps(loadConfig({ ...process.env, DB_PORT: '1' }));
  // A stand-in for the accounts middleware (it needs the database itself).
  const authenticate = (req: any, _res: unknown, next: () => void) => {
    req.auth = { userId: org.users.dispatcher.id, organisationId: org.organisationId, role: 'dispatcher', via: 'token' };
    next();
  };
  const { app, dispose } = createApp(deps, { authenticate });
  try {
    const list = await request(app).get('/api/runs');
    expect(list.status).toBe(503);
    expect(list.body.error).toMatch(/database cannot be reached/);
    expect((await request(app).get('/api/runs/1')).status).toBe(503);
  } finally {
    dispose();
    await closeDeps(deps);
  }
});

describe('held runs and priorities', () => {
  test('a run created held waits (awaiting_payment) until releaseRun; paid plans go first', async () => {
    await Promise.allSettled(workers.map((w) => w.kill('SIGKILL')));
    const { createRun, releaseRun } = await import('../../server/services/runs');
    const fleet = await orgWithTokens(t.deps, 'Fleet yard', 'fleet');
    const edges = randomEdges(10, 0.5, 77);
    const freeNet = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Queue order', 10, edges));
    const fleetNet = await saveNetwork(t.app, fleet.tokens.dispatcher, networkBody('Queue order', 10, edges));
    await t.deps.models.Organisation.update({ plan: 'free' }, { where: { id: org.organisationId } });
    try {
      const body = (versionId: number) => ({ versionId, problem: { kind: 'maxcut' as const }, solvers: [{ solver: 'exact' }], timeLimitSeconds: 5 });
      const actor = (o: typeof org) => ({ organisationId: o.organisationId, userId: o.users.analyst.id, role: 'analyst' as const });
      const held = await createRun(t.deps, actor(org), body(freeNet.versionId), { hold: true });
      expect(held.status).toBe('awaiting_payment');
      // The free run takes its full 2 s (tabu); the fleet one is instant (exact on 10 depots).
      const freeRun = await createRun(t.deps, actor(org), { ...body(freeNet.versionId), solvers: [{ solver: 'tabu' }], timeLimitSeconds: 2 });
      const fleetRun = await createRun(t.deps, actor(fleet), body(fleetNet.versionId));

      const w = await startWorkerChild();
      workers.push(w);
      const started = async (id: number) => (await t.deps.models.RunJob.findOne({ where: { runId: id } }))!.get('startedAt') as Date | null;
      const finishedAt = async (id: number) => ((await t.deps.models.Run.findByPk(id))!.get('finishedAt') as Date).getTime();
      await waitFor('both queued runs to finish', async () => {
        const rows = await t.deps.models.Run.findAll({ where: { id: [freeRun.id, fleetRun.id] } });
        return rows.every((r) => r.get('status') === 'succeeded');
      }, 60_000, 200);
      // The fleet plan's priority (1) beats the free plan's (10), though it was queued later: with one
      // slot, the instant fleet run finished while the 2 s free run was still to come.
      expect(await finishedAt(fleetRun.id)).toBeLessThan(await finishedAt(freeRun.id));
      expect((await t.deps.models.Run.findByPk(held.id))!.get('status')).toBe('awaiting_payment');
      expect(await started(held.id)).toBeNull();

      expect(await releaseRun(t.deps, held.id)).toBe(true);
      expect(await releaseRun(t.deps, held.id)).toBe(false); // only once
      await waitFor('the released run to finish', async () => (await t.deps.models.Run.findByPk(held.id))!.get('status') === 'succeeded', 60_000, 200);
      await w.kill('SIGTERM');
    } finally {
      await t.deps.models.Organisation.update({ plan: 'team' }, { where: { id: org.organisationId } });
    }
  });
});

describe('lost queue entries', () => {
  test('a release whose enqueue fails: the worker\'s periodic reconciler puts the jobs on the queue within one interval', async () => {
    await Promise.allSettled(workers.map((w) => w.kill('SIGKILL')));
    const { createRun, releaseRun } = await import('../../server/services/runs');
    const { solveQueue, queueEntryId } = await import('../../server/services/queue');
    const { Queue } = await import('bullmq');
    const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Lost entry', 10, randomEdges(10, 0.5, 13)));
    const actor = { organisationId: org.organisationId, userId: org.users.dispatcher.id, role: 'dispatcher' as const };
    // The worker is up (and has done its start-up reconcile) before the entry gets lost.
    const w = await startWorkerChild({ RUN_RECONCILE_MS: '1000' });
    workers.push(w);
    const held = await createRun(t.deps, actor, { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }] }, { hold: true });
    const jobId = (await t.deps.models.RunJob.findOne({ where: { runId: held.id } }))!.get('id') as number;
    const addBulk = jest.spyOn(Queue.prototype, 'addBulk').mockRejectedValueOnce(new Error('simulated: Redis dropped the connection'));
    try {
      await expect(releaseRun(t.deps, held.id)).rejects.toThrow(/simulated/);
    } finally {
      addBulk.mockRestore();
    }
    // Released in the database, but not on the queue.
    expect((await t.deps.models.Run.findByPk(held.id))!.get('status')).toBe('queued');
    expect(await solveQueue(t.deps).queue.getJob(queueEntryId(jobId, 0))).toBeUndefined();
    // Recovered by the periodic pass (1 s here) of the worker that was already running — no restart;
    // the 30 s allowance is the promise (RUN_RECONCILE_MS ≤ 30 s) plus this machine's slowness.
    await waitFor('the reconciled run to finish', async () => (await t.deps.models.Run.findByPk(held.id))!.get('status') === 'succeeded', 30_000, 200);
    expect(w.child.exitCode).toBeNull();
    await w.kill('SIGTERM');
  });
});
