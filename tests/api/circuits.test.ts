/**
 * What a variational job would need on a device, through the API: the result's `circuit`,
 * `deviceTime` and (asked for) `noise`; the OpenQASM download; the analyst's recomputation under
 * other device assumptions; permissions; the OpenAPI document describing the shapes.
 * Needs a real worker: one is spawned for this file.
 */
import { createOrgWithRoles, createTestApp, signedIn, type OrgWithRoles, type SessionAgent, type TestApp } from './setup/test-app';
import { startWorkerProcess } from '../support/worker-process';

let t: TestApp;
let org: OrgWithRoles;
let analyst: SessionAgent;
let dispatcher: SessionAgent;
let viewer: SessionAgent;
let worker: ReturnType<typeof startWorkerProcess>;
let run: { id: number; jobs: Array<{ id: number; solver: string; status: string; result: Record<string, any> | null }> };

// Two triangles joined by a heavy lane and a cross lane: 6 depots, 8 lanes, total weight 16.
const depots = ['A', 'B', 'C', 'D', 'E', 'F'].map((id) => ({ id, name: `Quillmere ${id}` }));
const lanes = [['A', 'B', 1], ['B', 'C', 2], ['C', 'A', 1], ['D', 'E', 1], ['E', 'F', 3], ['F', 'D', 1], ['C', 'D', 5], ['A', 'F', 2]].map(([from, to, weight]) => ({ from, to, weight }));

beforeAll(async () => {
  process.env.RUN_QUEUE_NAME = `circuits-${Date.now().toString(36)}`;
  process.env.LOG_LEVEL = 'silent';
  t = await createTestApp();
  org = await createOrgWithRoles(t.deps, 'Circuit Yard');
  analyst = await signedIn(t.app, org.users.analyst.email);
  dispatcher = await signedIn(t.app, org.users.dispatcher.email);
  viewer = await signedIn(t.app, org.users.viewer.email);
  worker = startWorkerProcess();
  const versionId = (await analyst.post('/networks', { name: 'Quillmere triangles', depots, lanes }).expect(201)).body.versionId;
  const created = await analyst.post('/runs', {
    versionId, problem: { kind: 'maxcut' },
    solvers: [{ solver: 'qaoa', settings: { layers: 1, maxIterations: 20, restarts: 1, noise: true, noiseTrajectories: 4 } }, { solver: 'tabu' }],
  }).expect(201);
  const deadline = Date.now() + 120_000;
  for (;;) {
    run = (await analyst.get(`/runs/${created.body.id}`).expect(200)).body;
    if (!run.jobs.some((j) => j.status === 'queued' || j.status === 'running')) break;
    if (Date.now() > deadline) throw new Error(`run did not finish; worker output:\n${worker.output().slice(-2000)}`);
    await new Promise((r) => setTimeout(r, 500));
  }
});
afterAll(async () => {
  await worker?.stop();
  await t?.close();
});

const qaoa = () => run.jobs.find((j) => j.solver === 'qaoa')!;
const tabu = () => run.jobs.find((j) => j.solver === 'tabu')!;

test('the run result carries circuit, device time and the asked-for noise', () => {
  const r = qaoa().result!;
  expect(qaoa().status).toBe('succeeded');
  expect(r.circuit.qubits).toBe(6);
  expect(r.circuit.layouts.all).toEqual({ oneQubitGates: 6 + 8 + 6, twoQubitGates: 16, twoQubitDepth: expect.any(Number), depth: expect.any(Number), swaps: 0 });
  expect(r.circuit.layouts.line.swaps).toBeGreaterThan(0);
  expect(r.deviceTime.layouts.line.estimateSeconds).toBeGreaterThan(r.deviceTime.layouts.all.estimateSeconds);
  expect(r.noise.layout).toBe('line');
  expect(Math.abs(r.noise.noiseless.expectation - r.expectation)).toBeLessThan(1e-9);
  expect(r.noise.trajectories.count).toBe(4);
  expect(r.noise.reference.value).toBe(r.bound);
  expect(tabu().result!.circuit).toBeUndefined();
});

test('OpenQASM download: both versions and forms, on a layout; viewers may download', async () => {
  const v2 = await viewer.get(`/runs/${run.id}/circuit.qasm?version=2&layout=line`).expect(200);
  expect(v2.headers['content-type']).toMatch(/text\/plain/);
  expect(v2.headers['content-disposition']).toMatch(/run-\d+-qaoa-line-bound-openqasm2\.qasm/);
  expect(v2.text.startsWith('OPENQASM 2.0;')).toBe(true);
  expect(v2.text).toMatch(/Final qubit order \(logical->physical\): 0->q\[\d\]/);
  expect(v2.text.match(/^measure /gm)).toHaveLength(6);
  const v3 = await viewer.get(`/runs/${run.id}/circuit.qasm?form=parameterised`).expect(200);
  expect(v3.text.startsWith('OPENQASM 3.0;')).toBe(true);
  expect(v3.text).toContain('input float[64] gamma_1;');
  await viewer.get(`/runs/${run.id}/circuit.qasm?version=4`).expect(400);
  const classical = await viewer.get(`/runs/${run.id}/circuit.qasm?job=${tabu().id}`).expect(409);
  expect(classical.body.error).toMatch(/only finished QAOA and VQE jobs/);
});

test('analysts recompute device time and noise under their assumptions; dispatchers may not', async () => {
  await dispatcher.post(`/runs/${run.id}/device`, {}).expect(403);
  const perfect = await analyst.post(`/runs/${run.id}/device`, { assumptions: { oneQubitError: 0, twoQubitError: 0, readoutError: 0, twoQubitGateSeconds: 1e-6 }, noiseLayout: 'grid' }).expect(200);
  const r = qaoa().result!;
  expect(perfect.body.noise.depolarizing.fidelity).toBe(1);
  expect(Math.abs(perfect.body.noise.depolarizing.expectation - r.expectation)).toBeLessThan(1e-9);
  expect(perfect.body.noise.layout).toBe('grid');
  expect(perfect.body.deviceTime.assumptions.twoQubitGateSeconds).toBe(1e-6);
  expect(perfect.body.deviceTime.layouts.all.circuitSeconds).toBeGreaterThan(r.deviceTime.layouts.all.circuitSeconds);
  expect(perfect.body.defaults.twoQubitError.source).toMatch(/from memory/);
  const bad = await analyst.post(`/runs/${run.id}/device`, { assumptions: { readoutError: 3 } }).expect(400);
  expect(Object.keys(bad.body.fields)).toContain('assumptions.readoutError');
});

test('the OpenAPI document describes the device answer and the OpenQASM download', async () => {
  const doc = (await viewer.get('/openapi.json').expect(200)).body;
  const device = doc.paths['/api/runs/{id}/device'].post;
  const schema = JSON.stringify(device.responses['200'].content['application/json'].schema);
  for (const field of ['twoQubitDepth', 'estimateSeconds', 'fidelity', 'expectationStdError', 'readoutError']) expect(schema).toContain(field);
  const qasm = doc.paths['/api/runs/{id}/circuit.qasm'].get;
  expect(qasm.parameters.map((p: { name: string }) => p.name)).toEqual(expect.arrayContaining(['version', 'layout', 'form', 'job']));
  const run = JSON.stringify(doc.paths['/api/runs/{id}'].get.responses['200']);
  expect(run).toContain('oneQubitGates');
  expect(run).toContain('noise');
});
