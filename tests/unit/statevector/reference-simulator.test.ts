/**
 * Our statevector against an independent simulator from the npm registry: the package
 * `quantum-circuit` (0.9, an independent general-purpose simulator, used only in tests).
 * Its conventions are checked empirically first (qubit 0 = least significant bit, cx [c, t],
 * rz(φ) = diag(e^{−iφ/2}, e^{iφ/2})), then random circuits of our gates must agree to 1e-10.
 */
import { createRng, type Rng } from '../../../shared/engine/random';
import { createZeroState, type StateVector } from '../../../shared/engine/statevector/state';
import {
  applyCnot, applyCz, applyCzChain, applyDiagonalPhase, applyH, applyQaoaLayer, applyRotationLayer,
  applyRx, applyRy, applyRz, applyTransverseMixer, diagonalLevels,
} from '../../../shared/engine/statevector/gates';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import type { IsingOperator } from '../../../shared/engine/operators/types';

interface RefCircuit {
  appendGate(name: string, wires: number | number[], opts?: { params: Record<string, string> }): void;
  run(): void;
  stateAsArray(onlyPossible?: boolean): { index: number; amplitude: { re: number; im: number } }[];
}
type RefCircuitCtor = new (n: number) => RefCircuit;

let QuantumCircuit: RefCircuitCtor;
beforeAll(() => {
  // The package prints harmless warnings while loading.
  const log = console.log, warn = console.warn;
  console.log = () => undefined;
  console.warn = () => undefined;
  try {
    QuantumCircuit = require('quantum-circuit');
  } finally {
    console.log = log;
    console.warn = warn;
  }
});

/** A circuit recorded once and replayed on both simulators. */
type Op =
  | { g: 'h' | 'x'; q: number }
  | { g: 'rx' | 'ry' | 'rz'; q: number; t: number }
  | { g: 'cz' | 'cx'; a: number; b: number }
  | { g: 'mixer'; beta: number }
  | { g: 'layer'; axis: 'x' | 'y' | 'z'; angles: Float64Array }
  | { g: 'czchain'; pairs: Int32Array }
  | { g: 'phase'; op: IsingOperator; gamma: number; levels: boolean }
  | { g: 'qaoa'; op: IsingOperator; gamma: number; beta: number };

const num = (v: number): string => v.toPrecision(17);

function replayReference(n: number, ops: Op[]): Float64Array {
  const c = new QuantumCircuit(n);
  const rz = (q: number, phi: number) => c.appendGate('rz', q, { params: { phi: num(phi) } });
  const isingPhase = (op: IsingOperator, gamma: number) => {
    // e^{−iγ h Z} = rz(2γh); e^{−iγ J Z_aZ_b} = cx(a,b) rz_b(2γJ) cx(a,b); offset only adds a global phase (0 here).
    for (let q = 0; q < n; q++) if (op.linear[q] !== 0) rz(q, 2 * gamma * op.linear[q]);
    for (let t = 0; t < op.quadCoeff.length; t++) {
      c.appendGate('cx', [op.quadI[t], op.quadJ[t]]);
      rz(op.quadJ[t], 2 * gamma * op.quadCoeff[t]);
      c.appendGate('cx', [op.quadI[t], op.quadJ[t]]);
    }
  };
  for (const o of ops) {
    switch (o.g) {
      case 'h': case 'x': c.appendGate(o.g, o.q); break;
      case 'rx': case 'ry': c.appendGate(o.g, o.q, { params: { theta: num(o.t) } }); break;
      case 'rz': rz(o.q, o.t); break;
      case 'cz': case 'cx': c.appendGate(o.g, [o.a, o.b]); break;
      case 'mixer': for (let q = 0; q < n; q++) c.appendGate('rx', q, { params: { theta: num(2 * o.beta) } }); break;
      case 'layer':
        for (let q = 0; q < n; q++) {
          if (o.axis === 'z') rz(q, o.angles[q]);
          else c.appendGate('r' + o.axis, q, { params: { theta: num(o.angles[q]) } });
        }
        break;
      case 'czchain': for (let k = 0; k < o.pairs.length; k += 2) c.appendGate('cz', [o.pairs[k], o.pairs[k + 1]]); break;
      case 'phase': isingPhase(o.op, o.gamma); break;
      case 'qaoa':
        isingPhase(o.op, o.gamma);
        for (let q = 0; q < n; q++) c.appendGate('rx', q, { params: { theta: num(2 * o.beta) } });
        break;
    }
  }
  c.run();
  const out = new Float64Array(2 << n);
  for (const e of c.stateAsArray(false)) {
    out[2 * e.index] = e.amplitude.re;
    out[2 * e.index + 1] = e.amplitude.im;
  }
  return out;
}

function replayOurs(n: number, ops: Op[]): StateVector {
  const s = createZeroState(n);
  for (const o of ops) {
    switch (o.g) {
      case 'h': applyH(s, o.q); break;
      case 'x': applyRx(s, o.q, Math.PI); break; // X = i·R_X(π); replaced below
      case 'rx': applyRx(s, o.q, o.t); break;
      case 'ry': applyRy(s, o.q, o.t); break;
      case 'rz': applyRz(s, o.q, o.t); break;
      case 'cz': applyCz(s, o.a, o.b); break;
      case 'cx': applyCnot(s, o.a, o.b); break;
      case 'mixer': applyTransverseMixer(s, o.beta); break;
      case 'layer': applyRotationLayer(s, o.axis, o.angles); break;
      case 'czchain': applyCzChain(s, o.pairs); break;
      case 'phase': {
        const d = isingDiagonal(o.op);
        applyDiagonalPhase(s, o.levels ? diagonalLevels(d)! : d, o.gamma);
        break;
      }
      case 'qaoa': applyQaoaLayer(s, isingDiagonal(o.op), o.gamma, o.beta); break;
    }
  }
  return s;
}

function randomIsing(n: number, rng: Rng, integer: boolean): IsingOperator {
  const quadI: number[] = [], quadJ: number[] = [], quadCoeff: number[] = [];
  const w = () => (integer ? 1 + rng.int(3) : rng.normal());
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
    if (rng.next() < 0.5) { quadI.push(i); quadJ.push(j); quadCoeff.push(w()); }
  }
  const linear = new Float64Array(n);
  for (let i = 0; i < n; i++) linear[i] = rng.next() < 0.5 ? w() : 0;
  return { numQubits: n, offset: 0, linear, quadI: Int32Array.from(quadI), quadJ: Int32Array.from(quadJ), quadCoeff: Float64Array.from(quadCoeff) };
}

function randomCircuit(n: number, length: number, rng: Rng): Op[] {
  const ops: Op[] = [];
  const angle = () => (rng.next() * 2 - 1) * Math.PI;
  const two = () => { const a = rng.int(n); let b = rng.int(n - 1); if (b >= a) b++; return { a, b }; };
  for (let k = 0; k < length; k++) {
    const pick = rng.int(n >= 2 ? 11 : 6);
    const q = rng.int(n);
    if (pick === 0) ops.push({ g: 'h', q });
    else if (pick === 1) ops.push({ g: 'rx', q, t: angle() });
    else if (pick === 2) ops.push({ g: 'ry', q, t: angle() });
    else if (pick === 3) ops.push({ g: 'rz', q, t: angle() });
    else if (pick === 4) ops.push({ g: 'mixer', beta: angle() });
    else if (pick === 5) ops.push({ g: 'layer', axis: (['x', 'y', 'z'] as const)[rng.int(3)], angles: Float64Array.from({ length: n }, angle) });
    else if (pick === 6) ops.push({ g: 'cz', ...two() });
    else if (pick === 7) ops.push({ g: 'cx', ...two() });
    else if (pick === 8) {
      const pairs: number[] = [];
      for (let j = 0; j < n; j++) { const p = two(); pairs.push(p.a, p.b); }
      ops.push({ g: 'czchain', pairs: Int32Array.from(pairs) });
    } else if (pick === 9) ops.push({ g: 'phase', op: randomIsing(n, rng, rng.next() < 0.5), gamma: angle(), levels: rng.next() < 0.5 });
    else ops.push({ g: 'qaoa', op: randomIsing(n, rng, true), gamma: angle(), beta: angle() });
  }
  return ops;
}

const maxDiff = (a: Float64Array, b: Float64Array): number => {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]));
  return d;
};

describe('statevector vs the quantum-circuit package', () => {
  test('conventions: qubit 0 is the least significant bit and cx takes [control, target]', () => {
    const c = new QuantumCircuit(3);
    c.appendGate('x', 0);
    c.appendGate('cx', [0, 2]);
    c.run();
    const amps = c.stateAsArray(false);
    expect(amps).toHaveLength(8);
    const one = amps.filter((e) => Math.abs(e.amplitude.re) > 0.5);
    expect(one.map((e) => e.index)).toEqual([0b101]);
    // Ours: X via CNOT from a prepared |1⟩ (R_X(π)|0⟩ = −i|1⟩).
    const s = createZeroState(3);
    applyRx(s, 0, Math.PI);
    applyCnot(s, 0, 2);
    expect(s.amps[2 * 0b101 + 1]).toBeCloseTo(-1, 14);
  });

  test('rz(φ) = diag(e^{−iφ/2}, e^{iφ/2}) in both', () => {
    const c = new QuantumCircuit(1);
    c.appendGate('h', 0);
    c.appendGate('rz', 0, { params: { phi: '0.8' } });
    c.run();
    const s = createZeroState(1);
    applyH(s, 0);
    applyRz(s, 0, 0.8);
    const ref = replayReference(1, [{ g: 'h', q: 0 }, { g: 'rz', q: 0, t: 0.8 }]);
    expect(maxDiff(ref, s.amps)).toBeLessThan(1e-12);
    expect(s.amps[1]).toBeCloseTo(-Math.sin(0.4) / Math.SQRT2, 14);
  });

  test.each([1, 2, 3, 4, 5, 6])('random circuits of our gates on %i qubits agree to 1e-10', (n) => {
    const rng = createRng(1000 + n);
    for (let trial = 0; trial < 4; trial++) {
      const ops = randomCircuit(n, 18, rng).filter((o) => o.g !== 'x');
      const ours = replayOurs(n, ops);
      const ref = replayReference(n, ops);
      expect(maxDiff(ref, ours.amps)).toBeLessThan(1e-10);
    }
  });
});
