/**
 * `spinyard solve … --qasm FILE`: the OpenQASM 2.0 file of a finished QAOA run, run by the
 * independent `quantum-circuit` package (npm, 0.9), gives the run's exact expected cut (the
 * JSON's `expectation`) — computed here from the reference state's probabilities and the lanes
 * file, after undoing the final qubit order the file states. Also: `--json` carries `circuit`.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'fs';
import os from 'os';
import path from 'path';
import { main } from '../../../server/cli/main';

const dir = mkdtempSync(path.join(os.tmpdir(), 'spinyard-qasm-'));
const LANES: [string, string, number][] = [['A', 'B', 1], ['B', 'C', 2], ['C', 'A', 1], ['D', 'E', 1], ['E', 'F', 3], ['F', 'D', 1], ['C', 'D', 5], ['A', 'F', 2]];
writeFileSync(path.join(dir, 'lanes.csv'), `from,to,weight\n${LANES.map((l) => l.join(',')).join('\n')}\n`);

async function run(...args: string[]) {
  const out: string[] = [], err: string[] = [];
  const code = await main(args, { out: (t) => out.push(t), err: (t) => err.push(t), errIsTty: false });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}

interface RefCircuit {
  importQASM(text: string, onError: (errors: unknown[]) => void): void;
  removeMeasurementAndClassicalControl(): void;
  run(): void;
  stateAsArray(): { index: number; amplitude: { re: number; im: number } }[];
}
let QuantumCircuit: new () => RefCircuit;
beforeAll(() => {
  const log = console.log, warn = console.warn;
  console.log = () => undefined;
  console.warn = () => undefined;
  try { QuantumCircuit = require('quantum-circuit'); } finally { console.log = log; console.warn = warn; }
}, 60_000);

jest.setTimeout(60_000);

test.each(['all', 'line', 'grid'])('QAOA run on 6 depots, OpenQASM 2.0 on the %s layout reproduces the expected cut', async (layout) => {
  const file = path.join(dir, `qaoa-${layout}.qasm`);
  const r = await run('solve', path.join(dir, 'lanes.csv'), '--solver', 'qaoa', '--layers', '2', '--set', 'maxIterations=30', '--set', 'restarts=1',
    '--json', '--qasm', file, '--qasm-version', '2', '--qasm-layout', layout);
  expect(r.code).toBe(0);
  const report = JSON.parse(r.stdout);
  expect(report.circuit.qubits).toBe(6);
  expect(Object.keys(report.circuit.layouts)).toEqual(['all', 'line', 'grid']);
  expect(report.circuit.layouts.all.twoQubitGates).toBe(2 * 2 * LANES.length);
  const text = readFileSync(file, 'utf8');
  expect(text.startsWith('OPENQASM 2.0;')).toBe(true);
  // The file states the final order as "j->q[p]" pairs.
  const order = /Final qubit order \(logical->physical\): ([^;]+);/.exec(text)![1].split(' ').map((t) => Number(/q\[(\d+)\]/.exec(t)![1]));
  const ref = new QuantumCircuit();
  ref.importQASM(text, () => undefined);
  ref.removeMeasurementAndClassicalControl();
  ref.run();
  const ids: string[] = report.depots;
  let expectedCut = 0;
  for (const { index, amplitude } of ref.stateAsArray()) {
    const side = ids.map((_, j) => (index >> order[j]) & 1); // logical qubit j = depot j (no pins)
    const cut = LANES.reduce((s, [a, b, w]) => s + (side[ids.indexOf(a)] !== side[ids.indexOf(b)] ? w : 0), 0);
    expectedCut += (amplitude.re ** 2 + amplitude.im ** 2) * cut;
  }
  expect(Math.abs(expectedCut - report.expectation)).toBeLessThan(1e-9);
}, 60_000);

test('version 3 is the default; classical solvers write no file; bad flags are refused', async () => {
  const file = path.join(dir, 'vqe.qasm');
  const ok = await run('solve', path.join(dir, 'lanes.csv'), '--solver', 'vqe', '--set', 'maxIterations=5', '--set', 'restarts=1', '--qasm', file, '--qasm-form', 'parameterised', '--time-limit', '5');
  expect(ok.code).toBe(0);
  expect(ok.stdout).toMatch(/line\s+\d+ one-qubit \+ \d+ two-qubit gates/);
  const text = readFileSync(file, 'utf8');
  expect(text.startsWith('OPENQASM 3.0;')).toBe(true);
  expect(text).toContain('input float[64] theta_0_0;');
  const classical = await run('solve', path.join(dir, 'lanes.csv'), '--solver', 'tabu', '--time-limit', '0.5', '--qasm', path.join(dir, 'none.qasm'));
  expect(classical.code).toBe(0);
  expect(classical.stderr).toMatch(/runs no circuit/);
  const bad = await run('solve', path.join(dir, 'lanes.csv'), '--solver', 'qaoa', '--qasm', file, '--qasm-version', '4');
  expect(bad.code).toBe(2);
  expect(bad.stderr).toMatch(/--qasm-version 4: choose 2/);
}, 60_000);
