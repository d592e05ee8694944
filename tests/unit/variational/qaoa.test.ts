import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng } from '../../../shared/engine/random';
import { expectationOfDiagonal, isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { runQaoa } from '../../../shared/engine/variational/qaoa-run';
import { crossingWeight } from '../../../shared/engine/problem/evaluate';
import { problemOf, random3Regular, randomGraph, ringEdges, type Edge } from '../encodings/fixtures';

/** ⟨C⟩ of a p-layer QAOA state for max-cut at explicit angles [γ…, β…]. */
function cutExpectation(problem: Problem, params: number[]): number {
  const enc = encodeMaxCut(problem);
  const ansatz = createQaoaAnsatz({ numQubits: enc.numQubits, layers: params.length / 2, energyDiagonal: isingDiagonal(enc.operator) });
  return expectationOfDiagonal(ansatz.prepare(params), isingDiagonal(enc.valueOperator));
}

/** Weight matrix of a graph (0 for non-edges). */
function weightMatrix(n: number, edges: Edge[]): number[][] {
  const w = Array.from({ length: n }, () => new Array(n).fill(0));
  for (const [a, b, x] of edges) { w[a][b] += x; w[b][a] += x; }
  return w;
}

// Wang, Hadfield, Jiang, Rieffel, "Quantum approximate optimization algorithm for MaxCut: a fermionic
// view", Phys. Rev. A 97, 022304 (2018): unweighted p = 1 closed form per edge (references.md).
function wangP1(n: number, edges: Edge[], gamma: number, beta: number): number {
  const w = weightMatrix(n, edges);
  const deg = w.map((row) => row.filter((x) => x !== 0).length);
  let total = 0;
  for (const [u, v] of edges) {
    const du = deg[u] - 1, dv = deg[v] - 1;
    let lambda = 0;
    for (let k = 0; k < n; k++) if (k !== u && k !== v && w[u][k] && w[v][k]) lambda++;
    total += 0.5 + 0.25 * Math.sin(4 * beta) * Math.sin(gamma) * (Math.cos(gamma) ** du + Math.cos(gamma) ** dv)
      - 0.25 * Math.sin(2 * beta) ** 2 * Math.cos(gamma) ** (du + dv - 2 * lambda) * (1 - Math.cos(2 * gamma) ** lambda);
  }
  return total;
}

// Weighted p = 1 formula (references.md; consistent with Ozaeta, van Dam, McMahon, Quantum Sci. Technol. 7,
// 045036 (2022) [paper: memory]); products over k ∉ {u, v}.
function weightedP1(n: number, edges: Edge[], gamma: number, beta: number): number {
  const w = weightMatrix(n, edges);
  let total = 0;
  for (const [u, v, wuv] of edges) {
    let pu = 1, pv = 1, pPlus = 1, pMinus = 1;
    for (let k = 0; k < n; k++) {
      if (k === u || k === v) continue;
      pu *= Math.cos(gamma * w[u][k]);
      pv *= Math.cos(gamma * w[v][k]);
      pPlus *= Math.cos(gamma * (w[u][k] + w[v][k]));
      pMinus *= Math.cos(gamma * (w[u][k] - w[v][k]));
    }
    const zz = -0.5 * Math.sin(4 * beta) * Math.sin(gamma * wuv) * (pu + pv) - 0.5 * Math.sin(2 * beta) ** 2 * (pPlus - pMinus);
    total += (wuv * (1 - zz)) / 2;
  }
  return total;
}

describe('QAOA convention e^{−iβΣX} e^{−iγC}|+⟩ⁿ with C the cut-value operator (references.md)', () => {
  test('p = 0 gives W/2 (half the total weight, references.md), signed weights too', () => {
    const rng = createRng(4);
    const edges = randomGraph(rng, 8, 0.5, () => rng.normal() * 2);
    const W = edges.reduce((s, e) => s + e[2], 0);
    expect(cutExpectation(problemOf(8, edges, { kind: 'maxcut' }), [])).toBeCloseTo(W / 2, 12);
  });

  test.each([1, 2, 3, 4])('p = 1 matches Wang et al. 2018 on a random unweighted graph at random angles (seed %i)', (seed) => {
    const rng = createRng(seed);
    const n = 7 + seed;
    const edges = randomGraph(rng, n, 0.45);
    const p = problemOf(n, edges, { kind: 'maxcut' });
    for (let t = 0; t < 4; t++) {
      const gamma = (rng.next() - 0.5) * 2 * Math.PI, beta = (rng.next() - 0.5) * Math.PI;
      expect(Math.abs(cutExpectation(p, [gamma, beta]) - wangP1(n, edges, gamma, beta))).toBeLessThan(1e-9);
    }
  });

  test.each([1, 2, 3])('p = 1 matches the weighted closed form on a random weighted graph (seed %i)', (seed) => {
    const rng = createRng(50 + seed);
    const n = 8;
    const edges = randomGraph(rng, n, 0.5, () => 0.2 + 2 * rng.next());
    const p = problemOf(n, edges, { kind: 'maxcut' });
    for (let t = 0; t < 4; t++) {
      const gamma = (rng.next() - 0.5) * 4, beta = (rng.next() - 0.5) * Math.PI;
      expect(Math.abs(cutExpectation(p, [gamma, beta]) - weightedP1(n, edges, gamma, beta))).toBeLessThan(1e-9);
    }
  });

  test('3-regular triangle-free p = 1 optimum 1/2 + 1/(3√3) per edge at γ = arctan(1/√2), β = π/8 (references.md [computed])', () => {
    // The 3-cube (8 vertices, girth 4) is 3-regular and triangle-free.
    const edges: Edge[] = [];
    for (let v = 0; v < 8; v++) for (const bit of [1, 2, 4]) if (v < (v ^ bit)) edges.push([v, v ^ bit, 1]);
    const value = cutExpectation(problemOf(8, edges, { kind: 'maxcut' }), [Math.atan(Math.SQRT1_2), Math.PI / 8]);
    expect(value / edges.length).toBeCloseTo(0.5 + 1 / (3 * Math.sqrt(3)), 10);
  });
});

describe('optimised QAOA (Farhi, Goldstone, Gutmann, arXiv:1411.4028 (2014))', () => {
  test.each([[1, 3 / 4], [2, 5 / 6]])('ring of disagrees, 12 depots, p = %i: cut fraction (2p+1)/(2p+2)', (layers, fraction) => {
    const p = problemOf(12, ringEdges(12), { kind: 'maxcut' });
    const out = runQaoa({ encoding: encodeMaxCut(p), layers, optimizer: 'nelder-mead', shots: 0, restarts: 3, maxIterations: 600, rng: createRng(12) });
    expect(Math.abs(out.expectation! / 12 - fraction)).toBeLessThan(1e-4);
    expect(out.energy).toBeCloseTo(-out.expectation!, 10); // energy = −cut for max-cut
  });

  test('ring of disagrees p = 1 with the COBYLA-style optimizer as well', () => {
    const p = problemOf(12, ringEdges(12), { kind: 'maxcut' });
    const out = runQaoa({ encoding: encodeMaxCut(p), layers: 1, optimizer: 'cobyla', shots: 0, restarts: 1, maxIterations: 600, rng: createRng(12) });
    expect(Math.abs(out.expectation! / 12 - 0.75)).toBeLessThan(1e-4);
  });

  test.each([1, 2, 3])('3-regular graph: optimised p = 1 reaches ≥ 0.6924 of the brute-force optimum (seed %i)', (seed) => {
    const rng = createRng(300 + seed);
    const n = 8 + 2 * seed;
    const p = problemOf(n, random3Regular(rng, n), { kind: 'maxcut' });
    const enc = encodeMaxCut(p);
    const optimum = -Math.min(...isingDiagonal(enc.operator)); // brute force over all 2ⁿ cuts
    const out = runQaoa({ encoding: enc, layers: 1, optimizer: 'nelder-mead', shots: 0, restarts: 2, maxIterations: 300, rng: createRng(seed) });
    expect(out.expectation! / optimum).toBeGreaterThanOrEqual(0.6924);
  });
});

describe('warm-started QAOA (Egger, Mareček, Woerner, Quantum 5, 479 (2021); details from memory)', () => {
  test('with c = ½ on every qubit it is standard QAOA', () => {
    const rng = createRng(8);
    const enc = encodeMaxCut(problemOf(6, randomGraph(rng, 6, 0.6, () => 1 + rng.next()), { kind: 'maxcut' }));
    const diag = isingDiagonal(enc.operator);
    const plain = createQaoaAnsatz({ numQubits: 6, layers: 2, energyDiagonal: diag });
    const warm = createQaoaAnsatz({ numQubits: 6, layers: 2, energyDiagonal: diag, warmStart: { probabilities: new Float64Array(6).fill(0.5) } });
    const params = [0.3, -0.7, 0.45, 0.2];
    const a = plain.prepare(params).amps, b = warm.prepare(params).amps;
    for (let i = 0; i < a.length; i++) expect(b[i]).toBeCloseTo(a[i], 12);
  });

  test('at p = 0 each qubit reads 1 with probability c clipped into [ε, 1 − ε]: expected cut Σ w·P(ends differ)', () => {
    const rng = createRng(9);
    const n = 7;
    const edges = randomGraph(rng, n, 0.6, () => 1 + rng.int(3));
    const enc = encodeMaxCut(problemOf(n, edges, { kind: 'maxcut' }));
    const c = Float64Array.from({ length: n }, () => rng.next());
    const eps = 0.2;
    const ansatz = createQaoaAnsatz({ numQubits: n, layers: 0, energyDiagonal: isingDiagonal(enc.operator), warmStart: { probabilities: c, epsilon: eps } });
    const clipped = Array.from(c, (v) => Math.min(1 - eps, Math.max(eps, v)));
    const expected = edges.reduce((s, [u, v, w]) => s + w * (clipped[u] * (1 - clipped[v]) + clipped[v] * (1 - clipped[u])), 0);
    expect(expectationOfDiagonal(ansatz.prepare([]), isingDiagonal(enc.valueOperator))).toBeCloseTo(expected, 12);
  });
});

describe('QAOA driver with shot noise', () => {
  test('seeded runs repeat exactly; samples are decoded and scored with crossingWeight; shots are counted', () => {
    const rng = createRng(71);
    const p = problemOf(9, randomGraph(rng, 9, 0.5, () => 1 + rng.int(3)), { kind: 'maxcut' });
    const run = () => runQaoa({ encoding: encodeMaxCut(p), layers: 2, optimizer: 'spsa', shots: 200, readoutShots: 500, restarts: 2, maxIterations: 40, rng: createRng(3), clock: () => 0 });
    const a = run(), b = run();
    expect(b).toEqual(a);
    expect(a.trace.some((t) => t.stdError > 0)).toBe(true);
    expect(a.shotsUsed).toBe(a.evaluations * 200 + 500);
    expect(a.best!.value).toBe(crossingWeight(p, a.best!.assignment));
    for (const s of a.samples) expect(s.value).toBe(crossingWeight(p, s.assignment));
    expect(a.samples.reduce((t, s) => t + s.count, 0)).toBeLessThanOrEqual(500);
    // The exact expected cut at the returned parameters never exceeds the maximum cut (brute force).
    expect(a.expectation!).toBeLessThanOrEqual(-Math.min(...isingDiagonal(encodeMaxCut(p).operator)) + 1e-9);
    expect(-a.energy).toBeCloseTo(a.expectation!, 9);
  });
});
