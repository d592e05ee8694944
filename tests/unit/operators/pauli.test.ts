/**
 * Pauli sums act like the textbook matrices: each string is the Kronecker product of the 2×2
 * Pauli matrices (common practice), built independently in helpers.ts.
 */
import { createRng } from '../../../shared/engine/random';
import {
  applyPauliSum, compilePauliSum, exactExpectation, isingToPauliSum, simplifyPauliSum,
} from '../../../shared/engine/operators/pauli';
import { isingDiagonal, expectationOfDiagonal } from '../../../shared/engine/statevector/diagonal';
import type { IsingOperator } from '../../../shared/engine/operators/types';
import { kroneckerMatrix, randomPauliSum, randomState } from './helpers';

describe('Pauli sums', () => {
  test('applyPauliSum equals the Kronecker-product matrix on random operators with X, Y, Z', () => {
    const rng = createRng(21);
    for (const n of [1, 2, 3, 5]) {
      const p = randomPauliSum(n, 7, rng);
      const { re, im, dim } = kroneckerMatrix(p);
      const psi = randomState(n, rng).amps;
      const out = new Float64Array(2 * dim);
      applyPauliSum(p, psi, out);
      for (let r = 0; r < dim; r++) {
        let er = 0, ei = 0;
        for (let c = 0; c < dim; c++) {
          er += re[r * dim + c] * psi[2 * c] - im[r * dim + c] * psi[2 * c + 1];
          ei += re[r * dim + c] * psi[2 * c + 1] + im[r * dim + c] * psi[2 * c];
        }
        expect(out[2 * r]).toBeCloseTo(er, 12);
        expect(out[2 * r + 1]).toBeCloseTo(ei, 12);
      }
    }
  });

  test('Y|0⟩ = i|1⟩ and XYZ-type products follow the Pauli algebra (XY = iZ)', () => {
    const out = new Float64Array(4);
    applyPauliSum({ numQubits: 1, offset: 0, terms: [{ letters: 'Y', coeff: 1 }] }, Float64Array.of(1, 0, 0, 0), out);
    expect(Array.from(out)).toEqual([0, 0, 0, 1]);
    // X(Y|ψ⟩) = iZ|ψ⟩
    const psi = randomState(1, createRng(3)).amps;
    const y = new Float64Array(4), xy = new Float64Array(4), z = new Float64Array(4);
    applyPauliSum({ numQubits: 1, offset: 0, terms: [{ letters: 'Y', coeff: 1 }] }, psi, y);
    applyPauliSum({ numQubits: 1, offset: 0, terms: [{ letters: 'X', coeff: 1 }] }, y, xy);
    applyPauliSum({ numQubits: 1, offset: 0, terms: [{ letters: 'Z', coeff: 1 }] }, psi, z);
    for (let x = 0; x < 2; x++) {
      expect(xy[2 * x]).toBeCloseTo(-z[2 * x + 1], 14);
      expect(xy[2 * x + 1]).toBeCloseTo(z[2 * x], 14);
    }
  });

  test('exactExpectation = ⟨ψ|Hψ⟩ and is real for Hermitian H', () => {
    const rng = createRng(8);
    for (let trial = 0; trial < 5; trial++) {
      const p = randomPauliSum(4, 9, rng);
      const s = randomState(4, rng);
      const hpsi = new Float64Array(s.amps.length);
      applyPauliSum(compilePauliSum(p), s.amps, hpsi);
      let re = 0, im = 0;
      for (let i = 0; i < hpsi.length; i += 2) {
        re += s.amps[i] * hpsi[i] + s.amps[i + 1] * hpsi[i + 1];
        im += s.amps[i] * hpsi[i + 1] - s.amps[i + 1] * hpsi[i];
      }
      expect(exactExpectation(s, p)).toBeCloseTo(re, 12);
      expect(Math.abs(im)).toBeLessThan(1e-12);
    }
  });

  test('isingToPauliSum gives the same energies as the cost diagonal', () => {
    const op: IsingOperator = { numQubits: 3, offset: 1.5, linear: Float64Array.of(0.5, 0, -1), quadI: Int32Array.of(0, 1), quadJ: Int32Array.of(2, 2), quadCoeff: Float64Array.of(2, -0.75) };
    const p = isingToPauliSum(op);
    expect(p.terms.map((t) => t.letters).sort()).toEqual(['IZZ', 'IIZ', 'ZII', 'ZIZ'].sort());
    const s = randomState(3, createRng(4));
    expect(exactExpectation(s, p)).toBeCloseTo(expectationOfDiagonal(s, isingDiagonal(op)), 13);
  });

  test('simplify merges equal strings, moves the identity to the offset, drops zeros', () => {
    const p = simplifyPauliSum({
      numQubits: 2,
      offset: 1,
      terms: [
        { letters: 'XZ', coeff: 0.5 }, { letters: 'II', coeff: 2 }, { letters: 'XZ', coeff: 0.25 },
        { letters: 'YY', coeff: 1 }, { letters: 'YY', coeff: -1 }, { letters: 'ZI', coeff: 1e-15 },
      ],
    });
    expect(p).toEqual({ numQubits: 2, offset: 3, terms: [{ letters: 'XZ', coeff: 0.75 }] });
    expect(() => simplifyPauliSum({ numQubits: 2, offset: 0, terms: [{ letters: 'XQ', coeff: 1 }] })).toThrow(/I, X, Y, Z/);
  });
});
