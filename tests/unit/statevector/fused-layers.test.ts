/**
 * The fused, cache-blocked layers must equal the plain gate-by-gate product (one sweep per
 * qubit) exactly up to round-off (1e-12), at sizes below, at and above the block size, and with
 * tiny blockings that force several high-qubit sweeps. Reference: the definition
 * exp(−iβ Σ_j X_j) = ∏_j exp(−iβ X_j) (the X_j commute) — common practice.
 */
import { createRng } from '../../../shared/engine/random';
import { copyState, createZeroState, normSquared, type StateVector } from '../../../shared/engine/statevector/state';
import {
  applyDiagonalPhase, applyProductLayer, applyQaoaLayer, applyRotationLayer, applyRx, applyRy, applyRz,
  applySingleQubit, applyTransverseMixer, diagonalLevels, applyCz, applyCzChain, type LayerBlocking,
} from '../../../shared/engine/statevector/gates';

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

const TINY: LayerBlocking = { lowBits: 3, runBits: 1, tileBits: 3 };
const SMALL: LayerBlocking = { lowBits: 4, runBits: 2, tileBits: 5 };
const cases: [number, LayerBlocking | undefined][] = [
  [1, undefined], [5, undefined], [12, undefined], [13, undefined], [15, undefined],
  [7, TINY], [10, TINY], [11, SMALL], [14, SMALL],
];

describe('fused layers equal gate-by-gate products', () => {
  test.each(cases)('mixer, rotation layers and QAOA layer at n = %i (blocking %j)', (n, blocking) => {
    const rng = createRng(77 + n);
    const beta = rng.next() * 3 - 1.5, gamma = rng.next() * 2 - 1;
    const start = randomState(n, n);

    const fused = copyState(start);
    applyTransverseMixer(fused, beta, blocking);
    const plain = copyState(start);
    for (let q = 0; q < n; q++) applyRx(plain, q, 2 * beta);
    expect(maxDiff(fused.amps, plain.amps)).toBeLessThan(1e-12);

    for (const axis of ['x', 'y', 'z'] as const) {
      const angles = Float64Array.from({ length: n }, () => rng.next() * 6 - 3);
      const f = copyState(start);
      applyRotationLayer(f, axis, angles, blocking);
      const p = copyState(start);
      for (let q = 0; q < n; q++) (axis === 'x' ? applyRx : axis === 'y' ? applyRy : applyRz)(p, q, angles[q]);
      expect(maxDiff(f.amps, p.amps)).toBeLessThan(1e-12);
    }

    // General product layer with arbitrary (non-unitary is fine for linear algebra) 2×2 gates.
    const mats = Float64Array.from({ length: 8 * n }, () => rng.normal());
    const f = copyState(start);
    applyProductLayer(f, mats, blocking);
    const p = copyState(start);
    for (let q = 0; q < n; q++) applySingleQubit(p, q, mats.subarray(8 * q, 8 * q + 8));
    expect(maxDiff(f.amps, p.amps)).toBeLessThan(1e-12);

    // QAOA layer: integer-valued diagonal (levels path) and a real-valued one.
    for (const integer of [true, false]) {
      const diag = Float64Array.from({ length: 1 << n }, () => (integer ? rng.int(9) - 4 : rng.normal()));
      const q1 = copyState(start);
      applyQaoaLayer(q1, integer ? diagonalLevels(diag)! : diag, gamma, beta, blocking);
      const q2 = copyState(start);
      applyDiagonalPhase(q2, diag, gamma);
      for (let q = 0; q < n; q++) applyRx(q2, q, 2 * beta);
      expect(maxDiff(q1.amps, q2.amps)).toBeLessThan(1e-12);
    }
  });

  test('n = 19 at the default blocking (two high-qubit sweeps): mixer and QAOA layer', () => {
    const n = 19;
    const start = randomState(n, 5);
    const diag = Float64Array.from({ length: 1 << n }, (_, x) => (x * 7919) % 13);
    const fused = copyState(start);
    applyQaoaLayer(fused, diagonalLevels(diag)!, 0.7, -0.4);
    const plain = copyState(start);
    applyDiagonalPhase(plain, diag, 0.7);
    for (let q = 0; q < n; q++) applyRx(plain, q, -0.8);
    expect(maxDiff(fused.amps, plain.amps)).toBeLessThan(1e-12);
  });

  test('CZ chain in one pass equals the CZ gates one by one (pairs below, above and across the 12-bit split)', () => {
    const n = 15;
    const start = randomState(n, 9);
    const pairs = Int32Array.of(0, 1, 3, 11, 12, 14, 2, 13, 11, 12, 5, 14, 13, 12, 0, 1);
    const chain = copyState(start);
    applyCzChain(chain, pairs);
    const plain = copyState(start);
    for (let k = 0; k < pairs.length; k += 2) applyCz(plain, pairs[k], pairs[k + 1]);
    expect(maxDiff(chain.amps, plain.amps)).toBe(0);
  });

  test('diagonalLevels gives back every entry and refuses when there are too many levels', () => {
    const diag = Float64Array.of(3, -1, 3, 0.5, -1, 0.5, 7, 3);
    const lv = diagonalLevels(diag)!;
    expect(lv.levels.length).toBe(4);
    expect(Array.from(lv.index, (k) => lv.levels[k])).toEqual(Array.from(diag));
    expect(diagonalLevels(diag, 3)).toBeNull();
  });
});
