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

test('--noise: noiseless matches the run, zero error changes nothing, defaults shrink the expectation; device time', async () => {
  const args = ['solve', path.join(dir, 'lanes.csv'), '--solver', 'qaoa', '--layers', '1', '--set', 'maxIterations=20', '--set', 'restarts=1', '--json', '--noise', '--noise-trajectories', '4', '--noise-shots', '50'];
  const noisy = JSON.parse((await run(...args)).stdout);
  expect(Math.abs(noisy.noise.noiseless.expectation - noisy.expectation)).toBeLessThan(1e-9);
  expect(noisy.noise.layout).toBe('line');
  expect(noisy.noise.depolarizing.fidelity).toBeLessThan(1);
  // Max-cut: noise pulls the expected cut towards the random-cut value (half the lane weight, 8).
  expect(Math.abs(noisy.noise.depolarizing.expectation - 8)).toBeLessThan(Math.abs(noisy.noise.noiseless.expectation - 8));
  expect(noisy.noise.trajectories.count).toBe(4);
  expect(noisy.noise.trajectories.shots).toBe(200);
  expect(noisy.noise.reference.what).toMatch(/bound/);
  const t = noisy.deviceTime.layouts.line;
  expect(t.estimateSeconds).toBeCloseTo(10_000 * (t.circuitSeconds + 1e-6 + 100e-6), 9);
  expect(noisy.deviceTime.layouts.line.circuitSeconds).toBeGreaterThan(noisy.deviceTime.layouts.all.circuitSeconds);

  const clean = JSON.parse((await run(...args, '--device', 'oneQubitError=0', '--device', 'twoQubitError=0', '--device', 'readoutError=0')).stdout);
  expect(clean.noise.depolarizing.fidelity).toBe(1);
  expect(Math.abs(clean.noise.depolarizing.expectation - clean.expectation)).toBeLessThan(1e-9);
  expect(Math.abs(clean.noise.trajectories.expectation - clean.expectation)).toBeLessThan(1e-9);

  const bad = await run(...args, '--device', 'readoutError=2');
  expect(bad.code).toBe(2);
  expect(bad.stderr).toMatch(/a probability in 0…1/);
}, 60_000);
