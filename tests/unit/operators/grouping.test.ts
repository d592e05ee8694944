/**
 * Qubit-wise commuting groups. Checks from references.md "Shot noise": IZIZ and ZZXZ can be
 * measured together, ZZZZ and ZZZX cannot (common practice).
 */
import { createRng } from '../../../shared/engine/random';
import { groupQubitWise, qubitWiseCommute } from '../../../shared/engine/operators/grouping';
import type { PauliSum } from '../../../shared/engine/operators/types';
import { randomPauliSum } from './helpers';

describe('qubit-wise commuting groups', () => {
  test('IZIZ ~ ZZXZ commute qubit-wise; ZZZZ and ZZZX do not (common practice)', () => {
    expect(qubitWiseCommute('IZIZ', 'ZZXZ')).toBe(true);
    expect(qubitWiseCommute('ZZZZ', 'ZZZX')).toBe(false);
    expect(qubitWiseCommute('XX', 'YY')).toBe(false); // they commute, but not qubit-wise
  });

  test('every group is pairwise qubit-wise commuting, covers every term once, basis agrees', () => {
    const rng = createRng(12);
    for (let trial = 0; trial < 20; trial++) {
      const p = randomPauliSum(5, 25, rng);
      const { groups, basis } = groupQubitWise(p);
      const seen = groups.flat().sort((a, b) => a - b);
      expect(seen).toEqual(p.terms.map((_, i) => i));
      groups.forEach((g, gi) => {
        for (const a of g) {
          for (const b of g) expect(qubitWiseCommute(p.terms[a].letters, p.terms[b].letters)).toBe(true);
          expect(qubitWiseCommute(p.terms[a].letters, basis[gi])).toBe(true);
        }
      });
      // Greedy colouring never uses more colours than max degree + 1.
      let maxDeg = 0;
      for (const a of p.terms) maxDeg = Math.max(maxDeg, p.terms.filter((b) => !qubitWiseCommute(a.letters, b.letters)).length);
      expect(groups.length).toBeLessThanOrEqual(maxDeg + 1);
    }
  });

  test('the bit-mask clash test agrees with the letter-by-letter definition on random pairs', () => {
    const rng = createRng(3);
    for (let t = 0; t < 300; t++) {
      const p = randomPauliSum(3, 2, rng);
      const { groups } = groupQubitWise(p);
      expect(groups.length).toBe(qubitWiseCommute(p.terms[0].letters, p.terms[1].letters) ? 1 : 2);
    }
  });

  test('an all-Z operator is one group measured in the Z basis', () => {
    const p: PauliSum = { numQubits: 4, offset: 0, terms: [{ letters: 'ZZII', coeff: 1 }, { letters: 'IZZI', coeff: 2 }, { letters: 'ZIIZ', coeff: -1 }, { letters: 'IIIZ', coeff: 3 }] };
    const { groups, basis } = groupQubitWise(p);
    expect(groups).toEqual([[0, 1, 2, 3]]);
    expect(basis).toEqual(['ZZZZ']);
  });

  test('transverse-field chain splits into exactly the Z group and the X group', () => {
    const p: PauliSum = { numQubits: 3, offset: 0, terms: [{ letters: 'ZZI', coeff: -1 }, { letters: 'IZZ', coeff: -1 }, { letters: 'XII', coeff: -0.5 }, { letters: 'IXI', coeff: -0.5 }] };
    const { groups, basis } = groupQubitWise(p);
    expect(groups.length).toBe(2);
    expect(new Set(basis)).toEqual(new Set(['ZZZ', 'XXI']));
  });
});
