import { encodeBisection } from '../../../shared/engine/encodings/bisection';
import { encodeKwayOneHot } from '../../../shared/engine/encodings/kway-onehot';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import { isingEnergyAt } from '../../../shared/engine/encodings/qubo';
import type { Encoding } from '../../../shared/engine/encodings/types';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { crossingWeight, isBalanced } from '../../../shared/engine/problem/evaluate';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng } from '../../../shared/engine/random';
import { bruteForceBest, problemOf, randomGraph, type Edge } from './fixtures';

// Energy tables through the simulator's diagonal builder (checked against quantum-circuit in
// tests/unit/statevector); the max-cut test below also checks single states with isingEnergyAt.
const energies = (enc: Encoding) => isingDiagonal(enc.operator);

/** Per depot configuration (low bits), the lowest energy over the slack qubits (high bits). */
function bestOverSlack(enc: Encoding, all: Float64Array): Float64Array {
  const depotStates = 2 ** enc.depotQubits;
  const best = new Float64Array(depotStates).fill(Infinity);
  for (let x = 0; x < all.length; x++) {
    const d = x % depotStates;
    if (all[x] < best[d]) best[d] = all[x];
  }
  return best;
}

describe('max-cut encoding (cut = (W − Σ w s_u s_v)/2, references.md "Encodings"; here energy = −cut)', () => {
  test.each([1, 2, 3])('energy equals −(cut weight) on every state, signed weights (seed %i)', (seed) => {
    const rng = createRng(seed);
    const n = 7;
    const p = problemOf(n, randomGraph(rng, n, 0.5, () => Math.round(rng.normal() * 4) / 2), { kind: 'maxcut' });
    const enc = encodeMaxCut(p);
    expect(enc.numQubits).toBe(n);
    for (let x = 0; x < 2 ** n; x++) {
      const a = enc.decode(x);
      expect(enc.operator.numQubits).toBe(n);
      expect(isingEnergyAt(enc.operator, x)).toBeCloseTo(-crossingWeight(p, a), 10);
      expect(enc.valueOfEnergy(isingEnergyAt(enc.operator, x))).toBeCloseTo(enc.valueOf(a), 10);
    }
  });

  test('ground state is the maximum cut (Petersen graph = 12, common practice)', () => {
    const outer: Edge[] = [0, 1, 2, 3, 4].map((i) => [i, (i + 1) % 5, 1]);
    const spokes: Edge[] = [0, 1, 2, 3, 4].map((i) => [i, i + 5, 1]);
    const inner: Edge[] = [0, 1, 2, 3, 4].map((i) => [5 + i, 5 + ((i + 2) % 5), 1]);
    const enc = encodeMaxCut(problemOf(10, [...outer, ...spokes, ...inner], { kind: 'maxcut' }));
    expect(Math.min(...energies(enc))).toBeCloseTo(-12, 12);
  });
});

/** Full-state index of the unpinned encoding from a pinned-encoding index and the pins. */
function liftState(full: Encoding, pinned: Encoding, problem: Problem, x: number, perDepot: number): number {
  let y = 0;
  const n = problem.network.n;
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < perDepot; c++) {
      const bit = problem.pins[i] >= 0
        ? (perDepot === 1 ? problem.pins[i] : Number(problem.pins[i] === c))
        : Math.floor(x / 2 ** (pinned.qubitOfDepot[i] + c)) % 2;
      if (bit) y += 2 ** (full.qubitOfDepot[i] + c);
    }
  }
  const slackBits = pinned.numQubits - pinned.depotQubits;
  for (let j = 0; j < slackBits; j++) if (Math.floor(x / 2 ** (pinned.depotQubits + j)) % 2) y += 2 ** (full.depotQubits + j);
  return y;
}

describe('pinned depots substitute fixed spins (fewer qubits, same energies)', () => {
  const cases: [string, (p: Problem) => Encoding, 'maxcut' | 'bisection' | 'kway', number][] = [
    ['maxcut', encodeMaxCut, 'maxcut', 1],
    ['bisection', (p) => encodeBisection(p), 'bisection', 1],
    ['bisection with tolerance', (p) => encodeBisection(p), 'bisection', 1],
    ['kway one-hot', (p) => encodeKwayOneHot(p), 'kway', 3],
  ];
  test.each(cases)('%s', (name, encode, kind, perDepot) => {
    const rng = createRng(name.length);
    const n = kind === 'kway' ? 4 : 7;
    const edges = randomGraph(rng, n, 0.6, () => 1 + rng.int(3));
    const tolerance = name.includes('tolerance') ? 0.3 : 0;
    const weights = Array.from({ length: n }, () => 1 + rng.int(2));
    const pins: Record<string, number> = kind === 'kway' ? { '2': 1 } : { '2': 1, '5': 0 };
    const spec = { kind, k: kind === 'kway' ? 3 : undefined, tolerance };
    const full = encode(problemOf(n, edges, spec, weights));
    const pinnedProblem = problemOf(n, edges, { ...spec, pins }, weights);
    const pinned = encode(pinnedProblem);
    expect(pinned.numQubits).toBe(full.numQubits - Object.keys(pins).length * perDepot);
    expect(pinned.penalties.map((t) => t.weight)).toEqual(full.penalties.map((t) => t.weight));
    const pinnedEnergies = energies(pinned), fullEnergies = energies(full);
    let worst = 0, decodeMismatches = 0;
    for (let x = 0; x < 2 ** pinned.numQubits; x++) {
      const y = liftState(full, pinned, pinnedProblem, x, perDepot);
      worst = Math.max(worst, Math.abs(pinnedEnergies[x] - fullEnergies[y]));
      if (pinned.decode(x).join() !== full.decode(y).join()) decodeMismatches++;
    }
    expect(worst).toBeLessThan(1e-9);
    expect(decodeMismatches).toBe(0);
  });
});

describe('balanced bisection penalty (Lucas, "Ising formulations of many NP problems", Front. Phys. 2:5 (2014))', () => {
  type Case = { label: string; n: number; weighted: boolean; depotWeights: boolean; tolerance: number };
  const cases: Case[] = [];
  for (let seed = 0; seed < 6; seed++) {
    cases.push({ label: `unit ${seed}`, n: 5 + seed, weighted: false, depotWeights: false, tolerance: 0 });
    cases.push({ label: `weighted lanes ${seed}`, n: 4 + seed, weighted: true, depotWeights: false, tolerance: 0 });
    cases.push({ label: `weighted depots ${seed}`, n: 4 + seed, weighted: true, depotWeights: true, tolerance: 0 });
    cases.push({ label: `tolerance ${seed}`, n: 5 + seed, weighted: seed % 2 === 1, depotWeights: seed % 3 === 0, tolerance: 0.25 });
  }
  test.each(cases)('$label: ground state is a best balanced bisection; balanced states carry no penalty', ({ label, n, weighted, depotWeights, tolerance }) => {
    const rng = createRng(label.length * 97 + n);
    const edges = randomGraph(rng, n, 0.55, weighted ? () => 1 + rng.int(5) : () => 1);
    const p = problemOf(n, edges, { kind: 'bisection', tolerance }, depotWeights ? Array.from({ length: n }, () => 1 + rng.int(3)) : undefined);
    for (const penaltyRule of ['lucas', 'dominant'] as const) {
      const enc = encodeBisection(p, { penaltyRule });
      expect(enc.approximate).toBe(false);
      const best = bestOverSlack(enc, energies(enc));
      let minBalanced = Infinity, maxBalanced = -Infinity, minUnbalanced = Infinity;
      for (let x = 0; x < best.length; x++) {
        const a = enc.decode(x);
        if (isBalanced(p, a)) {
          expect(best[x]).toBeCloseTo(crossingWeight(p, a), 9); // penalty exactly 0 when balanced
          minBalanced = Math.min(minBalanced, best[x]);
          maxBalanced = Math.max(maxBalanced, best[x]);
        } else minUnbalanced = Math.min(minUnbalanced, best[x]);
      }
      expect(minBalanced).toBeCloseTo(bruteForceBest(p).value, 9);
      if (minUnbalanced < Infinity) {
        expect(minUnbalanced).toBeGreaterThan(minBalanced + 1e-9); // strict: the ground state is balanced
        if (penaltyRule === 'dominant') expect(minUnbalanced).toBeGreaterThan(maxBalanced + 1e-9);
      }
    }
  });
});

describe('Lucas bound is tight: at equality an unbalanced state ties (references.md: ties at equality)', () => {
  // A triangle plus one isolated depot: Δ = 2, N = 4 ⇒ A = min(2Δ, N)/8 = 1/2. Best bisection {0,1}|{2,3}
  // crosses 2 lanes; the unbalanced {0}|{1,2,3} crosses none but pays A·D² = ½·4 = 2: a tie at margin 1.
  const p = problemOf(4, [[1, 2, 1], [1, 3, 1], [2, 3, 1]], { kind: 'bisection' });
  const lowest = (margin: number) => {
    const enc = encodeBisection(p, { penaltyMargin: margin });
    const all = energies(enc);
    let balanced = Infinity, unbalanced = Infinity;
    for (let x = 0; x < all.length; x++) {
      if (isBalanced(p, enc.decode(x))) balanced = Math.min(balanced, all[x]);
      else unbalanced = Math.min(unbalanced, all[x]);
    }
    return { balanced, unbalanced, A: enc.penalties[0].weight };
  };
  test('margin 1 (non-strict): tie', () => {
    const r = lowest(1);
    expect(r.A).toBeCloseTo(0.5, 12);
    expect(r.balanced).toBeCloseTo(2, 12);
    expect(r.unbalanced).toBeCloseTo(2, 12);
  });
  test('default margin (strict): the balanced optimum wins', () => {
    const r = lowest(1.05);
    expect(r.unbalanced).toBeGreaterThan(r.balanced);
  });
});

describe('k-way one-hot encoding', () => {
  test.each([
    ['4 depots, k = 3, unit', 4, 3, false, 0, {}],
    ['5 depots, k = 3, weighted lanes', 5, 3, true, 0, {}],
    ['5 depots, k = 3, pinned', 5, 3, true, 0, { '1': 2 }],
    ['4 depots, k = 3, tolerance', 4, 3, true, 0.4, {}],
  ] as const)('%s: ground state is a valid one-hot balanced partition of brute-force optimal value', (label, n, k, weighted, tolerance, pins) => {
    const rng = createRng(label.length);
    const p = problemOf(n, randomGraph(rng, n, 0.7, weighted ? () => 1 + rng.int(4) : () => 1), { kind: 'kway', k, tolerance, pins });
    const enc = encodeKwayOneHot(p);
    expect(enc.numQubits).toBeLessThanOrEqual(20);
    const all = energies(enc);
    let ground = 0;
    for (let x = 1; x < all.length; x++) if (all[x] < all[ground]) ground = x;
    for (let i = 0; i < n; i++) {
      if (enc.qubitOfDepot[i] < 0) continue;
      let ones = 0;
      for (let c = 0; c < k; c++) ones += Math.floor(ground / 2 ** (enc.qubitOfDepot[i] + c)) % 2;
      expect(ones).toBe(1);
    }
    const a = enc.decode(ground);
    expect(isBalanced(p, a)).toBe(true);
    const brute = bruteForceBest(p);
    expect(crossingWeight(p, a)).toBeCloseTo(brute.value, 9);
    expect(all[ground]).toBeCloseTo(brute.value, 9);
  });
});
