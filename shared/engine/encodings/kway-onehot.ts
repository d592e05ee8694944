import { crossingWeight, isBalanced, maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createQuboBuilder, pinnedRef, type VarRef } from './builder';
import { totalAbsLaneWeight } from './depots';
import { quboToIsing, bitAt } from './qubo';
import { depotWeightGrid, slackCoefficients } from './slack';
import type { Encoding } from './types';

export interface KwayEncodingOptions {
  /** Factor over each bound (> 1 keeps the inequalities strict). Default 1.05. */
  penaltyMargin?: number;
  /** Most slack bits per region before depot weights are rounded. Default 4. */
  maxSlackBits?: number;
}

/**
 * k-way partitioning by one-hot bits x_(i,c) = "depot i lies in region c" (qubit f·k + c for
 * the f-th free depot; pinned depots are constants), as a QUBO converted to Ising:
 *   E = Σ_lanes w(1 − Σ_c x_uc x_vc)                      crossing weight on one-hot states
 *     + A₁ Σ_free (1 − Σ_c x_ic)²                          one-hot penalty
 *     + A₂ Σ_c (W'_c + σ_c − L)²                            balance window per region
 * with W'_c the region's depot weight on an integer grid, L = ⌊maxPartWeight⌋ on the grid and
 * slack σ_c ∈ {0 … L − lo}, lo = max(0, W' − (k−1)L) (no region can weigh less), so the balance
 * term is 0 exactly when every region meets the balance rule and ≥ 1 grid unit² otherwise.
 * Weights (dominance rules, strict): on one-hot states the crossing weight spans ≤ Σ|w|, so
 * A₂ = margin·Σ|w|; over all bit states a lane's term lies in [(1−k)|w|, |w|], so
 * A₁ = margin·k·Σ|w| puts every broken one-hot state above the best valid balanced one.
 */
export function encodeKwayOneHot(problem: Problem, opts: KwayEncodingOptions = {}): Encoding {
  const margin = opts.penaltyMargin ?? 1.05;
  const { n, depotWeight, m, laneFrom, laneTo, laneWeight } = problem.network;
  const k = problem.k;
  const qubitOfDepot = new Int32Array(n).fill(-1);
  let free = 0;
  for (let i = 0; i < n; i++) if (problem.pins[i] < 0) qubitOfDepot[i] = k * free++;
  const limit = maxPartWeight(problem);
  const { unit, grid, approximate } = depotWeightGrid(depotWeight, limit, opts.maxSlackBits ?? 4);
  let gridTotal = 0;
  for (let i = 0; i < n; i++) gridTotal += grid[i];
  const L = Math.floor(limit / unit + 1e-9);
  const lo = Math.max(0, gridTotal - (k - 1) * L);
  const slack = slackCoefficients(L - lo);
  const depotQubits = free * k;
  const numQubits = depotQubits + k * slack.length;

  const scale = totalAbsLaneWeight(problem) || 1;
  const A2 = margin * scale;
  const A1 = margin * k * scale;
  const b = createQuboBuilder(numQubits);
  const crossing = createQuboBuilder(numQubits);
  const ref = (i: number, c: number): VarRef => (qubitOfDepot[i] >= 0 ? qubitOfDepot[i] + c : pinnedRef(problem.pins[i] === c ? 1 : 0));
  for (let e = 0; e < m; e++) {
    for (const t of [b, crossing]) {
      t.constant(laneWeight[e]);
      for (let c = 0; c < k; c++) t.xx(ref(laneFrom[e], c), ref(laneTo[e], c), -laneWeight[e]);
    }
  }
  const ones = new Array(k).fill(1);
  for (let i = 0; i < n; i++) {
    if (qubitOfDepot[i] < 0) continue;
    b.square(ones.map((_, c) => ref(i, c)), ones, -1, A1);
  }
  for (let c = 0; c < k; c++) {
    const refs: VarRef[] = [], coeffs: number[] = [];
    for (let i = 0; i < n; i++) if (grid[i] !== 0) { refs.push(ref(i, c)); coeffs.push(grid[i]); }
    slack.forEach((s, j) => { refs.push(depotQubits + c * slack.length + j); coeffs.push(s); });
    b.square(refs, coeffs, -L, A2);
  }

  const decode = (state: number | Uint8Array): Int32Array => {
    // Broken one-hot blocks read as the lowest set region (region 0 when none is set);
    // such states are never ground states, and samples are re-scored on the decoded assignment.
    const a = new Int32Array(n);
    for (let i = 0; i < n; i++) {
      if (qubitOfDepot[i] < 0) { a[i] = problem.pins[i]; continue; }
      let region = 0;
      for (let c = 0; c < k; c++) if (bitAt(state, qubitOfDepot[i] + c)) { region = c; break; }
      a[i] = region;
    }
    return a;
  };

  return {
    kind: problem.kind,
    method: 'kway-onehot',
    numQubits,
    operator: quboToIsing(b.build()),
    // On valid one-hot states this is the crossing weight; broken states count lanes per shared region.
    valueOperator: quboToIsing(crossing.build()),
    encodeAssignment: (a) => {
      const bits = new Uint8Array(depotQubits);
      for (let i = 0; i < n; i++) if (qubitOfDepot[i] >= 0) bits[qubitOfDepot[i] + a[i]] = 1;
      return bits;
    },
    depotQubits,
    qubitOfDepot,
    decode,
    valueOf: (a) => crossingWeight(problem, a),
    feasible: (a) => isBalanced(problem, a),
    valueOfEnergy: (energy) => energy,
    penalties: [
      { name: 'one-hot', weight: A1, rule: `A₁ = ${margin}·k·Σ|w| (every broken one-hot state above the best valid one)` },
      { name: 'balance', weight: A2, rule: `A₂ = ${margin}·Σ|w| per grid unit² (every unbalanced one-hot state above every balanced one)` },
    ],
    rule: `k-way one-hot: ${k} qubits per free depot (${depotQubits}) + ${slack.length} slack qubit(s) per region; ` +
      `energy = crossing weight + penalties, region weight limit ${L} on a grid of ${unit}` +
      (approximate ? ' (depot weights rounded to the grid: the penalty approximates the balance rule)' : '') + '.',
    approximate,
  };
}
