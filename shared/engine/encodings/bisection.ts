import { crossingWeight, isBalanced, maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createIsingBuilder, pinnedRef, type VarRef } from './builder';
import { decodeSides, encodeSides, freeDepotQubits, maxAbsWeightedDegree, totalAbsLaneWeight } from './depots';
import { depotWeightGrid, slackCoefficients } from './slack';
import type { Encoding } from './types';

export interface BisectionEncodingOptions {
  /**
   * 'lucas' (default): the smallest penalty that still makes the ground state a best balanced
   *   bisection (Lucas 2014 argument, strict). 'dominant': large enough that every balanced
   *   state (with its best slack) lies below every unbalanced one.
   */
  penaltyRule?: 'lucas' | 'dominant';
  /** Factor over the bound (> 1 keeps the inequality strict). Default 1.05. */
  penaltyMargin?: number;
  /** Most slack qubits the tolerance window may use before weights are rounded. Default 5. */
  maxSlackBits?: number;
  /**
   * Allowed range of D = W₀ − W₁ (depot weight of side 0 minus side 1). Default: the balance
   * rule of evaluate.ts, |D| ≤ 2·maxPartWeight − W. Recursive bisection passes uneven windows.
   */
  imbalanceWindow?: { min: number; max: number };
}

/**
 * Balanced bisection (Lucas, "Ising formulations of many NP problems", Front. Phys. 2:5 (2014)):
 *   H = Σ_lanes w(1 − s_u s_v)/2  +  A·P(s),
 * D = Σ_i d'_i s_i (depot weights on an integer grid of `unit`, pinned depots included as
 * constants). The balance rule |W₀ − W₁| ≤ tW + d_max (evaluate.ts) becomes D ∈ [lo, hi] on the
 * grid (ends of D's parity). P = (D − σ)² with the slack σ = lo + 2x, x ∈ {0…(hi − lo)/2} on
 * slack qubits, so P = 0 exactly on balanced states and P ≥ 4 otherwise (D − σ is even).
 * No slack is needed when the window holds one value (P = (D − lo)²) or is {−M, M}
 * (P = D² − M², Lucas's (Σ s)² for equal depot weights).
 * Energy = crossing weight + A·P, so for balanced states the energy IS the crossing weight.
 * Penalty A: flipping one free depot off the heavy side lowers P by ≥ 4 and raises the
 * crossing by ≤ its weighted degree Δ_w, so A > Δ_w/4 makes the ground state balanced; with
 * unit depots and unit lanes and no slack Lucas's A > min(2Δ, N)/8 holds. 'dominant':
 * A > Σ|w|/4 since the crossing weight spans at most Σ|w|.
 */
export function encodeBisection(problem: Problem, opts: BisectionEncodingOptions = {}): Encoding {
  const rule = opts.penaltyRule ?? 'lucas';
  const margin = opts.penaltyMargin ?? 1.05;
  const { n, depotWeight, m, laneFrom, laneTo, laneWeight } = problem.network;
  const { qubitOfDepot, free } = freeDepotQubits(problem);
  let total = 0;
  for (let i = 0; i < n; i++) total += depotWeight[i];
  const half = Math.max(0, 2 * maxPartWeight(problem) - total);
  const window = opts.imbalanceWindow ?? { min: -half, max: half };
  const { unit, grid, approximate } = depotWeightGrid(depotWeight, (window.max - window.min) / 2, opts.maxSlackBits ?? 5);
  let gridTotal = 0;
  for (let i = 0; i < n; i++) gridTotal += grid[i];
  const parity = (v: number) => ((v % 2) + 2) % 2;
  let hi = Math.floor(window.max / unit + 1e-9);
  let lo = Math.ceil(window.min / unit - 1e-9);
  if (parity(hi) !== parity(gridTotal)) hi -= 1;
  if (parity(lo) !== parity(gridTotal)) lo += 1;
  if (lo > hi) { const mid = Math.round((window.min + window.max) / (2 * unit)); lo = hi = parity(mid) === parity(gridTotal) ? mid : mid + 1; } // grid closed the window
  const symmetricPair = lo === -1 && hi === 1;
  const slack = lo === hi || symmetricPair ? [] : slackCoefficients((hi - lo) / 2);
  const numQubits = free + slack.length;

  const unitCase = depotWeight.every((d) => d === 1) && Array.from(laneWeight).every((w) => Math.abs(w) === 1) && slack.length === 0;
  const bound = rule === 'dominant'
    ? totalAbsLaneWeight(problem) / 4
    : unitCase ? Math.min(2 * maxAbsWeightedDegree(problem, false), n) / 8 : maxAbsWeightedDegree(problem, false) / 4;
  const A = margin * Math.max(bound, 1e-9);

  const b = createIsingBuilder(numQubits);
  const crossing = createIsingBuilder(numQubits);
  const ref = (i: number): VarRef => (qubitOfDepot[i] >= 0 ? qubitOfDepot[i] : pinnedRef(problem.pins[i]));
  for (let e = 0; e < m; e++) {
    for (const t of [b, crossing]) {
      t.constant(laneWeight[e] / 2);
      t.zz(ref(laneFrom[e]), ref(laneTo[e]), -laneWeight[e] / 2);
    }
  }
  // D − σ = Σ d'_i s_i − lo − 2x,  x = Σ c_j (1 − t_j)/2  ⇒  −2x = −Σc_j + Σ c_j t_j.
  const refs: VarRef[] = [], coeffs: number[] = [];
  for (let i = 0; i < n; i++) if (grid[i] !== 0) { refs.push(ref(i)); coeffs.push(grid[i]); }
  if (slack.length > 0) {
    slack.forEach((c, j) => { refs.push(free + j); coeffs.push(c); });
    b.square(refs, coeffs, -lo - slack.reduce((s, c) => s + c, 0), A);
  } else if (symmetricPair) {
    b.square(refs, coeffs, 0, A);
    b.constant(-A * hi * hi);
  } else b.square(refs, coeffs, -lo, A);

  return {
    kind: problem.kind,
    method: 'bisection',
    numQubits,
    operator: b.build(),
    valueOperator: crossing.build(),
    depotQubits: free,
    qubitOfDepot,
    encodeAssignment: (a) => encodeSides(qubitOfDepot, free, a),
    decode: (state) => decodeSides(problem, qubitOfDepot, state),
    valueOf: (a) => crossingWeight(problem, a),
    feasible: opts.imbalanceWindow
      ? (a) => {
          let d = 0;
          for (let i = 0; i < n; i++) d += a[i] ? -depotWeight[i] : depotWeight[i];
          return d >= window.min - 1e-9 && d <= window.max + 1e-9;
        }
      : (a) => isBalanced(problem, a),
    valueOfEnergy: (energy) => energy,
    penalties: [{
      name: 'balance',
      weight: A,
      rule: rule === 'dominant'
        ? `A = ${margin}·Σ|w|/4: every balanced state lies below every unbalanced one`
        : unitCase ? `A = ${margin}·min(2Δ, N)/8 (Lucas 2014, strict)` : `A = ${margin}·Δ_w/4 (Δ_w largest weighted degree Σ|w| of a depot; strict)`,
    }],
    rule: `bisection: energy = crossing weight + A·(D − σ)², D = Σ depot weight·spin on a grid of ${unit}` +
      `, allowed D in [${lo}, ${hi}] grid units (tolerance ${problem.tolerance}), ${slack.length} slack qubit(s)` +
      (approximate ? '; depot weights were rounded to the grid, so the penalty only approximates the balance rule' : '') +
      '; feasibility is checked with the balance rule itself.',
    approximate,
  };
}
