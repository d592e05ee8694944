/**
 * State allocation limits, the cost diagonal and sampling.
 * Sources: state size 16·2ⁿ bytes (references.md "Statevector performance"); Ising energy
 * H(s) = offset + Σ h_i s_i + Σ J_ij s_i s_j with s = 1 − 2·bit (operators/types.ts convention,
 * evaluated directly here); Born rule sampling checked with a chi-square bound (common practice).
 */
import { createRng } from '../../../shared/engine/random';
import {
  DEFAULT_MAX_QUBITS, QubitLimitError, createPlusState, createZeroState, probabilities, stateBytes,
  innerProduct, normSquared, stateFromAmplitudes,
} from '../../../shared/engine/statevector/state';
import { applyRy, applyH } from '../../../shared/engine/statevector/gates';
import { expectationOfDiagonal, isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { sampleBasisStates } from '../../../shared/engine/statevector/sample';
import type { IsingOperator } from '../../../shared/engine/operators/types';

describe('memory check', () => {
  test('40 qubits throws QubitLimitError with a clear message, allocating nothing', () => {
    const before = process.memoryUsage().arrayBuffers;
    let err: unknown;
    try {
      createZeroState(40);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(QubitLimitError);
    const msg = (err as Error).message;
    expect(msg).toMatch(/40-qubit state needs 16\.0 TiB/);
    expect(msg).toMatch(/limit of 26 qubits/);
    expect(msg).toMatch(/fewer depots|raise maxQubits/);
    expect((err as QubitLimitError).bytesNeeded).toBe(stateBytes(40));
    expect(process.memoryUsage().arrayBuffers - before).toBeLessThan(1 << 20);
  });
  test('a configured limit is honoured by every constructor', () => {
    expect(DEFAULT_MAX_QUBITS).toBe(26);
    expect(() => createPlusState(11, { maxQubits: 10 })).toThrow(QubitLimitError);
    expect(() => isingDiagonal({ numQubits: 11, offset: 0, linear: new Float64Array(11), quadI: new Int32Array(0), quadJ: new Int32Array(0), quadCoeff: new Float64Array(0) }, { maxQubits: 10 })).toThrow(QubitLimitError);
    expect(createZeroState(10, { maxQubits: 10 }).amps.length).toBe(2048);
    expect(() => createZeroState(2.5)).toThrow(RangeError);
  });
});

describe('state helpers', () => {
  test('⟨ψ|ψ⟩ = 1 after unitary gates, ⟨0|+⟩ = 2^(−n/2), conjugate symmetry of ⟨a|b⟩', () => {
    const plus = createPlusState(5);
    const zero = createZeroState(5);
    expect(innerProduct(zero, plus)[0]).toBeCloseTo(2 ** -2.5, 15);
    const s = stateFromAmplitudes(1, [0.6, 0, 0, 0.8]);
    applyRy(s, 0, 0.9);
    expect(normSquared(s)).toBeCloseTo(1, 14);
    const t = stateFromAmplitudes(1, [0, 1, 0, 0]);
    const ab = innerProduct(s, t), ba = innerProduct(t, s);
    expect(ab[0]).toBeCloseTo(ba[0], 15);
    expect(ab[1]).toBeCloseTo(-ba[1], 15);
    expect(() => stateFromAmplitudes(2, [1, 0])).toThrow(/expected 8 numbers/);
  });
});

describe('cost diagonal', () => {
  test('isingDiagonal equals the direct energy sum on random operators', () => {
    const rng = createRng(5);
    for (const n of [1, 2, 5, 9]) {
      const linear = Float64Array.from({ length: n }, () => rng.normal());
      const qi: number[] = [], qj: number[] = [], qc: number[] = [];
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i !== j && rng.next() < 0.4) { qi.push(j); qj.push(i); qc.push(rng.normal()); }
      const op: IsingOperator = { numQubits: n, offset: 0.3, linear, quadI: Int32Array.from(qi), quadJ: Int32Array.from(qj), quadCoeff: Float64Array.from(qc) };
      const d = isingDiagonal(op);
      for (let x = 0; x < 1 << n; x++) {
        const s = (q: number) => 1 - 2 * ((x >> q) & 1);
        let e = op.offset;
        for (let q = 0; q < n; q++) e += linear[q] * s(q);
        for (let t = 0; t < qc.length; t++) e += qc[t] * s(qi[t]) * s(qj[t]);
        expect(d[x]).toBeCloseTo(e, 12);
      }
    }
  });
  test('⟨+|H|+⟩ of a max-cut cost is half the total weight (p = 0, references.md)', () => {
    // C = Σ w (1 − Z_uZ_v)/2 on a triangle with weights 1, 2, 3: offset 3, J = −w/2.
    const op: IsingOperator = { numQubits: 3, offset: 3, linear: new Float64Array(3), quadI: Int32Array.of(0, 0, 1), quadJ: Int32Array.of(1, 2, 2), quadCoeff: Float64Array.of(-0.5, -1, -1.5) };
    expect(expectationOfDiagonal(createPlusState(3), isingDiagonal(op))).toBeCloseTo(3, 14);
  });
});

describe('sampling', () => {
  test('counts follow |ψ|² (chi-square below the 99.9 % point) and are reproducible from the seed', () => {
    const s = createZeroState(3);
    applyRy(s, 0, 1.1);
    applyH(s, 1);
    applyRy(s, 2, 2.5);
    const p = probabilities(s);
    const shots = 20000;
    const counts = sampleBasisStates(s, shots, createRng(9));
    let total = 0, chi2 = 0;
    for (let x = 0; x < 8; x++) {
      const c = counts.get(x) ?? 0;
      total += c;
      chi2 += (c - shots * p[x]) ** 2 / (shots * p[x]);
    }
    expect(total).toBe(shots);
    expect(chi2).toBeLessThan(24.3); // χ²(7 dof) 99.9 % quantile (common practice)
    expect(sampleBasisStates(s, shots, createRng(9))).toEqual(counts);
  });
  test('zero-probability states are never drawn', () => {
    const s = createZeroState(4);
    applyH(s, 2);
    const counts = sampleBasisStates(s, 5000, createRng(1));
    expect([...counts.keys()].sort()).toEqual([0, 4]);
  });
});
