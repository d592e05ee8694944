/**
 * The WebAssembly SIMD kernels (server/wasm/sim-kernels.wat, assembled here from the source by
 * the npm package `wabt`, so the test does not depend on a built file) must give the amplitudes
 * of the JavaScript kernels (gates.ts rotation layers, the oracle) to 1e-10; states they did not
 * allocate, sizes above their limit and too many levels must fall back to the JS kernels.
 */
import { createRng } from '../../../shared/engine/random';
import { createPlusState, normSquared, type StateVector } from '../../../shared/engine/statevector/state';
import { applyQaoaLayer, applyTransverseMixer, diagonalLevels } from '../../../shared/engine/statevector/gates';
import type { DiagonalLevels } from '../../../shared/engine/statevector/layer-kernels';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { createWasmBackend } from '../../../shared/engine/statevector/wasm-kernels';
import type { LayerBackend } from '../../../shared/engine/statevector/backend';
import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import type { IsingOperator } from '../../../shared/engine/operators/types';
import { assembleSimKernels } from '../../../server/lib/sim-wasm';

let backend: LayerBackend;
beforeAll(async () => {
  backend = createWasmBackend(new WebAssembly.Module(await assembleSimKernels()), { maxQubits: 20 });
});

const maxDiff = (a: Float64Array, b: Float64Array): number => {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]));
  return d;
};
function ringOp(n: number, seed: number): IsingOperator {
  const rng = createRng(seed);
  const I: number[] = [], J: number[] = [], C: number[] = [];
  for (let i = 0; i + 1 < n; i++) { I.push(i); J.push(i + 1); C.push(-(1 + rng.int(4)) / 2); }
  for (let i = 0; i + 3 < n; i += 3) { I.push(i); J.push(i + 3); C.push(rng.normal()); }
  const linear = new Float64Array(n);
  for (let i = 0; i < n; i++) linear[i] = rng.int(3) - 1;
  return { numQubits: n, offset: 0, linear, quadI: Int32Array.from(I), quadJ: Int32Array.from(J), quadCoeff: Float64Array.from(C) };
}
/** A random normalised state written into `s` (same for every call with one seed). */
function fillRandom(s: StateVector, seed: number): StateVector {
  const rng = createRng(seed);
  for (let i = 0; i < s.amps.length; i++) s.amps[i] = rng.normal();
  const norm = Math.sqrt(normSquared(s));
  for (let i = 0; i < s.amps.length; i++) s.amps[i] /= norm;
  return s;
}

describe('WebAssembly SIMD kernels against the JavaScript kernels', () => {
  test.each([1, 2, 3, 5, 11, 12, 13, 15, 18])('n = %i: mixer and QAOA layers (levels u16 and u32, plain diagonal)', (n) => {
    const w = fillRandom(createPlusState(n, { kernels: backend }), n);
    const j = fillRandom(createPlusState(n), n);
    expect(w.amps.buffer).toBeInstanceOf(SharedArrayBuffer); // lives in the WebAssembly memory
    const diag = isingDiagonal(ringOp(n, n));
    const levels = diagonalLevels(diag)!;
    const wide: DiagonalLevels = { levels: levels.levels, index: Uint32Array.from(levels.index) };
    const steps: [Float64Array | DiagonalLevels | null, number, number][] = [
      [null, 0, 0.83], [levels, 0.41, -0.27], [diag, -1.3, 0.6], [wide, 0.77, 1.9], [levels, -0.2, 0.05],
    ];
    for (const [d, gamma, beta] of steps) {
      if (d) {
        expect(backend.applyQaoaLayer(w, d, gamma, beta)).toBe(true);
        applyQaoaLayer(j, d, gamma, beta);
      } else {
        expect(backend.applyTransverseMixer(w, beta)).toBe(true);
        applyTransverseMixer(j, beta);
      }
      expect(maxDiff(w.amps, j.amps)).toBeLessThan(1e-10);
    }
  });

  test('falls back: foreign states, sizes above the limit', () => {
    const plain = createPlusState(4);
    expect(backend.applyQaoaLayer(plain, new Float64Array(16), 0.1, 0.2)).toBe(false);
    expect(backend.applyTransverseMixer(plain, 0.2)).toBe(false);
    expect(backend.allocate(21)).toBeNull();
    const big = createPlusState(21, { kernels: backend });
    expect(Object.prototype.toString.call(big.amps.buffer)).toBe('[object ArrayBuffer]'); // ordinary allocation, JS kernels
    expect(backend.applyTransverseMixer(big, 0.1)).toBe(false);
  });

  test('the QAOA ansatz gives the same state with and without the kernels', () => {
    const n = 14;
    const diag = diagonalLevels(isingDiagonal(ringOp(n, 3)))!;
    const params = Float64Array.of(0.3, -0.6, 0.9, 0.25);
    const fast = createQaoaAnsatz({ numQubits: n, layers: 2, energyDiagonal: diag, stateOptions: { kernels: backend } }).prepare(params);
    const ref = createQaoaAnsatz({ numQubits: n, layers: 2, energyDiagonal: diag }).prepare(params);
    expect(fast.amps.buffer).toBeInstanceOf(SharedArrayBuffer);
    expect(maxDiff(fast.amps, ref.amps)).toBeLessThan(1e-10);
  });
});
