import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import type { IsingOperator } from '../../../shared/engine/operators/types';
import { createRng, type Rng } from '../../../shared/engine/random';
import { expectationOfDiagonal, isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { level1Graph } from '../../../shared/engine/variational/level1-graph';
import { level1Coefficients, level1Correlations, level1Energy, level1ExpectationOf } from '../../../shared/engine/variational/level1';
import { problemOf, randomGraph } from '../encodings/fixtures';

/** A random weighted Ising operator on n qubits: G(n, p) couplings, optional fields. */
function randomIsing(rng: Rng, n: number, p: number, withFields: boolean): IsingOperator {
  const I: number[] = [], Jx: number[] = [], C: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) { I.push(i); Jx.push(j); C.push(rng.normal() * 1.3); }
  const linear = new Float64Array(n);
  if (withFields) for (let i = 0; i < n; i++) linear[i] = rng.next() < 0.7 ? rng.normal() : 0;
  return { numQubits: n, offset: rng.normal(), linear, quadI: Int32Array.from(I), quadJ: Int32Array.from(Jx), quadCoeff: Float64Array.from(C) };
}

/** One Pauli-Z product as an Ising operator (for its expectation on the statevector). */
function zOperator(n: number, qubits: number[]): IsingOperator {
  const linear = new Float64Array(n);
  if (qubits.length === 1) linear[qubits[0]] = 1;
  return { numQubits: n, offset: 0, linear, quadI: Int32Array.from(qubits.length === 2 ? [qubits[0]] : []), quadJ: Int32Array.from(qubits.length === 2 ? [qubits[1]] : []), quadCoeff: Float64Array.from(qubits.length === 2 ? [1] : []) };
}

describe('level-1 QAOA closed form equals the statevector (Ozaeta, van Dam & McMahon 2022)', () => {
  test.each([
    [1, 6, 0.6, false], [2, 9, 0.5, true], [3, 12, 0.35, true], [4, 14, 0.3, false], [5, 16, 0.25, true], [6, 20, 0.15, true],
  ])('seed %i: %i qubits, density %f, fields %s — energy, every ⟨Z_u⟩ and every ⟨Z_uZ_v⟩ to 1e-10', (seed, n, p, withFields) => {
    const rng = createRng(1000 + seed);
    const op = randomIsing(rng, n, p, withFields);
    const g = level1Graph(op);
    const ansatz = createQaoaAnsatz({ numQubits: n, layers: 1, energyDiagonal: isingDiagonal(op) });
    for (let trial = 0; trial < 2; trial++) {
      const gamma = (rng.next() - 0.5) * 3, beta = (rng.next() - 0.5) * Math.PI;
      const state = ansatz.prepare([gamma, beta]);
      const co = level1Coefficients(g, gamma);
      expect(Math.abs(level1Energy(co, beta) - expectationOfDiagonal(state, isingDiagonal(op)))).toBeLessThan(1e-10);
      const { z, zz } = level1Correlations(co, beta);
      const checkZ = n <= 12 ? n : 4; // the 2ⁿ diagonal per observable is the slow part
      for (let u = 0; u < checkZ; u++) expect(Math.abs(z[u] - expectationOfDiagonal(state, isingDiagonal(zOperator(n, [u]))))).toBeLessThan(1e-10);
      const terms = Math.min(op.quadCoeff.length, n <= 12 ? 1e9 : 6);
      for (let t = 0; t < terms; t++) {
        const exact = expectationOfDiagonal(state, isingDiagonal(zOperator(n, [op.quadI[t], op.quadJ[t]])));
        expect(Math.abs(zz[t] - exact)).toBeLessThan(1e-10);
      }
    }
  });

  test('weighted max-cut with pins (pins become fields): expected cut equals the statevector', () => {
    const rng = createRng(77);
    const n = 13;
    const edges = randomGraph(rng, n, 0.4, () => 0.3 + 2 * rng.next());
    const enc = encodeMaxCut(problemOf(n, edges, { kind: 'maxcut', pins: { '1': 1, '6': 0 } }));
    expect(enc.operator.linear.some((x) => x !== 0)).toBe(true);
    const diag = isingDiagonal(enc.operator);
    const state = createQaoaAnsatz({ numQubits: enc.numQubits, layers: 1, energyDiagonal: diag }).prepare([0.41, -0.33]);
    const energy = level1Energy(level1Coefficients(level1Graph(enc.operator), 0.41), -0.33);
    expect(Math.abs(enc.valueOfEnergy(energy) - enc.valueOfEnergy(expectationOfDiagonal(state, diag)))).toBeLessThan(1e-10);
  });
});

describe('level-1 expectation of another operator in the same state', () => {
  test('value operator with pairs the energy lacks (uncoupled correlations) equals the statevector', () => {
    const rng = createRng(12);
    const n = 10;
    const op = randomIsing(rng, n, 0.3, true);
    const other = randomIsing(rng, n, 0.6, true); // many of its pairs are not couplings of op
    const gamma = 0.37, beta = -0.21;
    const state = createQaoaAnsatz({ numQubits: n, layers: 1, energyDiagonal: isingDiagonal(op) }).prepare([gamma, beta]);
    const g = level1Graph(op);
    const closed = level1ExpectationOf(g, level1Coefficients(g, gamma), beta, other);
    expect(Math.abs(closed - expectationOfDiagonal(state, isingDiagonal(other)))).toBeLessThan(1e-10);
  });
});
