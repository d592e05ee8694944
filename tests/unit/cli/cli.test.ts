/**
 * The `spinyard` CLI: as a child process (the way users run it) for the exit codes, the JSON
 * contract, the benchmark file and Ctrl-C; in-process through main() for the many small cases.
 * Checks the messages for bad input, and that the JSON output agrees with an independent
 * recomputation of the printed assignment.
 */
import { spawn, spawnSync } from 'child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'fs';
import os from 'os';
import path from 'path';
import Papa from 'papaparse';
import { main } from '../../../server/cli/main';
import { biqmacRow, instancePath, instanceText } from '../../data/load';

const ROOT = path.resolve(__dirname, '../../..');
const CLI = path.join(ROOT, 'server/cli/spinyard.cjs');
const dir = mkdtempSync(path.join(os.tmpdir(), 'spinyard-cli-'));
const write = (name: string, text: string) => { writeFileSync(path.join(dir, name), text); return name; };

/** The CLI as users run it: a child process. */
function cli(...args: string[]) {
  const r = spawnSync(process.execPath, [CLI, ...args], { cwd: dir, encoding: 'utf8', timeout: 60_000 });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}

/**
 * The same entry point in this process (main() never exits the process); used for the many
 * small cases so the file stays fast on a shared machine. Paths are given relative to `dir`.
 */
async function inProcess(...args: string[]) {
  const out: string[] = [], err: string[] = [];
  const abs = args.map((a) => (/\.(csv|txt|graphml|geojson|json)$/.test(a) && !a.startsWith('/') ? path.join(dir, a) : a));
  const code = await main(abs, { out: (t) => out.push(t), err: (t) => err.push(t), errIsTty: false });
  const rel = (t: string) => t.split(dir + path.sep).join('');
  return { code, stdout: out.map(rel).join('\n'), stderr: err.map(rel).join('\n') };
}

/** Cut / crossing weight of an assignment, computed here from the lanes file. */
function crossing(lanes: [string, string, number][], ids: string[], assignment: number[]): number {
  const side = new Map(ids.map((id, i) => [id, assignment[i]]));
  return lanes.reduce((s, [a, b, w]) => s + (side.get(a) !== side.get(b) ? w : 0), 0);
}

// A 6-depot network: two triangles joined by one heavy lane.
const LANES: [string, string, number][] = [['A', 'B', 1], ['B', 'C', 1], ['C', 'A', 1], ['D', 'E', 1], ['E', 'F', 1], ['F', 'D', 1], ['C', 'D', 5]];
write('lanes.csv', `from,to,weight\n${LANES.map((l) => l.join(',')).join('\n')}\n`);

describe('spinyard CLI: bad input', () => {
  test('a malformed file: one message naming file and line, exit 2, nothing on stdout', () => {
    write('bad.csv', 'from,to,weight\nA,B,1\nB,C,abc\n');
    const r = cli('solve', 'bad.csv', '--solver', 'tabu');
    expect(r.code).toBe(2);
    expect(r.stderr.trim()).toBe('spinyard: bad.csv line 3: weight "abc" is not a number; use a number such as 12.5');
    expect(r.stdout).toBe('');
  });

  test('a missing file and a bad flag: exit 2 (the flag with the usage)', async () => {
    expect(await inProcess('solve', 'nowhere.csv', '--solver', 'tabu')).toMatchObject({ code: 2, stderr: expect.stringContaining('cannot read nowhere.csv') });
    const r = await inProcess('solve', 'lanes.csv', '--solver', 'tabu', '--colour', 'red');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('unknown flag --colour');
    expect(r.stderr).toContain('usage:');
    expect(await inProcess('solve', 'lanes.csv', '--solver', 'tabu', '--problem', 'tsp')).toMatchObject({ code: 2, stderr: expect.stringContaining('choose one of maxcut, bisection, kway') });
    expect(await inProcess('solve', 'lanes.csv', '--solver', 'tabu', '--pin', 'A')).toMatchObject({ code: 2, stderr: expect.stringContaining('write ID=SIDE') });
  });
});

describe('spinyard CLI: solving', () => {
  test('an unknown solver lists the valid names; a refusal is exit 2', async () => {
    const r = await inProcess('solve', 'lanes.csv', '--solver', 'nosuch');
    expect(r.code).toBe(2);
    expect(r.stderr).toContain('choose one of:');
    expect(r.stderr).toContain('tabu');
    const refused = await inProcess('solve', 'lanes.csv', '--solver', 'gw', '--problem', 'bisection');
    expect(refused.code).toBe(2);
    expect(refused.stderr).toContain('refuses this problem');
  });

  test.each([[1, 0.75], [2, 5 / 6]])('QAOA p = %i on an 8-ring reaches the ring-of-disagrees value %f per lane (Farhi, Goldstone, Gutmann 2014)', async (p, perLane) => {
    // Exact expectation (--shots 0); the ring (8 lanes) is longer than 2p + 1, as the formula needs.
    write('ring8.txt', `8 8\n${Array.from({ length: 8 }, (_, i) => `${i + 1} ${((i + 1) % 8) + 1} 1`).join('\n')}\n`);
    const r = await inProcess('solve', 'ring8.txt', '--solver', 'qaoa', '--layers', String(p), '--shots', '0', '--json');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.expectation).toBeCloseTo(8 * perLane, 4);
    expect(out.energy).toBeCloseTo(-out.expectation, 9); // max-cut energy = −cut
    expect(out.params).toHaveLength(2 * p);
    const ring = Array.from({ length: 8 }, (_, i) => [String(i + 1), String(((i + 1) % 8) + 1), 1] as [string, string, number]);
    expect(out.value).toBe(crossing(ring, out.depots, out.assignment));
    expect(out.value).toBeGreaterThanOrEqual(out.expectation - 1e-9); // the best sample is at least the mean
  });

  test('--json max-cut: one JSON object whose value is the cut of its own assignment', () => {
    const r = cli('solve', 'lanes.csv', '--solver', 'exact', '--json', '--progress');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout); // progress never reaches stdout
    for (const key of ['problem', 'solver', 'n', 'qubits', 'sense', 'value', 'assignment', 'energy', 'expectation', 'params', 'bound', 'gap', 'provenOptimal', 'seconds', 'evaluations', 'shots']) expect(out).toHaveProperty(key);
    expect(out).toMatchObject({ problem: 'maxcut', solver: 'exact', n: 6, qubits: 0, sense: 'max', energy: null, expectation: null }); // exact simulates no circuit
    expect(out.assignment).toHaveLength(6);
    expect(out.value).toBe(crossing(LANES, out.depots, out.assignment));
    // Max-cut of two triangles joined by a lane: 2 per triangle (odd cycle, n − 1) + the 5 lane.
    expect(out.value).toBe(9);
    expect(out.provenOptimal).toBe(true);
    expect(out.gap).toBe(0);
  });

  test('--json bisection: sense min, a balanced assignment, the crossing weight recomputed', async () => {
    const r = await inProcess('solve', 'lanes.csv', '--problem', 'bisection', '--solver', 'exact', '--json');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.sense).toBe('min');
    expect(out.assignment.filter((a: number) => a === 0)).toHaveLength(3);
    expect(out.value).toBe(crossing(LANES, out.depots, out.assignment));
    // Independent optimum: every 3/3 split of the six depots, enumerated here.
    let best = Infinity;
    for (let mask = 0; mask < 64; mask++) {
      const sides = out.depots.map((_: string, i: number) => (mask >> i) & 1);
      if (sides.filter((x: number) => x === 0).length === 3) best = Math.min(best, crossing(LANES, out.depots, sides));
    }
    expect(best).toBe(4); // keep the heavy C–D lane inside one side: {A, C, D} | {B, E, F}
    expect(out.value).toBe(best);
    expect(out.provenOptimal).toBe(true);
  });

  test('the file type follows the extension: the same network as GraphML and GeoJSON inspects alike', async () => {
    const { writeGraphml, writeGeojson, parseCsvNetwork } = require('../../../shared/formats');
    const document = parseCsvNetwork({ content: readFileSync(path.join(dir, 'lanes.csv'), 'utf8') }).document;
    write('net.graphml', writeGraphml(document));
    write('net.geojson', writeGeojson(document));
    for (const file of ['net.graphml', 'net.geojson']) {
      const r = await inProcess('inspect', file, '--json');
      expect(r.code).toBe(0);
      expect(JSON.parse(r.stdout)).toMatchObject({ depots: 6, lanes: 7, qubits: 6, totalAbsLaneWeight: 11 });
    }
    const bad = await inProcess('solve', 'lanes.csv', '--solver', 'tabu', '--set', 'tenur=3');
    expect(bad.code).toBe(2);
    expect(bad.stderr).toContain('solver settings: tenur: unknown setting');
  });

  test('readable summary shows value, bound, gap and the sides', async () => {
    const r = await inProcess('solve', 'lanes.csv', '--solver', 'exact');
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/value\s+9/);
    expect(r.stdout).toMatch(/bound\s+9/);
    expect(r.stdout).toContain('side 0');
  });

  test('Biq Mac g05_60.0 (G-set layout) with tabu in 2 s reaches its proven optimum 536', () => {
    // Wiegele 2007, Biq Mac library; optimum proven by BiqBin (tests/data/biqmac/OPTIMA.csv).
    const row = biqmacRow('g05_60.0');
    expect(row.status).toBe('proven');
    const file = instancePath('biqmac', 'g05_60.0');
    const r = cli('solve', file, '--solver', 'tabu', '--time-limit', '2', '--json', '--progress');
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/^spinyard: \d+%/m); // progress goes to stderr …
    const out = JSON.parse(r.stdout); // … and stdout is exactly one JSON object
    expect(out.n).toBe(60);
    const lanes = instanceText('biqmac', 'g05_60.0').trim().split('\n').slice(1).map((l) => l.trim().split(/\s+/)).map(([a, b, w]) => [a, b, Number(w)] as [string, string, number]);
    expect(out.value).toBe(crossing(lanes, out.depots, out.assignment));
    expect(out.value).toBe(row.optimum);
    if (out.bound !== null) expect(out.bound).toBeGreaterThanOrEqual(row.optimum);
  });

  test('inspect --json: g05_60.0 max-cut needs 60 qubits and 885 ZZ terms, one measurement group', async () => {
    const r = await inProcess('inspect', instancePath('biqmac', 'g05_60.0'), '--json', '--precision', '1');
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out).toMatchObject({ depots: 60, lanes: 885, qubits: 60, pauliTerms: 885, commutingGroups: 1, offset: -442.5 });
    expect(out.shots).toBe(Math.ceil(885 ** 2 / 4)); // (Σ|w|)²/(4ε²), ε = 1
  });

  test('solvers lists the registry', async () => {
    const r = await inProcess('solvers', '--json');
    expect(r.code).toBe(0);
    const names = JSON.parse(r.stdout).map((s: { name: string }) => s.name);
    expect(names).toEqual(expect.arrayContaining(['exact', 'tabu', 'vqe', 'qaoa']));
  });
});

describe('spinyard CLI: Ctrl-C', () => {
  test('SIGINT cancels the run, prints the best answer so far and exits 130', async () => {
    // 200 depots, each joined to the next and to the one 37 further on (400 lanes).
    const lines = Array.from({ length: 400 }, (_, e) => { const i = e % 200; return `${i + 1} ${((i + (e < 200 ? 1 : 37)) % 200) + 1} 1`; });
    const file = write('ring.txt', `200 ${lines.length}\n${lines.join('\n')}\n`);
    const child = spawn(process.execPath, [CLI, 'solve', file, '--solver', 'anneal', '--time-limit', '60', '--json', '--no-bounds', '--progress'], { cwd: dir });
    let stdout = '', stderr = '';
    child.stdout.on('data', (d) => (stdout += d));
    // Interrupt once the solver reports progress (the CLI is then past start-up and listening).
    child.stderr.on('data', (d) => {
      const first = !/spinyard: \d+%/.test(stderr);
      stderr += d;
      if (first && /spinyard: \d+%/.test(stderr)) child.kill('SIGINT');
    });
    const code = await new Promise<number | null>((resolve) => child.on('exit', resolve));
    expect(code).toBe(130);
    // The interrupt reached the solver (cancelled, with an answer); a solver that ignored it would
    // run out its 60 s limit and this test's 30 s budget first.
    const out = JSON.parse(stdout);
    expect(out.cancelled).toBe(true);
    expect(out.assignment).toHaveLength(200);
    expect(stderr).toMatch(/cancelling/);
  }, 30_000);
});
