/**
 * The solve service end to end: the real API (supertest) on the test MariaDB and Redis, a real
 * worker process (`tsx server/worker.ts`), and the SMTP fake. Values are checked against
 * textbook facts (Petersen graph max-cut 12, common practice) and an independent recomputation
 * of every cut from the stored assignment.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import {
  applyRunsEnv, createTestApp, networkBody, orgWithTokens, petersenEdges, randomEdges, saveNetwork, startWorkerChild, waitFor, type Edge, type TestApp, type WorkerChild,
} from './runs-support';

const SMTP_PORT = 3189; // this file's own SMTP fake (ports 3180–3189 belong to the solve-service suites)
const SSE_PORT = 3180;
applyRunsEnv({ smtpPort: SMTP_PORT, queue: 'runs-test' });

let t: TestApp;
let worker: WorkerChild;
let mail: MailCatcher;
let org: Awaited<ReturnType<typeof orgWithTokens>>;
let other: Awaited<ReturnType<typeof orgWithTokens>>;
let petersen: { id: number; versionId: number };
let big: { id: number; versionId: number };
let bigEdges: Edge[];

const as = (token: string) => ({
  get: (p: string) => request(t.app).get(`/api${p}`).set('Authorization', `Bearer ${token}`),
  post: (p: string, body: object = {}) => request(t.app).post(`/api${p}`).set('Authorization', `Bearer ${token}`).send(body),
  delete: (p: string) => request(t.app).delete(`/api${p}`).set('Authorization', `Bearer ${token}`),
});

/** Cut weight of an assignment, recomputed here from the lanes (independent of the engine). */
const cutOf = (edges: Edge[], a: number[]) => edges.reduce((s, [u, v, w]) => s + (a[u] !== a[v] ? w : 0), 0);

async function finished(token: string, id: number, timeoutMs = 60_000) {
  return waitFor(`run ${id} to finish`, async () => {
    const r = await as(token).get(`/runs/${id}`);
    return ['succeeded', 'partial', 'failed', 'cancelled'].includes(r.body.status) ? r.body : null;
  }, timeoutMs, 150);
}

beforeAll(async () => {
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  t = await createTestApp();
  const { migrate } = await import('../../server/migrate');
  await migrate(t.deps.db);
  org = await orgWithTokens(t.deps, 'Runs', 'team');
  other = await orgWithTokens(t.deps, 'Elsewhere', 'team');
  petersen = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Petersen yards', 10, petersenEdges()));
  bigEdges = randomEdges(60, 0.1, 7);
  big = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Sixty depots', 60, bigEdges));
  worker = await startWorkerChild({ WORKER_CONCURRENCY: '2' });
}, 120_000);

afterAll(async () => {
  await worker?.kill('SIGTERM');
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
  await mail?.close();
});

describe('a run from creation to stored result', () => {
  test('exact on the Petersen graph: queued → running → succeeded with cut 12, proven optimal; e-mail with the link', async () => {
    const created = await as(org.tokens.analyst).post('/runs', { versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }, { solver: 'tabu' }], timeLimitSeconds: 2 });
    expect(created.status).toBe(201);
    const run = await finished(org.tokens.viewer, created.body.id);
    expect(run.status).toBe('succeeded');
    expect(run.versionId).toBe(petersen.versionId);
    expect(run.networkName).toBe('Petersen yards');
    for (const job of run.jobs) {
      expect(job.status).toBe('succeeded');
      expect(job.progress).toBe(1);
      expect(job.attempt).toBe(1);
      expect(job.result.value).toBe(12); // Petersen graph max-cut (common practice)
      expect(cutOf(petersenEdges(), job.result.assignment)).toBe(12);
      expect(job.result.bound).toBeGreaterThanOrEqual(12);
    }
    expect(run.jobs[0].result.provenOptimal).toBe(true);
    const message = await mail.waitFor((m) => m.subject.includes(`#${run.id}`), 15_000);
    expect(message.to).toContain(org.users.analyst.email); // the one who started the run
    expect(message.text).toContain(`/runs/${run.id}`);
    expect(message.text).toMatch(/exact: succeeded, value 12/);
  });

  test('progress is observed live over Server-Sent Events and kept as a convergence trace', async () => {
    const server = http.createServer(t.app).listen(SSE_PORT, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    try {
      const created = await as(org.tokens.analyst).post('/runs', {
        versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa', settings: { layers: 3, shots: 256, maxIterations: 4000, restarts: 4 } }], timeLimitSeconds: 4,
      });
      expect(created.status).toBe(201);
      const events: { event: string; data: any }[] = [];
      await new Promise<void>((resolve, reject) => {
        const req = http.get({ host: '127.0.0.1', port: (server.address() as AddressInfo).port, path: `/api/runs/${created.body.id}/events`, headers: { Authorization: `Bearer ${org.tokens.viewer}` } }, (res) => {
          expect(res.statusCode).toBe(200);
          expect(res.headers['content-type']).toMatch(/text\/event-stream/);
          let buffer = '';
          res.on('data', (chunk) => {
            buffer += chunk;
            let cut;
            while ((cut = buffer.indexOf('\n\n')) >= 0) {
              const block = buffer.slice(0, cut);
              buffer = buffer.slice(cut + 2);
              const event = /^event: (.*)$/m.exec(block)?.[1];
              const data = /^data: (.*)$/m.exec(block)?.[1];
              if (event && data) events.push({ event, data: JSON.parse(data) });
            }
          });
          res.on('end', () => resolve());
        });
        req.on('error', reject);
        setTimeout(() => reject(new Error(`no end event within 40 s; got ${events.map((e) => e.event).join(',')}`)), 40_000);
      });
      expect(events[0].event).toBe('snapshot');
      const progress = events.filter((e) => e.event === 'progress');
      expect(progress.length).toBeGreaterThan(2);
      expect(progress.some((p) => typeof p.data.live.energy === 'number' && typeof p.data.live.stdError === 'number')).toBe(true);
      expect(progress.every((p) => p.data.progress >= 0 && p.data.progress <= 1)).toBe(true);
      const end = events[events.length - 1];
      expect(end.event).toBe('end');
      expect(end.data.status).toBe('succeeded');
      const job = end.data.run.jobs[0];
      expect(job.result.trace.length).toBeGreaterThan(2);
      expect(cutOf(petersenEdges(), job.result.assignment)).toBe(job.result.value);
      expect(job.result.value).toBeLessThanOrEqual(12);
    } finally {
      await new Promise((r) => server.close(r));
    }
  });
});

describe('cancel and retry', () => {
  test('cancel stops a running job and keeps its best answer; retry runs it again (cancel latency: npm run bench:service)', async () => {
    const edges = randomEdges(300, 0.02, 3);
    const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Three hundred', 300, edges));
    const created = await as(org.tokens.analyst).post('/runs', { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: 60 });
    expect(created.status).toBe(201);
    const id = created.body.id;
    await waitFor('the job to run', async () => (await as(org.tokens.viewer).get(`/runs/${id}`)).body.jobs[0].status === 'running', 30_000);
    // Polling sees the throttled progress writes on the job row (every 200 ms in tests).
    const polled = await waitFor('progress on the job row', async () => {
      const job = (await as(org.tokens.viewer).get(`/runs/${id}`)).body.jobs[0];
      return job.progress > 0 && job.live ? job : null;
    }, 10_000);
    expect(polled.progress).toBeLessThan(1);
    expect(typeof polled.live.bestValue).toBe('number');
    const cancel = await as(org.tokens.dispatcher).post(`/runs/${id}/cancel`);
    expect(cancel.status).toBe(200);
    // The 60 s limit is far beyond this wait: only the cancel can end the job in time.
    const run = await finished(org.tokens.viewer, id, 20_000);
    expect(run.status).toBe('cancelled');
    const job = run.jobs[0];
    expect(job.status).toBe('cancelled');
    if (job.result) expect(cutOf(edges, job.result.assignment)).toBe(job.result.value);

    const again = await as(org.tokens.dispatcher).post(`/runs/${id}/retry`);
    expect(again.status).toBe(200);
    expect(['queued', 'running']).toContain(again.body.jobs[0].status); // a free worker may claim it at once
    await waitFor('the retried job to run', async () => (await as(org.tokens.viewer).get(`/runs/${id}`)).body.jobs[0].status === 'running', 30_000);
    await as(org.tokens.dispatcher).post(`/runs/${id}/cancel`).expect(200);
    const second = await finished(org.tokens.viewer, id, 10_000);
    expect(second.status).toBe('cancelled');
    expect(second.jobs[0].attempt).toBe(2);
    expect((await as(org.tokens.dispatcher).post(`/runs/${id}/cancel`)).status).toBe(409);
  });

  test('a queued job is cancelled at once and never runs', async () => {
    const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Queued only', 200, randomEdges(200, 0.03, 9)));
    // Three 20 s jobs on a worker with two slots: the third is still queued when the cancel comes.
    const created = await as(org.tokens.analyst).post('/runs', { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }, { solver: 'anneal' }, { solver: 'tabu' }], timeLimitSeconds: 20 });
    expect(created.status).toBe(201);
    const cancelled = await as(org.tokens.dispatcher).post(`/runs/${created.body.id}/cancel`);
    expect(cancelled.status).toBe(200);
    const run = await finished(org.tokens.viewer, created.body.id, 10_000);
    expect(run.status).toBe('cancelled');
    expect(run.jobs.every((j: any) => j.status === 'cancelled')).toBe(true);
    expect(run.jobs[2]).toMatchObject({ startedAt: null, attempt: 0, result: null });
    await new Promise((r) => setTimeout(r, 500));
    expect((await as(org.tokens.viewer).get(`/runs/${created.body.id}`)).body.jobs[2].attempt).toBe(0);
  });
});

test('20 concurrent runs all complete, each with a correct cut', async () => {
  const graphs = Array.from({ length: 20 }, (_, i) => randomEdges(12, 0.4, 100 + i));
  const nets = await Promise.all(graphs.map((g, i) => saveNetwork(t.app, org.tokens.dispatcher, networkBody(`Small ${i}`, 12, g))));
  const created = await Promise.all(nets.map((n) => as(org.tokens.analyst).post('/runs', { versionId: n.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }], timeLimitSeconds: 5 })));
  expect(created.map((c) => c.status)).toEqual(new Array(20).fill(201));
  const runs = await Promise.all(created.map((c) => finished(org.tokens.viewer, c.body.id, 120_000)));
  runs.forEach((run, i) => {
    expect(run.status).toBe('succeeded');
    const r = run.jobs[0].result;
    expect(r.provenOptimal).toBe(true);
    expect(cutOf(graphs[i], r.assignment)).toBe(r.value);
  });
  const listed = await as(org.tokens.viewer).get('/runs?status=succeeded&limit=200');
  const ids = new Set(listed.body.map((r: any) => r.id));
  expect(runs.every((r) => ids.has(r.id))).toBe(true);
});

test('decomposition (qaoa-blocks) on a 60-depot seeded random graph G(60, 0.1) is within 5 % of the classical best', async () => {
  const created = await as(org.tokens.analyst).post('/runs', { versionId: big.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa-blocks' }, { solver: 'tabu' }], timeLimitSeconds: 20 });
  expect(created.status).toBe(201);
  const run = await finished(org.tokens.viewer, created.body.id, 120_000);
  const [blocks, tabu] = run.jobs;
  expect(blocks.family).toBe('variational');
  expect(blocks.result.assignment).toHaveLength(60);
  expect(cutOf(bigEdges, blocks.result.assignment)).toBe(blocks.result.value);
  expect(blocks.result.value).toBeGreaterThanOrEqual(0.95 * tabu.result.value);
  expect(blocks.result.value).toBeLessThanOrEqual(blocks.result.bound);
});

describe('who may do what', () => {
  const body = () => ({ versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }] });

  test('a viewer cannot start or cancel runs; another organisation cannot see them', async () => {
    const viewer = await as(org.tokens.viewer).post('/runs', body());
    expect(viewer.status).toBe(403);
    expect(viewer.body.error).toContain('runs:start');
    const mine = await as(org.tokens.dispatcher).post('/runs', body());
    expect(mine.status).toBe(201);
    expect((await as(other.tokens.owner).get(`/runs/${mine.body.id}`)).status).toBe(404);
    expect((await as(other.tokens.owner).get(`/runs/${mine.body.id}/report.json`)).status).toBe(404);
    expect((await as(other.tokens.owner).post(`/runs/${mine.body.id}/cancel`)).status).toBe(404);
    expect((await as(other.tokens.owner).get('/runs')).body.map((r: any) => r.id)).not.toContain(mine.body.id);
    // …nor start a run on this organisation's network version.
    expect((await as(other.tokens.owner).post('/runs', body())).status).toBe(404);
    expect((await as(org.tokens.viewer).post(`/runs/${mine.body.id}/cancel`)).status).toBe(403);
  });

  test('dispatchers use default settings only; analysts may change them; bad settings name the field', async () => {
    const custom = { ...body(), solvers: [{ solver: 'tabu', settings: { stagnation: 777 } }] };
    const dispatcher = await as(org.tokens.dispatcher).post('/runs', custom);
    expect(dispatcher.status).toBe(403);
    expect(dispatcher.body.error).toMatch(/default solver settings/);
    const analyst = await as(org.tokens.analyst).post('/runs', custom);
    expect(analyst.status).toBe(201);
    const sameAsDefaults = await as(org.tokens.dispatcher).post('/runs', { ...body(), solvers: [{ solver: 'qaoa', settings: { layers: 2 } }] });
    expect(sameAsDefaults.status).toBe(201); // equal to parseSettings({}) counts as default
    const bad = await as(org.tokens.analyst).post('/runs', { ...body(), solvers: [{ solver: 'qaoa', settings: { layers: 99 } }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.fields)).toContain('solvers.0.settings.layers');
    const unknown = await as(org.tokens.analyst).post('/runs', { ...body(), solvers: [{ solver: 'no-such-solver' }] });
    expect(unknown.status).toBe(400);
    expect(unknown.body.fields['solvers.0.solver'][0]).toMatch(/unknown solver/);
    const refused = await as(org.tokens.analyst).post('/runs', { ...body(), problem: { kind: 'kway', k: 3 }, solvers: [{ solver: 'qaoa-blocks' }] });
    expect(refused.status).toBe(400);
  });

  test('seed and time limit need the analysts\' permission: a dispatcher gets a 403 that says so', async () => {
    for (const extra of [{ seed: 7 }, { timeLimitSeconds: 5 }]) {
      const dispatcher = await as(org.tokens.dispatcher).post('/runs', { ...body(), ...extra });
      expect(dispatcher.status).toBe(403);
      expect(dispatcher.body.error).toMatch(/reserved for analysts and admins \(runs:advanced\)/);
      expect(dispatcher.body.error).toMatch('seed' in extra ? /fixed seed/ : /time limit/);
      const preview = await as(org.tokens.dispatcher).post('/runs/preview', { ...body(), ...extra });
      expect(preview.status).toBe(200);
      expect(preview.body.startable).toBe(false); // the app's Start stays disabled with the same reason
      expect(preview.body.forbidden).toMatch(/runs:advanced/);
      expect((await as(org.tokens.analyst).post('/runs', { ...body(), ...extra })).status).toBe(201);
    }
  });

  test('over the included size a run is priced and held (billing); beyond the paid ceiling 402 with what to do', async () => {
    const free = await orgWithTokens(t.deps, 'Free yard', 'free');
    const mid = await saveNetwork(t.app, free.tokens.dispatcher, networkBody('Twenty', 20, randomEdges(20, 0.3, 5)));
    // 20 qubits > the free plan's 16 included: a paid run (docs/billing.md), created awaiting payment.
    const paid = await as(free.tokens.dispatcher).post('/runs', { versionId: mid.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa' }] });
    expect(paid.status).toBe(201);
    expect(paid.body).toMatchObject({ status: 'awaiting_payment', price: { currency: 'eur' } });
    expect(Number.isInteger(paid.body.price.amount) && paid.body.price.amount > 0).toBe(true);
    const big = await saveNetwork(t.app, free.tokens.dispatcher, networkBody('Twenty-three', 23, randomEdges(23, 0.3, 5)));
    const qubits = await as(free.tokens.dispatcher).post('/runs', { versionId: big.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa' }] });
    expect(qubits.status).toBe(402); // 23 qubits: beyond what a free organisation may buy (the Team plan's 22)
    expect(qubits.body).toMatchObject({ code: 'plan_limit', limit: 'qubits' });
    expect(qubits.body.error).toMatch(/Upgrade to the Fleet plan/);
    const blocks = await as(free.tokens.dispatcher).post('/runs', { versionId: mid.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa-blocks' }] });
    expect(blocks.status).toBe(201); // 14-qubit blocks fit the free plan
    expect(blocks.body.price).toBeNull();
    const time = await as(free.tokens.analyst).post('/runs', { versionId: mid.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }], timeLimitSeconds: 900 });
    expect(time.status).toBe(402);
    expect(time.body.limit).toBe('seconds');
  });
});

describe('k regions with the default solvers on the 12-depot demo network (Team plan)', () => {
  // The reproduction: the setup screen proposed QAOA and VQE, quoted €322,122,548.40 from the
  // one-hot count, kept Start enabled, and the API then refused ("qaoa would simulate 52 qubits").
  test('defaults, preview and create agree: the circuits are sized by their first split, free, and the run starts', async () => {
    const { DEMO_NETWORKS } = await import('../../server/services/demo-networks');
    const demo = DEMO_NETWORKS.find((d) => d.key === 'quillmere-core')!;
    const net = await saveNetwork(t.app, org.tokens.dispatcher, { name: 'Quillmere core copy', depots: demo.document.depots, lanes: demo.document.lanes } as never);
    const problem = { kind: 'kway', k: 3, tolerance: 0.05 };
    const defaults = await as(org.tokens.dispatcher).post('/solvers/defaults', { versionId: net.versionId, problem });
    expect(defaults.status).toBe(200);
    expect(defaults.body.defaults).toEqual(expect.arrayContaining(['qaoa', 'vqe']));
    const body = { versionId: net.versionId, problem, solvers: defaults.body.defaults.map((solver: string) => ({ solver })) };
    const preview = await as(org.tokens.dispatcher).post('/runs/preview', body);
    expect(preview.status).toBe(200);
    const qaoa = preview.body.solvers.find((s: { solver: string }) => s.solver === 'qaoa');
    expect(qaoa.qubits).toBeGreaterThanOrEqual(12);
    expect(qaoa.qubits).toBeLessThanOrEqual(17); // 12 depot qubits + at most 5 slack, not 12·3 + slack
    expect(preview.body.circuit).toMatch(/first bisection/);
    expect(preview.body.encoding.qubits).toBe(qaoa.qubits); // the summary describes the circuit that runs
    expect(preview.body.price).toBeNull(); // within the Team plan's 22 included qubits
    expect(preview.body.startable).toBe(true);
    const created = await as(org.tokens.dispatcher).post('/runs', body);
    expect(created.status).toBe(201);
    expect(created.body.price).toBeNull();
    await as(org.tokens.dispatcher).post(`/runs/${created.body.id}/cancel`); // no need to solve it here
  });

  test('circuit resources before launch: the preview counts what the finished QAOA and VQE jobs report', async () => {
    const { RunPreviewSchema } = await import('../../shared/schemas/run-view');
    const body = {
      versionId: petersen.versionId, problem: { kind: 'maxcut' }, seed: 5, timeLimitSeconds: 5,
      solvers: [{ solver: 'qaoa', settings: { layers: 2, warmStart: true, maxIterations: 5, restarts: 1 } }, { solver: 'vqe', settings: { layers: 1, maxIterations: 5, restarts: 1 } }, { solver: 'greedy' }],
    };
    const preview = await as(org.tokens.analyst).post('/runs/preview', body);
    expect(preview.status).toBe(200);
    expect(() => RunPreviewSchema.parse(preview.body)).not.toThrow(); // the OpenAPI document's shape
    const [qaoa, vqe, greedy] = preview.body.solvers;
    expect(qaoa.circuit.qubits).toBe(10);
    expect(Object.keys(qaoa.circuit.layouts).sort()).toEqual(['all', 'grid', 'line']);
    expect(greedy.circuit).toBeNull();
    const created = await as(org.tokens.analyst).post('/runs', body);
    expect(created.status).toBe(201);
    const run = await finished(org.tokens.viewer, created.body.id);
    const job = (name: string) => run.jobs.find((j: { solver: string }) => j.solver === name);
    expect(job('qaoa').result.circuit).toEqual(qaoa.circuit);
    expect(job('vqe').result.circuit).toEqual(vqe.circuit);
  });

  test('a size beyond the paid ceiling gets a refusal before launch, never a price', async () => {
    const big = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Twenty-six', 26, randomEdges(26, 0.3, 9)));
    // The solver itself would take 26 qubits (maxQubits 26, an analyst's setting); the plan would not.
    const body = { versionId: big.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa', settings: { maxQubits: 26 } }] };
    const preview = await as(org.tokens.analyst).post('/runs/preview', body); // 26 qubits > the Fleet plan's 24
    expect(preview.body.price).toBeNull();
    expect(preview.body.quote.refusal).toMatch(/qaoa would simulate 26 qubits/);
    expect(preview.body.startable).toBe(false);
    expect(preview.body.blockers.join(' ')).toMatch(/26 qubits/);
    expect(Number.isFinite(preview.body.quote.ceiling.amount)).toBe(true);
    const created = await as(org.tokens.analyst).post('/runs', body);
    expect(created.status).toBe(402);
    expect(created.body).toMatchObject({ code: 'plan_limit', limit: 'qubits' });
  });
});

describe('downloads, preview, list, delete', () => {
  test('CSV and JSON report of a finished run; preview writes nothing', async () => {
    const created = await as(org.tokens.dispatcher).post('/runs', { versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }] });
    const run = await finished(org.tokens.viewer, created.body.id);
    const csv = await as(org.tokens.viewer).get(`/runs/${run.id}/assignment.csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const rows = csv.text.trim().split(/\r\n/);
    expect(rows[0]).toBe('depot_id,depot_name,side');
    expect(rows).toHaveLength(11);
    const sides = rows.slice(1).map((r) => Number(r.split(',')[2]));
    expect(rows[1].startsWith('d1,Depot 1,')).toBe(true);
    expect(cutOf(petersenEdges(), sides)).toBe(12);
    const report = await as(org.tokens.viewer).get(`/runs/${run.id}/report.json`);
    expect(report.status).toBe(200);
    expect(report.body.best).toMatchObject({ solver: 'exact', value: 12 });
    expect(report.body.network.depots).toHaveLength(10);

    const before = await t.deps.models.Run.count();
    const preview = await as(org.tokens.viewer).post('/runs/preview', { versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa' }, { solver: 'exact' }] });
    expect(preview.status).toBe(200);
    expect(preview.body.encoding).toMatchObject({ qubits: 10, pauliTerms: 15, commutingGroups: 1 });
    expect(preview.body.solvers.map((s: any) => s.solver)).toEqual(['qaoa', 'exact']);
    expect(preview.body.solvers[0].qubits).toBe(10);
    expect(await t.deps.models.Run.count()).toBe(before);

    const byNetwork = await as(org.tokens.viewer).get(`/runs?networkId=${petersen.id}`);
    expect(byNetwork.body.every((r: any) => r.networkId === petersen.id)).toBe(true);
    expect((await as(org.tokens.dispatcher).delete(`/runs/${run.id}`)).status).toBe(204);
    expect((await as(org.tokens.viewer).get(`/runs/${run.id}`)).status).toBe(404);
  });

  test('a run keeps using its own version after the network changes', async () => {
    const n = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Changing', 10, petersenEdges()));
    const created = await as(org.tokens.dispatcher).post('/runs', { versionId: n.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }] });
    // A new version with only a path: its max-cut would be 9, not 12.
    await request(t.app).post(`/api/networks/${n.id}/versions`).set('Authorization', `Bearer ${org.tokens.dispatcher}`).send(networkBody('Changing', 10, Array.from({ length: 9 }, (_, i) => [i, i + 1, 1] as Edge))).expect(201);
    const run = await finished(org.tokens.viewer, created.body.id);
    expect(run.versionId).toBe(n.versionId);
    expect(run.jobs[0].result.value).toBe(12);
  });
});

describe('best known answer (server/services/runs/best-known.ts)', () => {
  test('the best balanced answer of any run asking the same question on the version, proven first among equals; another question has its own', async () => {
    const first = await as(org.tokens.analyst).post('/runs', { versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }], timeLimitSeconds: 2 });
    await finished(org.tokens.viewer, first.body.id);
    const second = await as(org.tokens.analyst).post('/runs', { versionId: petersen.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }], timeLimitSeconds: 1 });
    const run = await finished(org.tokens.viewer, second.body.id);
    // Petersen graph max-cut 12 (common practice): proven by exact in the first run, whatever greedy found here.
    expect(run.bestKnown).toMatchObject({ value: 12, provenOptimal: true, solver: 'exact' });
    expect(run.bestKnown.runId).toBeLessThanOrEqual(first.body.id);
    expect(run.bestKnown.runsCompared).toBeGreaterThanOrEqual(2);
    const split = await as(org.tokens.analyst).post('/runs', { versionId: petersen.versionId, problem: { kind: 'bisection', tolerance: 0 }, solvers: [{ solver: 'greedy' }], timeLimitSeconds: 1 });
    const bis = await finished(org.tokens.viewer, split.body.id);
    expect(bis.bestKnown).toMatchObject({ runId: split.body.id, runsCompared: 1, value: bis.jobs[0].result.value });
  });
});
