/**
 * Every solver as deployed: the API server and a solve worker as separate processes started the
 * way `npm start` starts them (server/scripts/start.sh: `tsx server/index.ts`, `tsx
 * server/worker.ts`), on the test profile's MariaDB and Redis. Every solver `/api/solvers` lists
 * runs on every question it answers, on a small network, with `threads: 2` where the solver has
 * that setting; every job must succeed. In-process tests load TypeScript through jest and missed
 * that milp and multi-threaded solvers could not load their worker threads under tsx.
 * Nothing a member receives may contain file paths or stack text. The run assignment CSV, as a
 * member downloads it, neutralises formula cells (the same helper as the network exports).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import Papa from 'papaparse';
import { getSolver } from '../../shared/engine/solvers/registry';
import type { RunView } from '../../shared/schemas/runs';
import { applyRunsEnv, createTestApp, orgWithTokens, startWorkerChild, waitFor, ROOT, type TestApp, type WorkerChild } from './runs-support';

const PORT = 3197;
const BASE = `http://127.0.0.1:${PORT}/api`;
// One solve slot, as `npm start` runs; no run mails (no SMTP needed).
const runsEnv = applyRunsEnv({ smtpPort: 3198, queue: 'deployed', extra: { RUN_MAIL_AFTER_SECONDS: '86400' } });

/** Paths of this checkout, module names, stack frames ("at f (file:1:2)"). */
const LEAK = new RegExp(`${ROOT.replace(/[/\\.]/g, '\\$&')}|node_modules|\\bat \\S+ \\(|:\\d+:\\d+\\)|\\.(ts|cjs|mjs)\\b`);

// Two triangles joined by a heavy lane, plus a chord: 6 depots (k = 3 regions fits every solver).
const LANES: [string, string, number][] = [['A', 'B', 1], ['B', 'C', 1], ['C', 'A', 1], ['D', 'E', 1], ['E', 'F', 1], ['F', 'D', 1], ['C', 'D', 5], ['A', 'F', 2]];
const IDS = ['A', 'B', 'C', 'D', 'E', 'F'];
/** Max-cut optimum by enumerating the 64 assignments here. */
const MAXCUT_OPTIMUM = (() => {
  let best = 0;
  for (let mask = 0; mask < 64; mask++) {
    const side = (id: string) => (mask >> IDS.indexOf(id)) & 1;
    best = Math.max(best, LANES.reduce((s, [a, b, w]) => s + (side(a) !== side(b) ? w : 0), 0));
  }
  return best;
})();

let t: TestApp;
let server: ChildProcess | null = null;
let serverLog = '';
let worker: WorkerChild | null = null;
const received: string[] = [];

async function api<T>(token: string, method: string, p: string, body?: unknown): Promise<{ status: number; body: T }> {
  const res = await fetch(`${BASE}${p}`, {
    method,
    headers: { Authorization: `Bearer ${token}`, ...(body ? { 'Content-Type': 'application/json' } : {}) },
    body: body ? JSON.stringify(body) : undefined,
  });
  const text = await res.text();
  received.push(text);
  return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
}

jest.setTimeout(600_000);

beforeAll(async () => {
  t = await createTestApp(); // only for its database handle: the organisation and tokens
  server = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/index.ts'], {
    cwd: ROOT,
    env: { ...process.env, ...runsEnv, PORT: String(PORT), HOST: '127.0.0.1', PUBLIC_URL: `http://127.0.0.1:${PORT}` },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  server.stdout!.on('data', (d) => (serverLog += d));
  server.stderr!.on('data', (d) => (serverLog += d));
  await waitFor('the API server to listen', async () => (await fetch(`${BASE}/health`).catch(() => null))?.ok, 120_000, 500)
    .catch((e) => { throw new Error(`${e.message}\n${serverLog}`); });
  worker = await startWorkerChild();
});

afterAll(async () => {
  await worker?.kill('SIGTERM');
  if (server && server.exitCode === null && server.signalCode === null) {
    const gone = new Promise((r) => server!.once('exit', r));
    server.kill('SIGTERM');
    await gone;
  }
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
});

test('every listed solver succeeds on every question it answers, through the API and a worker process', async () => {
  const org = await orgWithTokens(t.deps, 'Deployed yard', 'team');
  const { analyst, viewer } = org.tokens; // threads: 2 is an advanced setting (runs:advanced)
  const listed = await api<{ solvers: { name: string; kinds: string[] }[] }>(viewer, 'GET', '/solvers');
  expect(listed.status).toBe(200);
  expect(listed.body.solvers.length).toBeGreaterThan(0);

  const saved = await api<{ versionId: number }>(analyst, 'POST', '/networks', {
    name: 'Quillmere six', depots: IDS.map((id) => ({ id, name: `Depot ${id}` })), lanes: LANES.map(([from, to, weight]) => ({ from, to, weight })),
  });
  expect(saved.status).toBe(201);

  const hasThreads = (name: string) => {
    try {
      getSolver(name).parseSettings({ threads: 2 });
      return true;
    } catch {
      return false;
    }
  };
  // The solvers that start worker threads of their own must be among those run with threads: 2.
  expect(listed.body.solvers.map((s) => s.name).filter(hasThreads)).toEqual(expect.arrayContaining(['tabu', 'exact']));
  const problems = { maxcut: { kind: 'maxcut' }, bisection: { kind: 'bisection' }, kway: { kind: 'kway', k: 3 } } as const;
  const runIds: number[] = [];
  for (const [kind, problem] of Object.entries(problems)) {
    const entries = listed.body.solvers.filter((s) => s.kinds.includes(kind)).map((s) => ({ solver: s.name, settings: hasThreads(s.name) ? { threads: 2 } : {} }));
    for (let i = 0; i < entries.length; i += 8) { // at most 8 solvers per run
      const created = await api<{ id: number; status: string }>(analyst, 'POST', '/runs', { versionId: saved.body.versionId, problem, solvers: entries.slice(i, i + 8), timeLimitSeconds: 1 });
      expect({ kind, status: created.status, body: created.body }).toMatchObject({ status: 201, body: { status: 'queued' } });
      runIds.push(created.body.id);
    }
  }

  const finished: RunView[] = [];
  for (const id of runIds) {
    finished.push(await waitFor(`run ${id} to finish`, async () => {
      const r = await api<RunView>(viewer, 'GET', `/runs/${id}`);
      return ['succeeded', 'partial', 'failed', 'cancelled'].includes(r.body.status) ? r.body : null;
    }, 420_000, 1000).catch((e) => { throw new Error(`${e.message}\nworker:\n${worker?.output()}`); }));
  }
  const jobs = finished.flatMap((run) => run.jobs.map((j) => ({ kind: run.problem.kind, solver: j.solver, status: j.status, error: j.error, value: j.result?.value })));
  expect(jobs.filter((j) => j.status !== 'succeeded')).toEqual([]);
  const covered = new Set(jobs.map((j) => `${j.solver}/${j.kind}`));
  for (const s of listed.body.solvers) for (const k of s.kinds) expect(covered).toContain(`${s.name}/${k}`);
  // The exact family proves the optimum on six depots.
  const exactOnes = listed.body.solvers.filter((s) => getSolver(s.name).family === 'exact').map((s) => s.name);
  expect(jobs.filter((j) => j.kind === 'maxcut' && exactOnes.includes(j.solver)).map((j) => [j.solver, j.value])).toEqual(exactOnes.map((n) => [n, MAXCUT_OPTIMUM]));
  expect(received.filter((text) => LEAK.test(text))).toEqual([]);
});

test('the run assignment CSV neutralises formula cells, TAB and CR included', async () => {
  const org = await orgWithTokens(t.deps, 'Formula yard', 'team');
  const { dispatcher, viewer } = org.tokens;
  // Spinyard JSON keeps names as written (the API and CSV trim them), so TAB and CR can lead.
  const names = ['=1+1', '+North', '-Sorrowby', '@Tarnwyth', '\tTab yard', '\rReturn yard'];
  const doc = { format: 'spinyard-network', version: 1, depots: IDS.map((id, i) => ({ id, name: names[i] })), lanes: LANES.map(([from, to, weight]) => ({ from, to, weight })) };
  const form = new FormData();
  form.append('file', new Blob([JSON.stringify(doc)], { type: 'application/json' }), 'formula-yard.json');
  const imported = await fetch(`${BASE}/networks/import`, { method: 'POST', headers: { Authorization: `Bearer ${dispatcher}` }, body: form });
  const saved = (await imported.json()) as { versionId: number };
  expect(imported.status).toBe(201);
  const created = await api<{ id: number }>(dispatcher, 'POST', '/runs', { versionId: saved.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }] }); // a dispatcher: default settings and time limit
  expect(created.status).toBe(201);
  await waitFor('the run to finish', async () => (await api<RunView>(viewer, 'GET', `/runs/${created.body.id}`)).body.status === 'succeeded', 120_000, 500);
  const csv = await (await fetch(`${BASE}/runs/${created.body.id}/assignment.csv`, { headers: { Authorization: `Bearer ${viewer}` } })).text();
  const rows = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data.slice(1);
  expect(rows.map((r) => r[1])).toEqual(names.map((n) => `'${n}`));
  expect(rows.flatMap((r) => r.slice(0, 2)).filter((c) => /^[=+\-@\t\r]/.test(c))).toEqual([]);
});
