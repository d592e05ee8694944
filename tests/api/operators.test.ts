/**
 * Operators of your own through the API (analysts and up): inspect, run VQE/QAOA next to the
 * exact ground energy — the transverse-field Ising chain against Pfeuty, "The one-dimensional
 * Ising model with a transverse field", Ann. Phys. 57, 79 (1970) — and malformed text refused
 * with its line. The run happens in a thread of the API process.
 */
import { createOrgWithRoles, createTestApp, signedIn, type SessionAgent, type TestApp } from './setup/test-app';
import { formatOperatorText } from '../../shared/engine/operators/format';
import { pfeutyGroundEnergy, tfimChain } from '../unit/operators/tfim';

let t: TestApp;
let analyst: SessionAgent;
let dispatcher: SessionAgent;

beforeAll(async () => {
  process.env.LOG_LEVEL = 'silent';
  t = await createTestApp();
  const org = await createOrgWithRoles(t.deps, 'Operator Yard');
  analyst = await signedIn(t.app, org.users.analyst.email);
  dispatcher = await signedIn(t.app, org.users.dispatcher.email);
});
afterAll(async () => {
  await t?.close();
});

test('inspect: terms, groups and shots; dispatchers may not; malformed text is refused with its line', async () => {
  const text = formatOperatorText(tfimChain(4, 1, 1));
  const ok = await analyst.post('/operators/inspect', { text, precision: 0.1 }).expect(200);
  expect(ok.body.terms).toBe(8);
  expect(ok.body.groups).toHaveLength(2);
  await dispatcher.post('/operators/inspect', { text }).expect(403);
  const bad = await analyst.post('/operators/inspect', { text: 'spinyard-operator 1\nqubits 2\n0.5 Z0 Z1\n1 W1\n' }).expect(400);
  expect(bad.body.fields.text[0]).toMatch(/^line 4: unknown Pauli letter "W"/);
  const csv = await analyst.post('/operators/inspect', { text: '1,2\n3\n', kind: 'qubo-csv' }).expect(400);
  expect(csv.body.fields.text[0]).toMatch(/^line 2: 1 values, expected 2/);
});

test('solve: the transverse-field chain of 6 next to its exact ground energy (Pfeuty 1970)', async () => {
  const text = formatOperatorText(tfimChain(6, 1, 0.8));
  const r = await analyst.post('/operators/solve', { text, solver: 'vqe', settings: { ansatz: 'alternating', layers: 2, maxIterations: 150, restarts: 1 }, timeLimitSeconds: 15 }).expect(200);
  expect(Math.abs(r.body.exact.energy - pfeutyGroundEnergy(6, 1, 0.8))).toBeLessThan(1e-8);
  expect(r.body.energy).toBeGreaterThanOrEqual(r.body.exact.energy - 1e-9);
  expect(r.body.gap).toBeCloseTo(r.body.energy - r.body.exact.energy, 12);
  expect(r.body.circuit.qubits).toBe(6);
});

test('QAOA on a QUBO CSV; QAOA refuses X terms; too many qubits and bad settings are 400', async () => {
  const q = await analyst.post('/operators/solve', { text: '-1,2,0\n0,-1,2\n0,0,-1\n', solver: 'qaoa', settings: { layers: 2, maxIterations: 80, restarts: 1 } }).expect(200);
  expect(q.body.exact.energy).toBeCloseTo(-2, 12); // min of −x0 − x1 − x2 + 2x0x1 + 2x1x2, by hand
  const x = await analyst.post('/operators/solve', { text: 'spinyard-operator 1\nqubits 1\n1 X0\n', solver: 'qaoa' }).expect(400);
  expect(x.body.error).toMatch(/QAOA needs a diagonal operator/);
  await analyst.post('/operators/solve', { text: formatOperatorText(tfimChain(16, 1, 1)) }).expect(400);
  const s = await analyst.post('/operators/solve', { text: 'spinyard-operator 1\nqubits 1\n1 Z0\n', settings: { layers: 99 } }).expect(400);
  expect(JSON.stringify(s.body)).toMatch(/layers/);
});
