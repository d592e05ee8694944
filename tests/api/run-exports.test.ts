/**
 * Run exports (assignment CSV, JSON report) checked against the stored results and against an
 * independent cut computation written here, on graphs whose optimum is a textbook fact.
 * Needs a real worker: one is spawned for this file.
 */
import Papa from 'papaparse';
import { createOrgWithRoles, createTestApp, signedIn, type OrgWithRoles, type SessionAgent, type TestApp } from './setup/test-app';
import { startWorkerProcess } from '../support/worker-process';

let t: TestApp;
let org: OrgWithRoles;
let other: OrgWithRoles;
let dispatcher: SessionAgent;
let worker: ReturnType<typeof startWorkerProcess>;

beforeAll(async () => {
  // A queue of this file's own, so only the worker started here takes its jobs.
  process.env.RUN_QUEUE_NAME = `run-exports-${Date.now().toString(36)}`;
  process.env.LOG_LEVEL = 'silent';
  t = await createTestApp();
  org = await createOrgWithRoles(t.deps, 'Export Yard');
  other = await createOrgWithRoles(t.deps, 'Other Yard');
  dispatcher = await signedIn(t.app, org.users.dispatcher.email);
  worker = startWorkerProcess();
});
afterAll(async () => {
  await worker?.stop();
  await t?.close();
});

type Lane = { from: string; to: string; weight: number };

/** Petersen graph: outer 5-cycle, inner pentagram, spokes. Max cut = 12 (common practice). */
function petersen() {
  const depots = Array.from({ length: 10 }, (_, i) => ({ id: `P${i}`, name: `Petersen depot ${i}` }));
  const lanes: Lane[] = [];
  for (let i = 0; i < 5; i++) {
    lanes.push({ from: `P${i}`, to: `P${(i + 1) % 5}`, weight: 1 });
    lanes.push({ from: `P${5 + i}`, to: `P${5 + ((i + 2) % 5)}`, weight: 1 });
    lanes.push({ from: `P${i}`, to: `P${5 + i}`, weight: 1 });
  }
  return { depots, lanes };
}

/** 4×4 grid: minimum bisection of an L×L grid with L even is L = 4 (common practice). */
function grid4() {
  const id = (r: number, c: number) => `G${r}${c}`;
  const depots = [];
  const lanes: Lane[] = [];
  for (let r = 0; r < 4; r++) for (let c = 0; c < 4; c++) {
    depots.push({ id: id(r, c), name: `Grid ${r}-${c}` });
    if (c < 3) lanes.push({ from: id(r, c), to: id(r, c + 1), weight: 1 });
    if (r < 3) lanes.push({ from: id(r, c), to: id(r + 1, c), weight: 1 });
  }
  return { depots, lanes };
}

/** The test's own cut: weight of lanes whose two depots got different sides. */
function crossing(lanes: Lane[], sideOf: Map<string, string>): number {
  let total = 0;
  for (const l of lanes) if (sideOf.get(l.from) !== sideOf.get(l.to)) total += l.weight;
  return total;
}

async function createNetwork(name: string, doc: { depots: unknown[]; lanes: Lane[] }) {
  const res = await dispatcher.post('/networks', { name, ...doc }).expect(201);
  const versionId = res.body.versionId;
  expect(typeof versionId).toBe('number');
  return versionId as number;
}

async function finishedRun(body: object) {
  const created = await dispatcher.post('/runs', body).expect(201);
  const id = created.body.id as number;
  const deadline = Date.now() + 90_000;
  for (;;) {
    const run = (await dispatcher.get(`/runs/${id}`).expect(200)).body;
    if (!run.jobs.some((j: { status: string }) => j.status === 'queued' || j.status === 'running')) return run;
    if (Date.now() > deadline) throw new Error(`run ${id} did not finish in 90 s; worker output:\n${worker.output().slice(-2000)}`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

/** CSV rows keyed by the header words the export uses (depot id, name, side/region). */
function readCsv(text: string) {
  const parsed = Papa.parse<Record<string, string>>(text.trim(), { header: true, skipEmptyLines: true });
  expect(parsed.errors).toEqual([]);
  const fields = parsed.meta.fields ?? [];
  const idCol = fields.find((f) => /id/i.test(f) && !/version|run/i.test(f));
  const nameCol = fields.find((f) => /name/i.test(f));
  const sideCol = fields.find((f) => /side|region|part/i.test(f));
  expect([idCol, nameCol, sideCol].every(Boolean)).toBe(true);
  return parsed.data.map((row) => ({ id: row[idCol!], name: row[nameCol!], side: row[sideCol!] }));
}

describe('assignment CSV and JSON report', () => {
  const doc = petersen();
  let run: { id: number; jobs: Array<{ solver: string; status: string; result: { value: number; assignment: number[]; provenOptimal: boolean } | null }> };

  beforeAll(async () => {
    const versionId = await createNetwork('Petersen yard', doc);
    run = await finishedRun({ versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'exact' }, { solver: 'tabu' }] });
  });

  test('the CSV lists every depot in order with its name, and its sides equal a stored best result', async () => {
    const res = await dispatcher.get(`/runs/${run.id}/assignment.csv`).expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    const rows = readCsv(res.text);
    expect(rows.map((r) => r.id)).toEqual(doc.depots.map((d) => d.id));
    expect(rows.map((r) => r.name)).toEqual(doc.depots.map((d) => d.name));
    const exact = run.jobs.find((j) => j.solver === 'exact')!;
    expect(exact.status).toBe('succeeded');
    const stored = run.jobs.filter((j) => j.result).map((j) => j.result!.assignment.join(','));
    // Sides may be written as 0/1 or as words; map them back to part numbers in order of appearance
    // only when they are not numeric.
    const numeric = rows.every((r) => /^\d+$/.test(r.side));
    if (numeric) expect(stored).toContain(rows.map((r) => r.side).join(','));
    else {
      const names = [...new Set(rows.map((r) => r.side))];
      const candidates = stored.map((s) => s.split(',').map((x) => names[Number(x)]).join(','));
      const flipped = stored.map((s) => s.split(',').map((x) => names[1 - Number(x)]).join(','));
      expect([...candidates, ...flipped]).toContain(rows.map((r) => r.side).join(','));
    }
  });

  test('the cut recomputed here from the CSV equals the reported value and the textbook optimum 12', async () => {
    const rows = readCsv((await dispatcher.get(`/runs/${run.id}/assignment.csv`).expect(200)).text);
    const cut = crossing(doc.lanes, new Map(rows.map((r) => [r.id, r.side])));
    expect(cut).toBe(12);
    const exact = run.jobs.find((j) => j.solver === 'exact')!;
    expect(exact.result!.value).toBe(cut);
    expect(exact.result!.provenOptimal).toBe(true);
  });

  test('the JSON report carries the run, the question and each solver with the value of its assignment', async () => {
    const res = await dispatcher.get(`/runs/${run.id}/report.json`).expect(200);
    expect(res.headers['content-type']).toMatch(/json/);
    const report = res.body;
    const text = JSON.stringify(report);
    expect(text).toContain('maxcut');
    const jobs: Array<{ solver: string; result?: { value: number; assignment: number[] }; value?: number; assignment?: number[] }> = report.jobs ?? report.solvers ?? report.run?.jobs;
    expect(Array.isArray(jobs)).toBe(true);
    for (const j of jobs) {
      const r = j.result ?? (j as { value: number; assignment: number[] });
      if (!r || !r.assignment) continue;
      const sideOf = new Map(doc.depots.map((d, i) => [d.id, String(r.assignment[i])]));
      expect(crossing(doc.lanes, sideOf)).toBe(r.value);
    }
    expect(jobs.map((j) => j.solver).sort()).toEqual(['exact', 'tabu']);
  });

  test('members with read access (viewer) can download; another organisation gets 404', async () => {
    const viewer = await signedIn(t.app, org.users.viewer.email);
    await viewer.get(`/runs/${run.id}/assignment.csv`).expect(200);
    const stranger = await signedIn(t.app, other.users.owner.email);
    await stranger.get(`/runs/${run.id}/assignment.csv`).expect(404);
    await stranger.get(`/runs/${run.id}/report.json`).expect(404);
  });
});

describe('bisection export', () => {
  test('grid 4×4: the CSV splits 8/8 and its crossing, recomputed here, is the textbook minimum 4', async () => {
    const doc = grid4();
    const versionId = await createNetwork('Grid yard', doc);
    const run = await finishedRun({ versionId, problem: { kind: 'bisection', tolerance: 0 }, solvers: [{ solver: 'exact' }, { solver: 'fm' }] });
    const rows = readCsv((await dispatcher.get(`/runs/${run.id}/assignment.csv`).expect(200)).text);
    const counts = new Map<string, number>();
    for (const r of rows) counts.set(r.side, (counts.get(r.side) ?? 0) + 1);
    expect([...counts.values()].sort()).toEqual([8, 8]);
    const cut = crossing(doc.lanes, new Map(rows.map((r) => [r.id, r.side])));
    expect(cut).toBe(4);
    const best = Math.min(...run.jobs.filter((j: { result: unknown }) => j.result).map((j: { result: { value: number } }) => j.result.value));
    expect(cut).toBe(best);
  });
});
