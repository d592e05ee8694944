/**
 * `spinyard solve --operator FILE` and `spinyard inspect --operator FILE`: the transverse-field
 * Ising chain's exact ground energy against Pfeuty (1970), the variational energy never below it,
 * QUBO CSV files, and malformed files refused with the line.
 */
import { mkdtempSync, readFileSync, writeFileSync } from 'fs';
import os from 'os';
import path from 'path';
import { main } from '../../../server/cli/main';
import { formatOperatorText } from '../../../shared/engine/operators/format';
import { pfeutyGroundEnergy, tfimChain } from '../operators/tfim';

jest.setTimeout(60_000);
const dir = mkdtempSync(path.join(os.tmpdir(), 'spinyard-operator-'));
const file = (name: string, text: string) => { const f = path.join(dir, name); writeFileSync(f, text); return f; };

async function run(...args: string[]) {
  const out: string[] = [], err: string[] = [];
  const code = await main(args, { out: (t) => out.push(t), err: (t) => err.push(t), errIsTty: false });
  return { code, stdout: out.join('\n'), stderr: err.join('\n') };
}

test('transverse-field chain of 6: exact value from Pfeuty (1970), VQE above it, gap and circuit in the JSON', async () => {
  const f = file('tfim6.txt', formatOperatorText(tfimChain(6, 1, 0.7)));
  const r = await run('solve', '--operator', f, '--solver', 'vqe', '--layers', '2', '--set', 'ansatz=alternating', '--set', 'maxIterations=200', '--set', 'restarts=1', '--json', '--qasm', path.join(dir, 'tfim.qasm'), '--qasm-layout', 'line');
  expect(r.code).toBe(0);
  const j = JSON.parse(r.stdout);
  expect(Math.abs(j.exact.energy - pfeutyGroundEnergy(6, 1, 0.7))).toBeLessThan(1e-8);
  expect(j.energy).toBeGreaterThanOrEqual(j.exact.energy - 1e-9);
  expect(j.gap).toBeCloseTo(j.energy - j.exact.energy, 12);
  expect(j.circuit.layouts.line.twoQubitGates).toBeGreaterThan(j.circuit.layouts.all.twoQubitGates); // the ring's closing pair needs swaps on a line
  expect(readFileSync(path.join(dir, 'tfim.qasm'), 'utf8')).toMatch(/^OPENQASM 3\.0;/);
});

test('a QUBO CSV with QAOA, and the text summary', async () => {
  const f = file('q.csv', '-1,2,0\n0,-1,2\n0,0,-1\n');
  const r = await run('solve', '--operator', f, '--solver', 'qaoa', '--layers', '2', '--set', 'maxIterations=100', '--set', 'restarts=1');
  expect(r.code).toBe(0);
  expect(r.stdout).toMatch(/exact\s+-2 \(smallest diagonal entry/); // min of −x0 − x1 − x2 + 2x0x1 + 2x1x2, by hand
  expect(r.stdout).toMatch(/gap\s+/);
});

test('malformed files are refused with the line; QAOA refuses X/Y terms; inspect lists groups and shots', async () => {
  const bad = await run('solve', '--operator', file('bad.txt', 'spinyard-operator 1\nqubits 2\n0.5 Z0 Z1\nabc X1\n'), '--solver', 'vqe');
  expect(bad.code).toBe(2);
  expect(bad.stderr).toMatch(/bad\.txt line 4: coefficient "abc" is not a number/);
  const badCsv = await run('inspect', '--operator', file('bad.csv', '1,0\n0,1,5\n'));
  expect(badCsv.code).toBe(2);
  expect(badCsv.stderr).toMatch(/bad\.csv line 2: 3 values, expected 2/);
  const xy = await run('solve', '--operator', file('x.txt', 'spinyard-operator 1\nqubits 1\n1 X0\n'), '--solver', 'qaoa');
  expect(xy.code).toBe(2);
  expect(xy.stderr).toMatch(/QAOA needs a diagonal operator/);
  const ins = await run('inspect', '--operator', file('t4.txt', formatOperatorText(tfimChain(4, 1, 1))), '--precision', '0.1', '--json');
  const j = JSON.parse(ins.stdout);
  expect(j.terms).toBe(8);
  expect(j.groups).toHaveLength(2); // all ZZ terms, all X terms
});
