/**
 * Exact diagonalisation against Pfeuty's closed form for the periodic transverse-field Ising chain
 * (Pfeuty, Ann. Phys. 57, 79 (1970); see tfim.ts), and Lanczos against dense on random operators
 * with Y terms. Dense n = 10 lives in dense-n10.test.ts (it takes a few seconds alone).
 */
import { createRng } from '../../../shared/engine/random';
import { groundEnergyDense, spectrumDense } from '../../../shared/engine/linalg/dense';
import { groundEnergyLanczos, lanczosLowest } from '../../../shared/engine/linalg/lanczos';
import { simplifyPauliSum } from '../../../shared/engine/operators/pauli';
import { pfeutyGroundEnergy, tfimChain } from './tfim';
import { kroneckerMatrix, randomPauliSum } from './helpers';

describe('Pfeuty closed form', () => {
  test('N = 6, J = 1, h = 0.7 gives −6.7828160575 (references.md, computed)', () => {
    expect(pfeutyGroundEnergy(6, 1, 0.7)).toBeCloseTo(-6.7828160575, 9);
  });

  test.each([
    [6, 1, 0.7], [8, 1, 0.7], [6, 1, 1.3], [8, 0.8, 1],
  ])('dense ground energy of the chain N=%i, J=%f, h=%f equals the closed form to 1e-8', (N, J, h) => {
    expect(Math.abs(groundEnergyDense(tfimChain(N, J, h)) - pfeutyGroundEnergy(N, J, h))).toBeLessThan(1e-8);
  });

  test.each([
    [8, 1, 0.7], [12, 1, 0.7], [14, 1, 0.7], [12, 1, 1.5], [14, 0.5, 1],
  ])('Lanczos ground energy of the chain N=%i, J=%f, h=%f equals the closed form to 1e-8', (N, J, h) => {
    const r = lanczosLowest(tfimChain(N, J, h), { rng: createRng(N) });
    expect(r.converged).toBe(true);
    expect(Math.abs(r.energy - pfeutyGroundEnergy(N, J, h))).toBeLessThan(1e-8);
  });
});

describe('Lanczos and dense agree on random operators', () => {
  test('with Y terms (complex Hermitian, embedding path) at n = 2…6', () => {
    const rng = createRng(404);
    for (const n of [2, 3, 4, 5, 6]) {
      for (let trial = 0; trial < 3; trial++) {
        const p = simplifyPauliSum(randomPauliSum(n, 4 + 2 * n, rng));
        const dense = groundEnergyDense(p);
        expect(Math.abs(groundEnergyLanczos(p, { rng: createRng(trial) }) - dense)).toBeLessThan(1e-8);
      }
    }
  });

  test('thick restarts with a small basis still converge (chain N = 10 vs closed form; complex n = 7 vs dense)', () => {
    const r = lanczosLowest(tfimChain(10, 1, 0.7), { rng: createRng(3), krylov: 8, keep: 3 });
    expect(r.converged).toBe(true);
    expect(r.restarts).toBeGreaterThan(0);
    expect(Math.abs(r.energy - pfeutyGroundEnergy(10, 1, 0.7))).toBeLessThan(1e-8);
    const p = simplifyPauliSum(randomPauliSum(7, 20, createRng(77)));
    const c = lanczosLowest(p, { rng: createRng(4), krylov: 10, keep: 4 });
    expect(c.converged).toBe(true);
    expect(Math.abs(c.energy - groundEnergyDense(p))).toBeLessThan(1e-8);
  });

  test('the dense spectrum has trace and Frobenius norm of the Kronecker matrix (n = 4, with Y)', () => {
    const p = simplifyPauliSum(randomPauliSum(4, 10, createRng(5)));
    const spec = spectrumDense(p);
    const { re, im, dim } = kroneckerMatrix(p);
    let trace = 0, frob = 0;
    for (let r = 0; r < dim; r++) trace += re[r * dim + r];
    for (let i = 0; i < re.length; i++) frob += re[i] * re[i] + im[i] * im[i];
    expect(spec.reduce((a, b) => a + b, 0)).toBeCloseTo(trace, 10);
    expect(spec.reduce((a, b) => a + b * b, 0)).toBeCloseTo(frob, 9);
    expect(spec.length).toBe(16);
  });

  test('dense refuses more than 10 qubits with advice', () => {
    expect(() => groundEnergyDense(tfimChain(11, 1, 1))).toThrow(/groundEnergyLanczos/);
  });
});
