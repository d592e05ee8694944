import { createRng } from '../../../shared/engine/random';
import { isingEnergyAt, isingToQubo, quboEnergyAt, quboToIsing } from '../../../shared/engine/encodings/qubo';
import type { Qubo } from '../../../shared/engine/encodings/types';

// Identity x = (1 − s)/2 between bits and spins: common practice (e.g. Lucas, Front. Phys. 2:5 (2014), §2).
function randomQubo(seed: number, n: number): Qubo {
  const rng = createRng(seed);
  const qi: number[] = [], qj: number[] = [], qc: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < 0.6) { qi.push(i); qj.push(j); qc.push(rng.normal() * 3); }
  return {
    numVars: n, offset: rng.normal(), linear: Float64Array.from({ length: n }, () => rng.normal() * 2),
    quadI: Int32Array.from(qi), quadJ: Int32Array.from(qj), quadCoeff: Float64Array.from(qc),
  };
}

describe('QUBO ⇄ Ising (x = (1 − s)/2, common practice)', () => {
  test.each([1, 2, 3, 4, 5])('energies agree on every assignment (seed %i)', (seed) => {
    const n = 3 + seed;
    const q = randomQubo(seed, n);
    const op = quboToIsing(q);
    for (let x = 0; x < 2 ** n; x++) expect(isingEnergyAt(op, x)).toBeCloseTo(quboEnergyAt(q, x), 10);
    const back = isingToQubo(op);
    for (let x = 0; x < 2 ** n; x++) expect(quboEnergyAt(back, x)).toBeCloseTo(quboEnergyAt(q, x), 10);
  });

  test('round trip restores every coefficient', () => {
    const q = randomQubo(11, 7);
    const back = isingToQubo(quboToIsing(q));
    expect(back.offset).toBeCloseTo(q.offset, 12);
    back.linear.forEach((c, i) => expect(c).toBeCloseTo(q.linear[i], 12));
    expect(Array.from(back.quadI)).toEqual(Array.from(q.quadI));
    back.quadCoeff.forEach((c, t) => expect(c).toBeCloseTo(q.quadCoeff[t], 12));
    const op = quboToIsing(q);
    const op2 = quboToIsing(isingToQubo(op));
    op2.linear.forEach((c, i) => expect(c).toBeCloseTo(op.linear[i], 12));
    op2.quadCoeff.forEach((c, t) => expect(c).toBeCloseTo(op.quadCoeff[t], 12));
  });

  test('bit 1 means spin −1 (engine qubit convention, operators/types.ts)', () => {
    // x₀ alone: E = x₀ → Ising 1/2 − s₀/2, so state index 1 (bit 0 set) has energy 1.
    const op = quboToIsing({ numVars: 1, offset: 0, linear: Float64Array.of(1), quadI: new Int32Array(0), quadJ: new Int32Array(0), quadCoeff: new Float64Array(0) });
    expect(op.linear[0]).toBeCloseTo(-0.5, 15);
    expect(isingEnergyAt(op, 1)).toBeCloseTo(1, 15);
    expect(isingEnergyAt(op, 0)).toBeCloseTo(0, 15);
  });
});
