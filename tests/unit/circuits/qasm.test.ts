/**
 * OpenQASM 2.0 export against an independent simulator: the `quantum-circuit` package (npm,
 * 0.9) imports our file, and its final state must equal our statevector's (ansatz.prepare) to
 * 1e-9 per amplitude, after undoing the final qubit order the file states and up to one global
 * phase (OpenQASM 2.0 cannot write a global phase; qelib1's rz is u1, which differs by one).
 */
import { createLadderAnsatz } from '../../../shared/engine/ansatz/ladder';
import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import { ladderCircuit } from '../../../shared/engine/circuits/ladder';
import { qaoaCircuit } from '../../../shared/engine/circuits/qaoa';
import { toQasm, type QasmOptions } from '../../../shared/engine/circuits/qasm';
import { routeCircuit } from '../../../shared/engine/circuits/route';
import type { LayoutName, PhysicalCircuit } from '../../../shared/engine/circuits/types';
import type { IsingOperator } from '../../../shared/engine/operators/types';
import { createRng } from '../../../shared/engine/random';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { complete, maxcutOperator, ring } from './graphs';

interface RefCircuit {
  importQASM(text: string, onError: (errors: unknown[]) => void): void;
  removeMeasurementAndClassicalControl(): void;
  run(): void;
  stateAsArray(onlyPossible?: boolean): { index: number; amplitude: { re: number; im: number } }[];
}
let QuantumCircuit: new (n?: number) => RefCircuit;
beforeAll(() => {
  const log = console.log, warn = console.warn; // the package prints harmless warnings on load
  console.log = () => undefined;
  console.warn = () => undefined;
  try { QuantumCircuit = require('quantum-circuit'); } finally { console.log = log; console.warn = warn; }
});

/** The reference simulator's state for a QASM text, in LOGICAL qubit order. */
function referenceState(text: string, c: PhysicalCircuit): Float64Array {
  const ref = new QuantumCircuit();
  let errors: unknown[] = [];
  ref.importQASM(text, (e) => { errors = e; });
  expect(errors).toEqual([]);
  ref.removeMeasurementAndClassicalControl();
  ref.run();
  const n = c.numQubits;
  const out = new Float64Array(2 << n);
  for (const { index, amplitude } of ref.stateAsArray()) {
    let logical = 0;
    for (let j = 0; j < n; j++) if ((index >> c.finalPlacement[j]) & 1) logical |= 1 << j;
    out[2 * logical] = amplitude.re;
    out[2 * logical + 1] = amplitude.im;
  }
  return out;
}

/** Largest amplitude difference after removing the global phase at the largest amplitude. */
function maxDifference(ours: Float64Array, theirs: Float64Array): number {
  let k = 0;
  for (let x = 0; 2 * x < ours.length; x++) if (Math.hypot(ours[2 * x], ours[2 * x + 1]) > Math.hypot(ours[2 * k], ours[2 * k + 1])) k = x;
  const phase = Math.atan2(ours[2 * k + 1], ours[2 * k]) - Math.atan2(theirs[2 * k + 1], theirs[2 * k]);
  const c = Math.cos(phase), s = Math.sin(phase);
  let worst = 0;
  for (let x = 0; 2 * x < ours.length; x++) {
    const re = c * theirs[2 * x] - s * theirs[2 * x + 1], im = s * theirs[2 * x] + c * theirs[2 * x + 1];
    worst = Math.max(worst, Math.hypot(ours[2 * x] - re, ours[2 * x + 1] - im));
  }
  return worst;
}

function weighted(n: number, edges: [number, number][], seed: number): IsingOperator {
  const rng = createRng(seed);
  const op = maxcutOperator(n, edges, Array.from({ length: n }, () => rng.normal()));
  op.quadCoeff.forEach((_, t) => (op.quadCoeff[t] = 0.3 + rng.next()));
  return op;
}

const layouts: LayoutName[] = ['all', 'line', 'grid'];
const bound = (params: ArrayLike<number>): QasmOptions => ({ version: 2, params, form: 'bound' });

describe('OpenQASM 2.0 reproduces our final state (quantum-circuit as reference)', () => {
  const rng = createRng(7);
  const params = Float64Array.from({ length: 4 }, () => rng.next() * 2 - 1);

  test.each(layouts)('QAOA p = 2 on a weighted complete graph of 5 depots, %s layout', (layout) => {
    const op = weighted(5, complete(5), 11);
    const ours = createQaoaAnsatz({ numQubits: 5, layers: 2, energyDiagonal: isingDiagonal(op) }).prepare(params).amps;
    const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), layout);
    if (layout !== 'all') expect(c.swaps).toBeGreaterThan(0);
    expect(maxDifference(ours, referenceState(toQasm(c, bound(params)), c))).toBeLessThan(1e-9);
  });

  test('warm-started QAOA on a ring of 5, line layout', () => {
    const op = weighted(5, ring(5), 3);
    const warm = { probabilities: [0, 1, 1, 0, 0.5], epsilon: 0.2 };
    const ours = createQaoaAnsatz({ numQubits: 5, layers: 2, energyDiagonal: isingDiagonal(op), warmStart: warm }).prepare(params).amps;
    const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2, warmStart: warm }), 'line');
    expect(maxDifference(ours, referenceState(toQasm(c, bound(params)), c))).toBeLessThan(1e-9);
  });

  test.each(layouts)('VQE ladder (ring entangler, 2 rungs, start bits) on 5 qubits, %s layout', (layout) => {
    const initialBits = [1, 0, 0, 1, 0];
    const theta = Float64Array.from({ length: 2 * 5 * 3 }, () => rng.next() * 6 - 3);
    const ours = createLadderAnsatz({ numQubits: 5, layers: 2, entangler: 'ring', initialBits }).prepare(theta).amps;
    const c = routeCircuit(ladderCircuit({ numQubits: 5, layers: 2, entangler: 'ring', initialBits }), layout);
    expect(maxDifference(ours, referenceState(toQasm(c, bound(theta)), c))).toBeLessThan(1e-9);
  });

  test('the parameterised 2.0 file is the bound file with named angles', () => {
    // Not run through quantum-circuit: its import of a parameterised `gate` definition hands
    // the arguments to the wrong names (seen with 0.9: g(0.5, 0.3) with body rx(2*b) runs rx(0.6)).
    // Instead: binding each name to its value in the definition's body gives the bound file,
    // which the tests above check against the reference simulator.
    const op = weighted(4, complete(4), 5);
    const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), 'line');
    const text = toQasm(c, { version: 2, params, form: 'parameterised' });
    expect(text).toContain('gate qaoa(gamma_1, gamma_2, beta_1, beta_2) q0, q1, q2, q3 {');
    expect(text).toContain(`qaoa(${Array.from(params).join(', ')}) q[0], q[1], q[2], q[3];`);
    const values: Record<string, number> = { gamma_1: params[0], gamma_2: params[1], beta_1: params[2], beta_2: params[3] };
    const body = text.split('\n').filter((l) => l.startsWith('  ')).map((l) => l.trim()
      .replace(/\(((-?[0-9.e+-]+)\*)?(-?)([a-z]+_\d)\)/, (_, __, scale, minus, name) => `(${(minus ? -1 : 1) * (scale === undefined ? 1 : Number(scale)) * values[name]})`)
      .replace(/q(\d)/g, 'q[$1]'));
    const flat = toQasm(c, bound(params)).split('\n').filter((l) => /^(h|x|rx|ry|rz|cx|cz) /.test(l) || /^(rx|ry|rz)\(/.test(l));
    expect(body).toHaveLength(c.gates.length);
    body.forEach((line, i) => {
      const [, name, value] = /^(\w+)\(([^)]*)\)/.exec(line) ?? [line, line, ''];
      const [, fname, fvalue] = /^(\w+)\(([^)]*)\)/.exec(flat[i]) ?? [flat[i], flat[i], ''];
      expect(name).toBe(fname);
      if (value) expect(Number(value)).toBeCloseTo(Number(fvalue), 12);
      else expect(line).toBe(flat[i]);
    });
  });

  test('a wrong export is caught: dropping one gate breaks the match', () => {
    const op = weighted(4, complete(4), 5);
    const ours = createQaoaAnsatz({ numQubits: 4, layers: 2, energyDiagonal: isingDiagonal(op) }).prepare(params).amps;
    const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), 'line');
    const broken = { ...c, gates: c.gates.filter((_, i) => i !== 9) };
    expect(maxDifference(ours, referenceState(toQasm(broken, bound(params)), c))).toBeGreaterThan(1e-3);
  });
});

describe('OpenQASM 3', () => {
  const op = maxcutOperator(3, complete(3));
  const c = routeCircuit(qaoaCircuit({ operator: op, layers: 1 }), 'line');
  const params = [0.25, -0.5];

  test('bound file has the 2.0 file\'s gates and a read-out in logical order', () => {
    const v3 = toQasm(c, { version: 3, params, form: 'bound' }).split('\n');
    const v2 = toQasm(c, { version: 2, params, form: 'bound' }).split('\n');
    expect(v3.slice(0, 2)).toEqual(['OPENQASM 3.0;', 'include "stdgates.inc";']);
    const gatesOf = (lines: string[]) => lines.filter((l) => /^(h|x|rx|ry|rz|cx|cz)[ (]/.test(l));
    expect(gatesOf(v3)).toEqual(gatesOf(v2));
    expect(gatesOf(v3).length).toBe(c.gates.length);
    const reads = v3.filter((l) => l.includes('measure'));
    expect(reads).toEqual(Array.from(c.finalPlacement, (p, j) => `c[${j}] = measure q[${p}];`));
  });

  test('parameterised file declares inputs and writes angles as expressions', () => {
    const text = toQasm(c, { version: 3, params, form: 'parameterised' });
    expect(text).toContain('input float[64] gamma_1;');
    expect(text).toContain('input float[64] beta_1;');
    expect(text).toMatch(/rx\(2\*beta_1\) q\[\d\];/);
    expect(text).toMatch(/rz\(-gamma_1\) q\[\d\];/);
    expect(text).toContain('// Parameters (optimised values): gamma_1 = 0.25, beta_1 = -0.5');
  });
});
