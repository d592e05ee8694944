/**
 * The mixer in the Hadamard basis (H^{⊗n}, weight phase e^{−iβ(n−2w)}, H^{⊗n}) must equal
 * (1) the rotation-layer kernels (gates.applyTransverseMixer / applyQaoaLayer, the oracle) to
 * 1e-10, at sizes below, at and above the block size and with tiny blockings that force many
 * tile sweeps, and (2) an independent simulator, the npm package `quantum-circuit` (0.9), on a
 * QAOA circuit built from its own h/rx/rz/cx gates. Identity used: H Z H = X, so
 * exp(−iβΣX) = H^{⊗n} exp(−iβΣZ) H^{⊗n} — common practice.
 */
import { createRng } from '../../../shared/engine/random';
import { copyState, createPlusState, createZeroState, normSquared, type StateVector } from '../../../shared/engine/statevector/state';
import { applyQaoaLayer, applyTransverseMixer, diagonalLevels, type LayerBlocking } from '../../../shared/engine/statevector/gates';
import { applyQaoaLayerHadamard, applyTransverseMixerHadamard, hadamardMixerPlan } from '../../../shared/engine/statevector/hadamard-mixer';
import { popcount } from '../../../shared/engine/statevector/hadamard-kernels';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import type { IsingOperator } from '../../../shared/engine/operators/types';

function randomState(n: number, seed: number): StateVector {
  const rng = createRng(seed);
  const s = createZeroState(n);
  for (let i = 0; i < s.amps.length; i++) s.amps[i] = rng.normal();
  const norm = Math.sqrt(normSquared(s));
  for (let i = 0; i < s.amps.length; i++) s.amps[i] /= norm;
  return s;
}
const maxDiff = (a: Float64Array, b: Float64Array): number => {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]));
  return d;
};
function randomOp(n: number, seed: number, integer: boolean): IsingOperator {
  const rng = createRng(seed);
  const I: number[] = [], J: number[] = [], C: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
    if (rng.next() < 0.5) { I.push(i); J.push(j); C.push(integer ? 1 + rng.int(4) : rng.normal()); }
  }
  const linear = new Float64Array(n);
  for (let i = 0; i < n; i++) linear[i] = integer ? rng.int(3) - 1 : rng.normal();
  return { numQubits: n, offset: 0, linear, quadI: Int32Array.from(I), quadJ: Int32Array.from(J), quadCoeff: Float64Array.from(C) };
}

const TINY: LayerBlocking = { lowBits: 3, runBits: 1, tileBits: 3 };
const SMALL: LayerBlocking = { lowBits: 4, runBits: 2, tileBits: 5 };
const cases: [number, LayerBlocking | undefined][] = [
  [1, undefined], [2, undefined], [5, undefined], [12, undefined], [13, undefined], [15, undefined],
  [4, TINY], [7, TINY], [10, TINY], [11, SMALL], [14, SMALL],
];

describe('transverse mixer in the Hadamard basis', () => {
  test('popcount', () => {
    expect([0, 1, 3, 255, 2 ** 31, 2 ** 32 - 1, 2 ** 40 + 5].map(popcount)).toEqual([0, 1, 2, 8, 1, 32, 3]);
  });

  test('the plan: 2m + 1 passes, one weight phase, cost phase on the first pass only', () => {
    const plan = hadamardMixerPlan(24);
    expect(plan.length).toBe(5);
    expect(plan.filter((p) => p.middle).length).toBe(1);
    expect(plan.map((p) => p.kind === 'low' && p.phase)).toEqual([true, false, false, false, false]);
    expect(hadamardMixerPlan(12).length).toBe(1);
    // Every high qubit transformed exactly twice, the weight phase between.
    const seen = new Array(24).fill(0);
    for (const p of plan) if (p.kind === 'high') for (let q = p.lo; q < p.hi; q++) seen[q] += p.middle ? 2 : 1;
    expect(seen.slice(12)).toEqual(new Array(12).fill(2));
  });

  test.each(cases)('equals the rotation-layer kernels at n = %i (blocking %j)', (n, blocking) => {
    const rng = createRng(900 + n);
    const beta = rng.next() * 3 - 1.5, gamma = rng.next() * 2 - 1;
    const start = randomState(n, n);
    const oracle = copyState(start), ours = copyState(start);
    applyTransverseMixer(oracle, beta, blocking);
    applyTransverseMixerHadamard(ours, beta, blocking);
    expect(maxDiff(oracle.amps, ours.amps)).toBeLessThan(1e-10);
    for (const integer of [true, false]) {
      const diag = isingDiagonal(randomOp(n, 5 * n + 1, integer));
      const d = integer ? diagonalLevels(diag)! : diag;
      const o2 = copyState(start), h2 = copyState(start);
      applyQaoaLayer(o2, d, gamma, beta, blocking);
      applyQaoaLayerHadamard(h2, d, gamma, beta, blocking);
      applyQaoaLayer(o2, d, -gamma / 2, 2 * beta, blocking);
      applyQaoaLayerHadamard(h2, d, -gamma / 2, 2 * beta, blocking);
      expect(maxDiff(o2.amps, h2.amps)).toBeLessThan(1e-10);
      expect(normSquared(h2)).toBeCloseTo(1, 12);
    }
  });

  test('rejects a diagonal of the wrong size', () => {
    expect(() => applyQaoaLayerHadamard(createPlusState(4), new Float64Array(8), 0.1, 0.2)).toThrow(RangeError);
  });
});

interface RefCircuit {
  appendGate(name: string, wires: number | number[], opts?: { params: Record<string, string> }): void;
  run(): void;
  stateAsArray(onlyPossible?: boolean): { index: number; amplitude: { re: number; im: number } }[];
}

describe('against quantum-circuit (independent simulator)', () => {
  let QuantumCircuit: new (n: number) => RefCircuit;
  beforeAll(() => {
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
  const num = (v: number): string => v.toPrecision(17);

  test.each([[3, undefined], [6, TINY], [8, SMALL]] as [number, LayerBlocking | undefined][])(
    'p = 2 QAOA circuit at n = %i (blocking %j)', (n, blocking) => {
      const op = randomOp(n, 40 + n, false);
      const angles = [[0.37, -0.81], [-1.2, 0.44]];
      const c = new QuantumCircuit(n);
      for (let q = 0; q < n; q++) c.appendGate('h', q);
      for (const [gamma, beta] of angles) {
        // e^{−iγ h Z} = rz(2γh); e^{−iγ J Z_aZ_b} = cx rz_b(2γJ) cx; mixer = rx(2β) on every qubit.
        for (let q = 0; q < n; q++) c.appendGate('rz', q, { params: { phi: num(2 * gamma * op.linear[q]) } });
        for (let t = 0; t < op.quadCoeff.length; t++) {
          c.appendGate('cx', [op.quadI[t], op.quadJ[t]]);
          c.appendGate('rz', op.quadJ[t], { params: { phi: num(2 * gamma * op.quadCoeff[t]) } });
          c.appendGate('cx', [op.quadI[t], op.quadJ[t]]);
        }
        for (let q = 0; q < n; q++) c.appendGate('rx', q, { params: { theta: num(2 * beta) } });
      }
      c.run();
      const ref = new Float64Array(2 << n);
      for (const e of c.stateAsArray(false)) {
        ref[2 * e.index] = e.amplitude.re;
        ref[2 * e.index + 1] = e.amplitude.im;
      }
      const s = createPlusState(n);
      const diag = isingDiagonal(op);
      for (const [gamma, beta] of angles) applyQaoaLayerHadamard(s, diag, gamma, beta, blocking);
      expect(maxDiff(s.amps, ref)).toBeLessThan(1e-10);
    });
});
