/**
 * The WebAssembly kernels split over worker threads (parallel-wasm.ts) must give exactly the
 * one-thread WebAssembly result (each amplitude sees the same operations in the same order) and
 * the JavaScript kernels' amplitudes (gates.ts, the oracle) to 1e-10 — across the passes whose
 * tiles mix the halves the threads worked on. The product's blocking and a small one (several
 * high-qubit groups at these sizes) are both run; three threads check an uneven split.
 */
import { createRng } from '../../../shared/engine/random';
import { createPlusState, normSquared, type StateVector } from '../../../shared/engine/statevector/state';
import { applyQaoaLayer, applyTransverseMixer, diagonalLevels, type LayerBlocking } from '../../../shared/engine/statevector/gates';
import type { DiagonalLevels } from '../../../shared/engine/statevector/layer-kernels';
import { createWasmBackend, WASM_BLOCKING } from '../../../shared/engine/statevector/wasm-kernels';
import { createParallelWasmBackend, type ParallelWasmBackend } from '../../../shared/engine/statevector/parallel-wasm';
import type { LayerBackend } from '../../../shared/engine/statevector/backend';
import { assembleSimKernels } from '../../../server/lib/sim-wasm';

// The product's blocking (3 passes up to n = 24) and a small one whose plans have several
// high-qubit groups at these sizes (passes going up and coming back down).
const SMALL: LayerBlocking = { lowBits: 10, runBits: 4, tileBits: 8 };
type Trio = { one: LayerBackend; two: ParallelWasmBackend; three: ParallelWasmBackend };
const trios: Record<string, Trio> = {};
beforeAll(async () => {
  const module = new WebAssembly.Module(await assembleSimKernels());
  for (const [name, blocking] of [['wasm', WASM_BLOCKING], ['small', SMALL]] as const) {
    trios[name] = {
      one: createWasmBackend(module, { maxQubits: 19, blocking }),
      // minQubits 0: split every pass with enough items, however small the state.
      two: createParallelWasmBackend(module, { threads: 2, minQubits: 0, maxQubits: 19, blocking }),
      three: createParallelWasmBackend(module, { threads: 3, minQubits: 0, maxQubits: 19, blocking }),
    };
  }
});
afterAll(async () => {
  await Promise.all(Object.values(trios).flatMap((t) => [t.two.close(), t.three.close()]));
});

const maxDiff = (a: Float64Array, b: Float64Array): number => {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]));
  return d;
};
const mismatches = (a: Float64Array, b: Float64Array): number => {
  let k = 0;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) k++;
  return k;
};
function fillRandom(s: StateVector, seed: number): StateVector {
  const rng = createRng(seed);
  for (let i = 0; i < s.amps.length; i++) s.amps[i] = rng.normal();
  const norm = Math.sqrt(normSquared(s));
  for (let i = 0; i < s.amps.length; i++) s.amps[i] /= norm;
  return s;
}

describe('WebAssembly kernels on worker threads', () => {
  test.each([
    [15, 'wasm'], [18, 'wasm'], [13, 'small'], [19, 'small'],
  ])('n = %i, %s blocking: 2 and 3 threads equal 1 thread bit for bit and the JS kernels to 1e-10', (n, name) => {
    const { one, two, three } = trios[name];
    const states = [one, two, three].map((b) => fillRandom(createPlusState(n, { kernels: b }), n));
    const js = fillRandom(createPlusState(n), n);
    const diag = Float64Array.from({ length: 2 ** n }, (_, x) => ((x * 2654435761) % 97) / 7 - 5);
    const levels = diagonalLevels(diag)!;
    const wide: DiagonalLevels = { levels: levels.levels, index: Uint32Array.from(levels.index) };
    const steps: [Float64Array | DiagonalLevels | null, number, number][] = [
      [null, 0, 0.83], [levels, 0.41, -0.27], [diag, -1.3, 0.6], [wide, 0.77, 1.9], [levels, -0.2, 0.05],
    ];
    for (const [d, gamma, beta] of steps) {
      [one, two, three].forEach((b, k) => {
        expect(d ? b.applyQaoaLayer(states[k], d, gamma, beta) : b.applyTransverseMixer(states[k], beta)).toBe(true);
      });
      if (d) applyQaoaLayer(js, d, gamma, beta);
      else applyTransverseMixer(js, beta);
    }
    expect(mismatches(states[1].amps, states[0].amps)).toBe(0);
    expect(mismatches(states[2].amps, states[0].amps)).toBe(0);
    expect(maxDiff(states[1].amps, js.amps)).toBeLessThan(1e-10);
  });

  test('a new state (new memory) reaches the workers; the old one keeps working', () => {
    const { one, two } = trios.wasm;
    const a = fillRandom(createPlusState(14, { kernels: two }), 1);
    const b = fillRandom(createPlusState(14, { kernels: two }), 2);
    const ra = fillRandom(createPlusState(14, { kernels: one }), 1);
    const rb = fillRandom(createPlusState(14, { kernels: one }), 2);
    for (const beta of [0.3, -0.9]) {
      two.applyTransverseMixer(a, beta); one.applyTransverseMixer(ra, beta);
      two.applyTransverseMixer(b, beta); one.applyTransverseMixer(rb, beta);
    }
    expect(mismatches(a.amps, ra.amps)).toBe(0);
    expect(mismatches(b.amps, rb.amps)).toBe(0);
  });
});
