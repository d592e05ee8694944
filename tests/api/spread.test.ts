/**
 * A qaoa-blocks solve spread over worker processes (server/workers/spread-job.ts), with real
 * workers on the test MariaDB and Redis: two workers both answer block batches of one run and
 * the answer equals the in-process solve with the same seed; a cancel removes the children not
 * started and keeps the best answer; a worker killed with SIGKILL during a child loses nothing
 * (the child reruns on the other worker and the run finishes with the full answer).
 */
import request from 'supertest';
import type { Queue } from 'bullmq';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import {
  applyRunsEnv, createTestApp, networkBody, orgWithTokens, randomEdges, saveNetwork, startWorkerChild, waitFor, type Edge, type TestApp, type WorkerChild,
} from './runs-support';

const SMTP_PORT = 3186; // ports 3180–3189 belong to the solve-service suites
// Stages of ≥ 4 blocks are spread, one block per child (at most 12 children per stage).
applyRunsEnv({ smtpPort: SMTP_PORT, queue: 'spread-test', extra: { RUN_LOCK_MS: '4000', RUN_SPREAD_MIN_TASKS: '4', RUN_SPREAD_CHILDREN: '12' } });

let t: TestApp;
let mail: MailCatcher;
let org: Awaited<ReturnType<typeof orgWithTokens>>;
let queue: Queue;
const workers: WorkerChild[] = [];

const as = (token: string) => ({
  get: (p: string) => request(t.app).get(`/api${p}`).set('Authorization', `Bearer ${token}`),
  post: (p: string, body: object = {}) => request(t.app).post(`/api${p}`).set('Authorization', `Bearer ${token}`).send(body),
});
const cutOf = (edges: Edge[], a: number[]) => edges.reduce((s, [u, v, w]) => s + (a[u] !== a[v] ? w : 0), 0);
/** 16-qubit blocks with two layers: each child takes a noticeable moment, so two workers share the stage. */
const SETTINGS = { blockSize: 16, layers: 2, maxIterations: 100, readoutShots: 256, rounds: 1 };
const SEED = 7;

interface StoredResult { value: number; assignment: number[]; notes: string[]; spread?: { stages: number; batches: number; workers: Record<string, number> } }

async function jobRow(jobId: number) {
  return (await t.deps.models.RunJob.findByPk(jobId))!.get({ plain: true }) as { status: string; attempt: number; result: string | null; error: string | null };
}

async function startRun(name: string, n: number, edgeSeed: number) {
  const edges = randomEdges(n, 0.04, edgeSeed);
  const body = networkBody(name, n, edges);
  const net = await saveNetwork(t.app, org.tokens.dispatcher, body);
  const created = await as(org.tokens.analyst).post('/runs', { versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'qaoa-blocks', settings: SETTINGS }], timeLimitSeconds: 600, seed: SEED });
  expect(created.status).toBe(201);
  const jobId = (await as(org.tokens.viewer).get(`/runs/${created.body.id}`)).body.jobs[0].id as number;
  return { runId: created.body.id as number, jobId, edges, body };
}

/** The same solve in this process (same seed, settings and statevector kernels as the workers). */
async function inProcess(body: ReturnType<typeof networkBody>) {
  const { buildCompactNetwork } = await import('../../shared/engine/network/build');
  const { bindProblem } = await import('../../shared/engine/problem/bind');
  const { solveProblem } = await import('../../shared/engine/solvers/orchestrate');
  const { simKernelsBackend } = await import('../../server/lib/sim-wasm');
  const problem = bindProblem(buildCompactNetwork(body as never), { kind: 'maxcut' });
  return solveProblem(problem, 'qaoa-blocks', SETTINGS, { seed: SEED, timeLimitSeconds: 600, stateKernels: simKernelsBackend() }, { bounds: false });
}

const childEntries = async () => (await queue.getJobs(['active', 'waiting', 'prioritized', 'delayed', 'waiting-children'])).filter((j) => j?.name === 'spread-tasks');

const finished = (jobId: number, statuses: string[], ms: number) => waitFor(`job ${jobId} to end as ${statuses.join(' or ')}`, async () => {
  const row = await jobRow(jobId);
  return statuses.includes(row.status) ? row : null;
}, ms, 250);

jest.setTimeout(400_000);

beforeAll(async () => {
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  t = await createTestApp();
  const { migrate } = await import('../../server/migrate');
  await migrate(t.deps.db);
  org = await orgWithTokens(t.deps, 'Spread yard', 'fleet');
  const { solveQueue } = await import('../../server/services/queue');
  queue = solveQueue(t.deps).queue;
}, 60_000);

afterAll(async () => {
  await Promise.allSettled(workers.map((w) => w.kill('SIGKILL')));
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
  await mail?.close();
});

test('two workers both answer block batches of one run; the answer equals the in-process solve', async () => {
  const a = await startWorkerChild(), b = await startWorkerChild();
  workers.push(a, b);
  const { jobId, edges, body } = await startRun('Spread two workers', 160, 31);
  const row = await finished(jobId, ['succeeded', 'failed', 'cancelled'], 300_000);
  expect(row).toMatchObject({ status: 'succeeded', error: null });
  const result = JSON.parse(row.result!) as StoredResult;
  expect(cutOf(edges, result.assignment)).toBe(result.value);
  const names = Object.keys(result.spread!.workers);
  expect(names).toHaveLength(2);
  expect(names.some((n) => n.endsWith(`#${a.pid}`)) && names.some((n) => n.endsWith(`#${b.pid}`))).toBe(true);
  expect(result.spread!.stages).toBe(2); // the blocks, then one improvement round
  expect(Object.values(result.spread!.workers).reduce((s, k) => s + k, 0)).toBe(result.spread!.batches); // every batch answered once
  expect(result.notes.join(' ')).toMatch(/spread over 2 worker process/);
  const local = await inProcess(body);
  expect(result.assignment).toEqual(local.assignment);
  expect(result.value).toBe(local.value);
  expect(await childEntries()).toHaveLength(0);
  await Promise.allSettled([a.kill('SIGTERM'), b.kill('SIGTERM')]);
});

test('cancelling the run removes the children not started and keeps the best answer found', async () => {
  const w = await startWorkerChild();
  workers.push(w);
  const { runId, jobId, edges } = await startRun('Spread cancel', 320, 32);
  await waitFor('a child of the run to be running', async () => (await childEntries()).some((j) => j.processedBy !== undefined && (j.data as { parent: { jobId: number } }).parent.jobId === jobId), 240_000, 100);
  const waiting = (await childEntries()).length;
  expect(waiting).toBeGreaterThan(2); // one running, the rest waiting
  const res = await as(org.tokens.analyst).post(`/runs/${runId}/cancel`);
  expect(res.status).toBe(200);
  const row = await finished(jobId, ['cancelled', 'succeeded', 'failed'], 120_000);
  expect(row.status).toBe('cancelled');
  expect(await childEntries()).toHaveLength(0);
  const result = JSON.parse(row.result!) as StoredResult;
  expect(cutOf(edges, result.assignment)).toBe(result.value); // the best answer found until then, whole and valid
  const answered = Object.values(result.spread!.workers).reduce((s, k) => s + k, 0);
  expect(answered).toBeLessThan(result.spread!.batches); // removed children never ran
  expect(result.notes.join(' ')).toMatch(/stopped early/);
  await w.kill('SIGTERM');
});

test('a worker killed with SIGKILL during a child loses nothing: the child reruns and the run ends with the full answer', async () => {
  const a = await startWorkerChild(), b = await startWorkerChild();
  workers.push(a, b);
  const { jobId, edges, body } = await startRun('Spread kill', 160, 33);
  const victim = await waitFor('a child running on the first worker', async () => (await childEntries()).find((j) => j.processedBy?.endsWith(`#${a.pid}`) && (j.data as { parent: { jobId: number } }).parent.jobId === jobId), 240_000, 50);
  process.kill(a.pid, 'SIGKILL');
  await a.kill('SIGKILL');
  const row = await finished(jobId, ['succeeded', 'failed', 'cancelled'], 300_000);
  expect(row).toMatchObject({ status: 'succeeded', error: null });
  const result = JSON.parse(row.result!) as StoredResult;
  expect(cutOf(edges, result.assignment)).toBe(result.value);
  expect(Object.values(result.spread!.workers).reduce((s, k) => s + k, 0)).toBe(result.spread!.batches); // the killed child's batch answered too
  expect(result.notes.join(' ')).not.toMatch(/stopped early/);
  const local = await inProcess(body);
  expect(result.assignment).toEqual(local.assignment); // nothing lost: the full answer
  expect(victim.id).toBeTruthy();
  await b.kill('SIGTERM');
});
