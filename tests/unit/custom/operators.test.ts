/**
 * Operators of your own: exact ground energies against published and independent values, the
 * variational runs next to them (the variational principle: no run may go below the ground
 * energy), QUBO matrices from CSV, and malformed input refused with its line.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { exactGround } from '../../../shared/engine/custom/ground';
import { inspectOperator } from '../../../shared/engine/custom/inspect';
import { readCustomOperator } from '../../../shared/engine/custom/parse';
import { OperatorRefusal, solveOperator, type OperatorSolveOptions } from '../../../shared/engine/custom/solve';
import type { PauliSum } from '../../../shared/engine/operators/types';
import { pfeutyGroundEnergy, tfimChain } from '../operators/tfim';

const run = (p: PauliSum, o: Partial<OperatorSolveOptions> = {}) => solveOperator(p, {
  solver: 'vqe', ansatz: 'ladder', layers: 2, entangler: 'ring', optimizer: 'nelder-mead', shots: 0, restarts: 1, maxIterations: 400, seed: 3, timeLimitSeconds: 30, ...o,
});

/** Heisenberg ring H = Σ_i (X_iX_{i+1} + Y_iY_{i+1} + Z_iZ_{i+1}), periodic. */
function heisenbergRing(N: number): PauliSum {
  const terms = [];
  for (let i = 0; i < N; i++) for (const L of ['X', 'Y', 'Z']) {
    const s = 'I'.repeat(N).split('');
    s[i] = L; s[(i + 1) % N] = L;
    terms.push({ letters: s.join(''), coeff: 1 });
  }
  return { numQubits: N, offset: 0, terms };
}

/**
 * Independent exact diagonalisation written here: H as a real matrix from Kronecker products of
 * the 2×2 Pauli matrices (σ_y ⊗ σ_y is real: −(i·i) = 1 on the flipped pair), ml-matrix eigenvalues.
 */
function independentGround(N: number): number {
  const dim = 2 ** N;
  const H = Matrix.zeros(dim, dim);
  for (let i = 0; i < N; i++) {
    const j = (i + 1) % N;
    for (let x = 0; x < dim; x++) {
      const bi = (x >> i) & 1, bj = (x >> j) & 1;
      H.set(x, x, H.get(x, x) + (bi === bj ? 1 : -1)); // Z Z
      const y = x ^ (1 << i) ^ (1 << j);
      H.set(y, x, H.get(y, x) + 1 + (bi === bj ? -1 : 1)); // X X, plus Y Y = −(±i)(±i)
    }
  }
  return Math.min(...new EigenvalueDecomposition(H, { assumeSymmetric: true }).realEigenvalues);
}

describe('exact ground energies', () => {
  // 10 qubits go to Lanczos: dense took 105 s there on this machine (GROUND_DENSE_MAX_QUBITS, ground.ts).
  test.each([[6, 0.5], [6, 1], [8, 2], [10, 0.7], [12, 1]])('transverse-field Ising chain N = %i, h = %f against Pfeuty (1970)', (N, h) => {
    const g = exactGround(tfimChain(N, 1, h))!;
    expect(Math.abs(g.energy - pfeutyGroundEnergy(N, 1, h))).toBeLessThan(1e-7);
    expect(g.method).toMatch(N > 8 ? /Lanczos/ : /dense/);
  });

  test.each([4, 6, 8])('Heisenberg ring of %i spins against an independent diagonalisation', (N) => {
    const g = exactGround(heisenbergRing(N))!;
    expect(Math.abs(g.energy - independentGround(N))).toBeLessThan(1e-8);
    if (N === 4) expect(g.energy).toBeCloseTo(-8, 10); // 4-site ring: S·S ground energy −2 (textbook), σ = 2S
  });
});

describe('variational runs next to the exact value', () => {
  test('VQE on the Heisenberg ring of 4: never below the ground energy, gap reported', () => {
    const r = run(heisenbergRing(4));
    expect(r.exact!.energy).toBeCloseTo(-8, 10);
    expect(r.energy).toBeGreaterThanOrEqual(r.exact!.energy - 1e-9);
    expect(r.gap).toBeCloseTo(r.energy - r.exact!.energy, 12);
    expect(r.circuit!.qubits).toBe(4);
    expect(r.circuit!.layouts.all.twoQubitGates).toBe(2 * 4); // ladder: 4 cz per rung, 2 rungs
  });

  test('the alternating ansatz reaches the transverse-field chain of 4 closely', () => {
    const p = tfimChain(4, 1, 1);
    const r = run(p, { ansatz: 'alternating', layers: 2, restarts: 2 });
    const e0 = pfeutyGroundEnergy(4, 1, 1);
    expect(r.energy).toBeGreaterThanOrEqual(e0 - 1e-9);
    expect(r.relativeGap!).toBeLessThan(0.02);
  });

  test('QAOA on a diagonal operator (from a QUBO CSV) against the brute-force minimum; refused when not diagonal', () => {
    const csv = '# a 3-variable QUBO\n-1, 2, 0\n0, -1, 2\n0, 0, -1\n';
    const parsed = readCustomOperator(csv);
    expect(parsed.ok).toBe(true);
    const p = (parsed as { operator: PauliSum }).operator;
    // By hand: E(x) = −x0 − x1 − x2 + 2x0x1 + 2x1x2; minimum −2 at x = (1, 0, 1).
    let best = Infinity;
    for (let x = 0; x < 8; x++) {
      const b = [x & 1, (x >> 1) & 1, (x >> 2) & 1];
      best = Math.min(best, -b[0] - b[1] - b[2] + 2 * b[0] * b[1] + 2 * b[1] * b[2]);
    }
    expect(best).toBe(-2);
    const r = run(p, { solver: 'qaoa', layers: 3, restarts: 2 });
    expect(r.exact!.energy).toBeCloseTo(-2, 12);
    expect(r.exact!.method).toMatch(/diagonal/);
    expect(r.energy).toBeGreaterThanOrEqual(-2 - 1e-9);
    expect(r.circuit!.layouts.all.twoQubitGates).toBe(3 * 2 * 2);
    expect(() => run(heisenbergRing(4), { solver: 'qaoa' })).toThrow(OperatorRefusal);
  });
});

describe('reading and inspecting', () => {
  test('malformed operator text is refused with its line', () => {
    const r = readCustomOperator('spinyard-operator 1\nqubits 3\n0.5 Z0 Z1\n1.0 Q2\n0.2 Z7\n');
    expect(r.ok).toBe(false);
    expect(r.issues.map((i) => i.line)).toEqual([4, 5]);
    expect(r.issues[0].message).toMatch(/^line 4: unknown Pauli letter "Q"/);
    expect(r.issues[1].message).toMatch(/^line 5: qubit 7 is outside 0…2/);
  });

  test('malformed QUBO CSV is refused with line and column', () => {
    const r = readCustomOperator('1, 0, 0\n0, x, 0\n0, 0\n');
    expect(r.ok).toBe(false);
    expect(r.issues.map((i) => i.message)).toEqual([
      'line 2: column 2: "x" is not a number; write plain numbers like 0, -2.5 or 1e-3 (no header row)',
      'line 3: 2 values, expected 3 (the matrix has 3 rows, so each row needs 3 numbers)',
    ]);
  });

  test('inspector: terms, qubit-wise commuting groups and shots for a precision', () => {
    const i = inspectOperator(heisenbergRing(4), 0.1);
    expect(i.terms).toBe(12);
    expect(i.groups.map((g) => g.terms)).toEqual([4, 4, 4]); // XX…, YY…, ZZ… each commute qubit-wise
    // Uniform rule s = Σ_g Var(H_g)/ε² with the bound Var(H_g) ≤ (Σ_(k∈g)|c_k|)² = 16: s = 48/0.01.
    expect(i.shots.uniformPerGroup).toBe(4800);
    expect(i.shots.uniformTotal).toBe(3 * 4800);
    expect(i.diagonal).toBe(false);
  });
});
