import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { createFlipState } from './flip-state';
import { polishMaxcut } from './local-search';
import type { RunControl } from './run-control';

/**
 * Goemans–Williamson rounding (Goemans & Williamson, J. ACM 42(6) 1995) of a low-rank SDP
 * solution found the Burer–Monteiro way (Burer, Monteiro, Zhang, SIAM J. Optim. 12(2) 2002):
 * depot i gets a unit vector v_i ∈ R^r, r ≈ √(2n), and we maximise Σ w(1 − v_u·v_v)/2.
 * The ascent is block-coordinate: v_i ← −g_i/‖g_i‖ with g_i = Σ_j w_ij v_j, the exact best
 * unit vector for row i with the others fixed (never lowers the objective).
 * The SDP objective reached is an ESTIMATE of the relaxation value, not a bound (no dual
 * certificate is computed here). Rounding: random hyperplanes, each cut polished by 1-flip
 * local search; pinned depots are set after rounding (the orientation that agrees with most
 * pins first) and never move.
 */
export interface GwOptions {
  /** Rank r; 0 = ⌈√(2n)⌉. */
  rank: number;
  maxSweeps: number;
  /** Stop the ascent when a sweep gains less than this share of the objective. */
  tolerance: number;
  hyperplanes: number;
}

export const gwDefaults: GwOptions = { rank: 0, maxSweeps: 500, tolerance: 1e-7, hyperplanes: 200 };

export interface GwRun {
  side: Int8Array;
  cut: number;
  /** Σ w(1 − v_u·v_v)/2 at the end of the ascent (estimate of the SDP value). */
  sdpEstimate: number;
  /** Expected GW cut of the vector solution: Σ w·arccos(v_u·v_v)/π. */
  expectedCut: number;
  sweeps: number;
  rounds: number;
}

export async function goemansWilliamson(problem: Problem, opts: GwOptions, rng: Rng, control: RunControl): Promise<GwRun> {
  const net = problem.network;
  const { n, adjStart, adjIndex, adjWeight, m, laneFrom, laneTo, laneWeight } = net;
  const r = Math.max(2, opts.rank > 0 ? opts.rank : Math.ceil(Math.sqrt(2 * n)));
  const V = new Float64Array(n * r); // row i = v_i
  for (let i = 0; i < n; i++) {
    let norm = 0;
    for (let d = 0; d < r; d++) { const x = rng.normal(); V[i * r + d] = x; norm += x * x; }
    norm = Math.sqrt(norm) || 1;
    for (let d = 0; d < r; d++) V[i * r + d] /= norm;
  }
  const objective = (): number => {
    let s = 0;
    for (let e = 0; e < m; e++) {
      const a = laneFrom[e] * r, b = laneTo[e] * r;
      let dot = 0;
      for (let d = 0; d < r; d++) dot += V[a + d] * V[b + d];
      s += (laneWeight[e] * (1 - dot)) / 2;
    }
    return s;
  };
  const g = new Float64Array(r);
  let value = objective();
  let sweeps = 0;
  for (; sweeps < opts.maxSweeps; sweeps++) {
    for (let i = 0; i < n; i++) {
      g.fill(0);
      for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
        const j = adjIndex[p] * r, w = adjWeight[p];
        for (let d = 0; d < r; d++) g[d] += w * V[j + d];
      }
      let norm = 0;
      for (let d = 0; d < r; d++) norm += g[d] * g[d];
      norm = Math.sqrt(norm);
      if (norm < 1e-12) continue;
      for (let d = 0; d < r; d++) V[i * r + d] = -g[d] / norm;
    }
    const next = objective();
    const gain = next - value;
    value = next;
    if (gain <= opts.tolerance * Math.max(1, Math.abs(value))) { sweeps++; break; }
    if (await control.tick(value, sweeps)) { sweeps++; break; }
  }
  let expectedCut = 0;
  for (let e = 0; e < m; e++) {
    const a = laneFrom[e] * r, b = laneTo[e] * r;
    let dot = 0;
    for (let d = 0; d < r; d++) dot += V[a + d] * V[b + d];
    expectedCut += (laneWeight[e] * Math.acos(Math.max(-1, Math.min(1, dot)))) / Math.PI;
  }

  const free: number[] = [];
  for (let i = 0; i < n; i++) if (problem.pins[i] < 0) free.push(i);
  const freeArr = Int32Array.from(free);
  const side = new Int8Array(n);
  const h = new Float64Array(r);
  let bestCut = -Infinity;
  let bestSide = new Int8Array(n);
  let rounds = 0;
  for (; rounds < opts.hyperplanes; rounds++) {
    for (let d = 0; d < r; d++) h[d] = rng.normal();
    for (let i = 0; i < n; i++) {
      let dot = 0;
      for (let d = 0; d < r; d++) dot += V[i * r + d] * h[d];
      side[i] = dot >= 0 ? 1 : 0;
    }
    // Orientation that agrees with most pins, then force the rest of the pins.
    let agree = 0, disagree = 0;
    for (let i = 0; i < n; i++) if (problem.pins[i] >= 0) (side[i] === problem.pins[i] ? agree++ : disagree++);
    if (disagree > agree) for (let i = 0; i < n; i++) side[i] = (1 - side[i]) as 0 | 1;
    for (let i = 0; i < n; i++) if (problem.pins[i] >= 0) side[i] = problem.pins[i];
    const st = createFlipState(net, side);
    polishMaxcut(problem, st, freeArr);
    if (st.cut > bestCut) {
      bestCut = st.cut;
      bestSide = st.side.slice();
    }
    if ((rounds & 7) === 7 && (await control.tick(bestCut, rounds))) { rounds++; break; }
  }
  return { side: bestSide, cut: bestCut, sdpEstimate: value, expectedCut, sweeps, rounds };
}
