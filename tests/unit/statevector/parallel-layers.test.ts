/**
 * The worker-thread runner must give exactly the single-thread result (same operations per
 * amplitude, only split differently), which is itself checked against the gate-by-gate product
 * and the quantum-circuit package in the other files of this folder.
 */
import { createRng } from '../../../shared/engine/random';
import { createPlusState, createZeroState, type StateVector } from '../../../shared/engine/statevector/state';
import { applyQaoaLayer, applyTransverseMixer, diagonalLevels } from '../../../shared/engine/statevector/gates';
import { createParallelLayers, type ParallelLayers } from '../../../shared/engine/statevector/parallel-layers';

function randomShared(n: number, seed: number): StateVector {
  const rng = createRng(seed);
  const s = createZeroState(n, { shared: true });
  for (let i = 0; i < s.amps.length; i++) s.amps[i] = rng.normal();
  return s;
}
const copyShared = (s: StateVector): StateVector => {
  const c = createZeroState(s.numQubits, { shared: true });
  c.amps.set(s.amps);
  return c;
};

/** Number of positions where the two arrays differ at all (jest's toEqual is slow on big typed arrays). */
const mismatches = (a: Float64Array, b: Float64Array): number => {
  let k = a.length === b.length ? 0 : 1;
  for (let i = 0; i < Math.min(a.length, b.length); i++) if (a[i] !== b[i]) k++;
  return k;
};

let runner: ParallelLayers;
beforeAll(() => {
  runner = createParallelLayers({ threads: 2 });
});
afterAll(async () => {
  await runner.close();
});

describe('worker-thread layers', () => {
  test.each([
    [5, { lowBits: 3, runBits: 1, tileBits: 3 }],
    [13, { lowBits: 12, runBits: 8, tileBits: 14 }],
    [17, { lowBits: 12, runBits: 8, tileBits: 14 }],
    [15, { lowBits: 8, runBits: 3, tileBits: 6 }],
    [11, { lowBits: 4, runBits: 2, tileBits: 5 }],
  ])('n = %i (blocking %j): QAOA layers and mixer are bit-for-bit the single-thread ones', (n, blocking) => {
    const start = randomShared(n, n);
    const diag = Float64Array.from({ length: 1 << n }, (_, x) => (x * 31) % 11 - 5);
    const levels = diagonalLevels(diag)!;
    const par = copyShared(start), one = copyShared(start);
    for (const [g, b] of [[0.3, 0.7], [-1.1, 2.0], [0.5, -0.2]]) {
      runner.applyQaoaLayer(par, levels, g, b, blocking);
      applyQaoaLayer(one, levels, g, b, blocking);
      runner.applyQaoaLayer(par, diag, g, b, blocking);
      applyQaoaLayer(one, diag, g, b, blocking);
      runner.applyTransverseMixer(par, b, blocking);
      applyTransverseMixer(one, b, blocking);
    }
    expect(mismatches(par.amps, one.amps)).toBe(0);
  });

  test('a second state on the same runner is picked up (buffers re-sent)', () => {
    const a = createPlusState(14, { shared: true }), b = createPlusState(14);
    runner.applyTransverseMixer(a, 0.4);
    applyTransverseMixer(b, 0.4);
    expect(mismatches(a.amps, b.amps)).toBe(0);
  });

  test('a state outside shared memory is refused with advice', () => {
    expect(() => runner.applyTransverseMixer(createPlusState(4), 0.1)).toThrow(/shared: true/);
  });
});
