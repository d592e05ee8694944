/**
 * The solver listing and the size-based default set the run-setup screen reads
 * (GET /api/solvers, POST /api/solvers/defaults → shared/runs/default-solvers.ts).
 */
import { createOrgWithRoles, createTestApp, signedIn, type OrgWithRoles, type SessionAgent, type TestApp } from './setup/test-app';

let t: TestApp;
let org: OrgWithRoles;
let other: OrgWithRoles;
let viewer: SessionAgent;
let dispatcher: SessionAgent;

beforeAll(async () => {
  t = await createTestApp();
  org = await createOrgWithRoles(t.deps, 'Defaults Yard');
  other = await createOrgWithRoles(t.deps, 'Far Yard');
  viewer = await signedIn(t.app, org.users.viewer.email);
  dispatcher = await signedIn(t.app, org.users.dispatcher.email);
});
afterAll(async () => {
  await t?.close();
});

/** A ring of n depots with unit lanes plus chords i–(i+3): connected, every depot degree 4. */
function ring(n: number) {
  const depots = Array.from({ length: n }, (_, i) => ({ id: `R${i}` }));
  const lanes = [];
  for (let i = 0; i < n; i++) {
    lanes.push({ from: `R${i}`, to: `R${(i + 1) % n}`, weight: 1 });
    lanes.push({ from: `R${i}`, to: `R${(i + 3) % n}`, weight: 2 });
  }
  return { depots, lanes };
}

async function versionOf(name: string, n: number) {
  const res = await dispatcher.post('/networks', { name, ...ring(n) }).expect(201);
  return res.body.versionId as number;
}

test('the listing is the engine registry: names, labels, families, questions, guarantees', async () => {
  const res = await viewer.get('/solvers').expect(200);
  const names = res.body.solvers.map((s: { name: string }) => s.name);
  for (const name of ['exact', 'tabu', 'fm', 'qaoa', 'vqe']) expect(names).toContain(name);
  for (const s of res.body.solvers) {
    expect(typeof s.label).toBe('string');
    expect(['exact', 'bound', 'heuristic', 'variational']).toContain(s.family);
    expect(s.guarantee.length).toBeGreaterThan(10);
  }
  const kwayOnly = await viewer.get('/solvers?kind=kway').expect(200);
  expect(kwayOnly.body.solvers.every((s: { kinds: string[] }) => s.kinds.includes('kway'))).toBe(true);
});

test('small max-cut (12 depots, 12 qubits): exact, tabu, QAOA and VQE', async () => {
  const versionId = await versionOf('Small ring', 12);
  const res = await viewer.post('/solvers/defaults', { versionId, problem: { kind: 'maxcut' } }).expect(200);
  expect(res.body).toMatchObject({ defaults: ['exact', 'tabu', 'qaoa', 'vqe'], depots: 12, lanes: 24 });
  // Each solver answered for itself: one qubit per depot for the circuits, none for classical solvers.
  const q = Object.fromEntries(res.body.solvers.map((s: { name: string; qubits: number }) => [s.name, s.qubits]));
  expect(q).toMatchObject({ exact: 0, tabu: 0, qaoa: 12, vqe: 12 });
});

test('balanced split with a pinned depot: exact, then FM as the heuristic', async () => {
  const versionId = await versionOf('Pinned ring', 12);
  const res = await viewer.post('/solvers/defaults', { versionId, problem: { kind: 'bisection', tolerance: 0, pins: { R0: 0 } } }).expect(200);
  expect(res.body.defaults.slice(0, 2)).toEqual(['exact', 'fm']);
});

test('three regions on 12 depots: exact (3^12 assignments), FM, and the circuits sized by their first bisection', async () => {
  const versionId = await versionOf('Region ring', 12);
  const res = await viewer.post('/solvers/defaults', { versionId, problem: { kind: 'kway', k: 3, tolerance: 0.1 } }).expect(200);
  // The one-hot operator would need at least n·k = 36 qubits; the solvers run recursive bisection,
  // whose widest circuit is the first split: 12 depot qubits plus a few slack qubits.
  const qaoa = res.body.solvers.find((s: { name: string }) => s.name === 'qaoa');
  expect(qaoa.qubits).toBeGreaterThanOrEqual(12);
  expect(qaoa.qubits).toBeLessThanOrEqual(16); // within the free plan's included qubits, so a default
  expect(res.body.defaults).toEqual(['exact', 'fm', 'qaoa', 'vqe']);
});

test('large max-cut (60 depots): no exact enumeration (2^60), decomposition instead of direct circuits', async () => {
  const versionId = await versionOf('Large ring', 60);
  const res = await viewer.post('/solvers/defaults', { versionId, problem: { kind: 'maxcut' } }).expect(200);
  const q = Object.fromEntries(res.body.solvers.map((s: { name: string; qubits: number }) => [s.name, s.qubits]));
  expect(q).toMatchObject({ qaoa: 60, 'qaoa-blocks': 14, rqaoa: 16 }); // blocks of 14 depots; rqaoa's exact remainder of 16
  expect(res.body.defaults).toEqual(['tabu', 'rqaoa', 'qaoa-blocks']);
});

test('a version of another organisation is not found', async () => {
  const versionId = await versionOf('Private ring', 8);
  const stranger = await signedIn(t.app, other.users.owner.email);
  await stranger.post('/solvers/defaults', { versionId, problem: { kind: 'maxcut' } }).expect(404);
});
