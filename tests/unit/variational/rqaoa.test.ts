import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import type { IsingOperator } from '../../../shared/engine/operators/types';
import { createRng, type Rng } from '../../../shared/engine/random';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { eliminateSpins } from '../../../shared/engine/variational/ising-eliminate';
import { level1Coefficients, level1Correlations } from '../../../shared/engine/variational/level1';
import { level1Graph } from '../../../shared/engine/variational/level1-graph';
import { optimiseLevel1Angles } from '../../../shared/engine/variational/level1-angles';
import { isingEnergy, runRqaoa } from '../../../shared/engine/variational/rqaoa';
import { problemOf, randomGraph } from '../encodings/fixtures';

function randomIsing(rng: Rng, n: number, p: number, withFields: boolean): IsingOperator {
  const I: number[] = [], Jx: number[] = [], C: number[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) { I.push(i); Jx.push(j); C.push(rng.normal()); }
  const linear = new Float64Array(n);
  if (withFields) for (let i = 0; i < n; i++) linear[i] = rng.next() < 0.5 ? rng.normal() : 0;
  return { numQubits: n, offset: 0, linear, quadI: Int32Array.from(I), quadJ: Int32Array.from(Jx), quadCoeff: Float64Array.from(C) };
}

const groundEnergy = (op: IsingOperator) => Math.min(...isingDiagonal(op));

describe('spin elimination (the reduction step of recursive QAOA)', () => {
  test('the reduced operator equals the original on every state that satisfies the relations', () => {
    const rng = createRng(5);
    const op = randomIsing(rng, 9, 0.5, true);
    const rel = [{ qubit: 2, partner: 7, sign: -1 as const }, { qubit: 4, partner: -1, sign: 1 as const }, { qubit: 0, partner: 3, sign: 1 as const }];
    const { op: red, newIndex } = eliminateSpins(op, rel);
    expect(red.numQubits).toBe(6);
    for (let trial = 0; trial < 40; trial++) {
      const s: number[] = Array.from({ length: 9 }, () => (rng.next() < 0.5 ? -1 : 1));
      for (const r of rel) s[r.qubit] = r.partner < 0 ? r.sign : r.sign * s[r.partner];
      const sr = new Array(6);
      for (let q = 0; q < 9; q++) if (newIndex[q] >= 0) sr[newIndex[q]] = s[q];
      expect(isingEnergy(red, sr)).toBeCloseTo(isingEnergy(op, s), 10);
    }
  });

  test('refuses relations that chain within one call', () => {
    const op = randomIsing(createRng(1), 5, 0.8, false);
    expect(() => eliminateSpins(op, [{ qubit: 1, partner: 2, sign: 1 }, { qubit: 2, partner: 3, sign: 1 }])).toThrow(/chain/);
  });
});

describe('recursive QAOA (Bravyi, Kliesch, Koenig & Tang, PRL 125, 260505 (2020))', () => {
  test('its reported energy is the energy of its spins, and with stopAt ≥ n it is the exact ground state', () => {
    const op = randomIsing(createRng(9), 10, 0.5, true);
    const out = runRqaoa(op, { stopAt: 10, batchFraction: 0 });
    expect(out.rounds).toBe(0);
    expect(out.energy).toBeCloseTo(groundEnergy(op), 10);
    expect(out.energy).toBeCloseTo(isingEnergy(op, out.spins), 12);
  });

  test('one elimination per round on weighted max-cut (14 depots, 8 networks): optimum on at least 6, ≥ 97 % of it on all', () => {
    // Bravyi et al. 2020 report level-1 RQAOA near-optimal on small instances; our own threshold.
    let hits = 0;
    for (let seed = 1; seed <= 8; seed++) {
      const rng = createRng(200 + seed);
      const edges = randomGraph(rng, 14, 0.35, () => 0.5 + rng.next());
      const enc = encodeMaxCut(problemOf(14, edges, { kind: 'maxcut' }));
      const out = runRqaoa(enc.operator, { stopAt: 4, batchFraction: 0 });
      expect(out.rounds).toBe(10);
      const best = groundEnergy(enc.operator);
      if (Math.abs(out.energy - best) < 1e-9) hits++;
      expect(out.energy / best).toBeGreaterThanOrEqual(0.97);
    }
    expect(hits).toBeGreaterThanOrEqual(6);
  });

  test('with fields (random signed Ising, 12 spins): reaches ≥ 95 % of the ground energy', () => {
    for (let seed = 1; seed <= 4; seed++) {
      const op = randomIsing(createRng(300 + seed), 12, 0.4, true);
      const out = runRqaoa(op, { stopAt: 3, batchFraction: 0 });
      const best = groundEnergy(op);
      expect(best).toBeLessThan(0);
      expect(out.energy / best).toBeGreaterThanOrEqual(0.95);
    }
  });

  test('light-cone rule: each correlation taken in a batch equals what it reads after the earlier eliminations, at the same angles', () => {
    const rng = createRng(41);
    const op = randomIsing(rng, 60, 0.05, true);
    const out = runRqaoa(op, { stopAt: 20, batchFraction: 0.2 });
    const firstRound = out.eliminations.filter((e) => e.round === 1 && e.correlation !== 0);
    expect(firstRound.length).toBeGreaterThan(2);
    // Replay: impose the first-round relations one at a time and re-read the next one's correlation.
    const [gamma, beta] = out.firstParams;
    let cur = op;
    let orig = Array.from({ length: 60 }, (_, i) => i);
    for (const e of firstRound) {
      const at = (q: number) => orig.indexOf(q);
      const g = level1Graph(cur);
      const { z, zz } = level1Correlations(level1Coefficients(g, gamma), beta);
      let read: number;
      if (e.partner < 0) read = z[at(e.qubit)];
      else {
        const u = Math.min(at(e.qubit), at(e.partner)), v = Math.max(at(e.qubit), at(e.partner));
        let t = 0;
        while (cur.quadI[t] !== u || cur.quadJ[t] !== v) t++;
        read = zz[t];
      }
      expect(read).toBeCloseTo(e.correlation, 12);
      const red = eliminateSpins(cur, [{ qubit: at(e.qubit), partner: e.partner < 0 ? -1 : at(e.partner), sign: e.sign }]);
      orig = orig.filter((_, q) => red.newIndex[q] >= 0);
      cur = red.op;
    }
  });

  test('many rounds with batches on a 600-spin sparse operator: answers, energy consistent', () => {
    const rng = createRng(3);
    const edges = randomGraph(rng, 600, 0.006, () => 1);
    const enc = encodeMaxCut(problemOf(600, edges, { kind: 'maxcut', pins: { '1': 0, '2': 1 } }));
    const out = runRqaoa(enc.operator, { stopAt: 12, batchFraction: 0.05 });
    expect(out.remainder).toBeLessThanOrEqual(12);
    expect(out.energy).toBeCloseTo(isingEnergy(enc.operator, out.spins), 8);
    // Better than the expectation of the first level-1 state it started from.
    expect(out.energy).toBeLessThan(out.firstEnergy);
  });
});

describe('late rounds keep to the time limit (solvers/rqaoa.ts hurry at 60 % of it, overdue at 100 %)', () => {
  // Dense operators densify further as spins merge, so a warm angle search per late round
  // (≥ 7 closed-form passes) overran a 20 s limit six-fold on G1; in a hurry a round is one pass.
  test('in a hurry every round after the first costs one closed-form pass and takes a quarter of the spins', () => {
    const op = encodeMaxCut(problemOf(50, randomGraph(createRng(8), 50, 0.2), { kind: 'maxcut' })).operator;
    const calm = runRqaoa(op, { stopAt: 12, batchFraction: 0 });
    const hurried = runRqaoa(op, { stopAt: 12, batchFraction: 0, hurry: () => true });
    // Round 1 reuses the whole-operator search (1 pass); rounds 2… one pass each.
    const wholeSearch = optimiseLevel1Angles(level1Graph(op)).evaluations;
    expect(hurried.evaluations).toBe(wholeSearch + hurried.rounds);
    expect(hurried.rounds).toBeLessThan(10); // ≈ log_{4/3}(50/12), not 38
    expect(calm.evaluations).toBeGreaterThan(wholeSearch + 5 * (calm.rounds - 1));
  });

  test('overdue: one pass settles every spin but one per component (strongest-correlation spanning forest)', () => {
    const op = encodeMaxCut(problemOf(200, randomGraph(createRng(9), 200, 0.05), { kind: 'maxcut', pins: { '7': 1 } })).operator;
    const out = runRqaoa(op, { stopAt: 12, batchFraction: 0, hurry: () => true, overdue: () => true });
    expect(out.rounds).toBe(1); // a quarter per round would need ≈ 10 (200·0.75^r ≤ 12)
    expect(out.remainder).toBeLessThanOrEqual(12);
    // Every imposed relation holds in the answer (the forest's relations were re-rooted, never chained).
    for (const e of out.eliminations) expect(out.spins[e.qubit]).toBe(e.partner < 0 ? e.sign : e.sign * out.spins[e.partner]);
    expect(out.spins.every((s) => s === 1 || s === -1)).toBe(true);
    expect(out.energy).toBeCloseTo(isingEnergy(op, out.spins), 9);
  });
});
