import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import type { PauliSum } from '../../../shared/engine/operators/types';
import { createRng, type Rng } from '../../../shared/engine/random';
import { createLadderAnsatz } from '../../../shared/engine/ansatz/ladder';
import { runVqeOnPauli } from '../../../shared/engine/variational/vqe-pauli';

/** Dense complex matrix of a PauliSum, built independently of the engine: P|x⟩ from the letters. */
function denseParts(p: PauliSum): { re: number[][]; im: number[][] } {
  const dim = 2 ** p.numQubits;
  const re = Array.from({ length: dim }, () => new Array(dim).fill(0));
  const im = Array.from({ length: dim }, () => new Array(dim).fill(0));
  for (let x = 0; x < dim; x++) re[x][x] += p.offset;
  for (const t of p.terms) {
    for (let x = 0; x < dim; x++) {
      let y = x, ar = t.coeff, ai = 0;
      for (let q = 0; q < p.numQubits; q++) {
        const bit = (x >> q) & 1, l = t.letters[q];
        if (l === 'X') y ^= 1 << q;
        else if (l === 'Z') { if (bit) { ar = -ar; ai = -ai; } }
        else if (l === 'Y') { y ^= 1 << q; const s = bit ? -1 : 1; [ar, ai] = [-ai * s, ar * s]; } // Y|b⟩ = i(−1)^b|1−b⟩
      }
      re[y][x] += ar;
      im[y][x] += ai;
    }
  }
  return { re, im };
}

/** Lowest eigenvalue with ml-matrix: Hermitian A + iB ↦ real symmetric [[A, −B], [B, A]] (same spectrum, doubled). */
function groundEnergy(p: PauliSum): number {
  const { re, im } = denseParts(p);
  const dim = re.length;
  const big = Matrix.zeros(2 * dim, 2 * dim);
  for (let i = 0; i < dim; i++) for (let j = 0; j < dim; j++) {
    big.set(i, j, re[i][j]); big.set(i + dim, j + dim, re[i][j]);
    big.set(i, j + dim, -im[i][j]); big.set(i + dim, j, im[i][j]);
  }
  return Math.min(...new EigenvalueDecomposition(big, { assumeSymmetric: true }).realEigenvalues);
}

/** ⟨ψ|H|ψ⟩ from the dense matrix (independent of operators/pauli.ts). */
function denseExpectation(p: PauliSum, amps: Float64Array): number {
  const { re, im } = denseParts(p);
  let e = 0;
  for (let i = 0; i < re.length; i++) for (let j = 0; j < re.length; j++) {
    // conj(ψ_i)·H_ij·ψ_j, real part
    const hr = re[i][j], hi = im[i][j], pr = amps[2 * j], pi = amps[2 * j + 1];
    const vr = hr * pr - hi * pi, vi = hr * pi + hi * pr;
    e += amps[2 * i] * vr + amps[2 * i + 1] * vi;
  }
  return e;
}

function randomOperator(rng: Rng, n: number, terms: number): PauliSum {
  const letters = 'IXYZ';
  const out: PauliSum = { numQubits: n, offset: rng.normal(), terms: [] };
  for (let t = 0; t < terms; t++) {
    let s = '';
    for (let q = 0; q < n; q++) s += letters[rng.int(4)];
    out.terms.push({ letters: s, coeff: rng.normal() });
  }
  return out;
}

/** H = −J Σ Z_i Z_(i+1) − h Σ X_i on a ring of n spins. */
function transverseFieldRing(n: number, J: number, h: number): PauliSum {
  const terms = [];
  const put = (qs: number[], l: string) => { const a = new Array(n).fill('I'); for (const q of qs) a[q] = l; return a.join(''); };
  for (let i = 0; i < n; i++) terms.push({ letters: put([i, (i + 1) % n], 'Z'), coeff: -J });
  for (let i = 0; i < n; i++) terms.push({ letters: put([i], 'X'), coeff: -h });
  return { numQubits: n, offset: 0, terms };
}

// Pfeuty, "The one-dimensional Ising model with a transverse field", Ann. Phys. 57, 79 (1970):
// periodic chain, even-parity sector, E0 = −Σ_k √(J² + h² − 2Jh cos k), k = ±π(2m−1)/N, m = 1…N/2.
function pfeutyGroundEnergy(n: number, J: number, h: number): number {
  let e = 0;
  for (let m = 1; m <= n / 2; m++) e -= 2 * Math.sqrt(J * J + h * h - 2 * J * h * Math.cos((Math.PI * (2 * m - 1)) / n));
  return e;
}

describe('transverse-field Ising ring (Pfeuty 1970)', () => {
  test('the closed form matches the check value and dense diagonalisation (references.md: N = 6, h = 0.7 → −6.7828160575)', () => {
    expect(pfeutyGroundEnergy(6, 1, 0.7)).toBeCloseTo(-6.7828160575, 9);
    expect(groundEnergy(transverseFieldRing(6, 1, 0.7))).toBeCloseTo(pfeutyGroundEnergy(6, 1, 0.7), 9);
  });

  test.each([[8, 0.7], [10, 1.3]])('VQE (alternating ansatz, p = N/2) on N = %i, h = %f reaches the ground energy to 1e-3 relative', (n, h) => {
    // p = N/2 alternating layers suffice for the periodic chain (Ho & Hsieh, SciPost Phys. 6, 029 (2019) [memory]).
    const exact = pfeutyGroundEnergy(n, 1, h);
    const r = runVqeOnPauli(transverseFieldRing(n, 1, h), { ansatz: 'alternating', layers: n / 2, optimizer: 'nelder-mead', shots: 0, restarts: 1, maxIterations: 1500, rng: createRng(n) });
    expect(r.energy).toBeGreaterThanOrEqual(exact - 1e-9);
    expect(Math.abs(r.energy - exact) / Math.abs(exact)).toBeLessThan(1e-3);
  });
});

describe('variational principle: no VQE energy below the exact ground energy (common practice)', () => {
  test.each([1, 2, 3, 4])('random operator %i (ladder ansatz, 2 rungs)', (seed) => {
    const rng = createRng(seed);
    const n = 3 + (seed % 3);
    const op = randomOperator(rng, n, 10);
    const e0 = groundEnergy(op);
    const r = runVqeOnPauli(op, { ansatz: 'ladder', layers: 2, optimizer: 'nelder-mead', shots: 0, restarts: 1, maxIterations: 400, rng: createRng(seed) });
    expect(r.energy).toBeGreaterThanOrEqual(e0 - 1e-9);
    // The reported energy is the true expectation at the returned parameters (dense check, independent code).
    const state = createLadderAnsatz({ numQubits: n, layers: 2 }).prepare(r.params);
    expect(r.energy).toBeCloseTo(denseExpectation(op, state.amps), 9);
    // And the optimiser made progress from the mean of the spectrum (the identity coefficient).
    expect(r.energy).toBeLessThan(op.offset);
  });

  test('with shots the optimiser sees noisy estimates, the final energy is still exact and above E0', () => {
    const op = transverseFieldRing(6, 1, 0.7);
    const run = () => runVqeOnPauli(op, { ansatz: 'alternating', layers: 3, optimizer: 'spsa', shots: 400, restarts: 1, maxIterations: 150, rng: createRng(9) });
    const r = run();
    expect(r.trace.some((t) => t.stdError > 0)).toBe(true);
    expect(r.energy).toBeGreaterThanOrEqual(pfeutyGroundEnergy(6, 1, 0.7) - 1e-9);
    expect(r.shotsUsed).toBe(r.evaluations * 200 * 2); // two qubit-wise groups (all-Z, all-X), ⌈400/2⌉ shots each
    expect(run().params).toEqual(r.params); // seeded: reproducible
  });
});
