import { laneScale } from '../network/scale';
import type { CompactNetwork } from '../network/types';
import type { Rng } from '../random';

/**
 * Low-rank solution of the max-cut SDP, max Σ w(1 − v_u·v_v)/2 over unit vectors v_i ∈ R^r
 * (Burer, Monteiro, Zhang, SIAM J. Optim. 12(2) 2002). The ascent is block-coordinate:
 * v_i ← −g_i/‖g_i‖ with g_i = Σ_j w_ij v_j, the exact best unit vector for row i with the
 * others fixed, so no sweep lowers the objective.
 */
export interface LowRank {
  /** n × r, row i = v_i. */
  V: Float64Array;
  r: number;
  /** One sweep over all depots; returns the objective after it. */
  sweep(): number;
  objective(): number;
  /** Σ w·arccos(v_u·v_v)/π: the expected cut of a random hyperplane (Goemans & Williamson). */
  expectedCut(): number;
  /**
   * Dual candidate from the vectors: y_i = (deg_i − Σ_j w_ij v_i·v_j)/4, the multiplier the
   * optimality conditions (Diag(y) − L/4)·X = 0 give; returned as the diagonal shift
   * u = 4(ȳ − y) (Σu = 0) for the eigenvalue bound (n/4)·λmax(L + diag u).
   */
  dualShift(): Float64Array;
}

export function createLowRank(net: CompactNetwork, rank: number, rng: Rng): LowRank {
  const { n, adjStart, adjIndex, adjWeight, m, laneFrom, laneTo, laneWeight } = net;
  const r = Math.max(2, rank > 0 ? rank : Math.ceil(Math.sqrt(2 * n)));
  const V = new Float64Array(n * r);
  for (let i = 0; i < n; i++) {
    let norm = 0;
    for (let d = 0; d < r; d++) { const x = rng.normal(); V[i * r + d] = x; norm += x * x; }
    norm = Math.sqrt(norm) || 1;
    for (let d = 0; d < r; d++) V[i * r + d] /= norm;
  }
  const dotLane = (e: number): number => {
    const a = laneFrom[e] * r, b = laneTo[e] * r;
    let dot = 0;
    for (let d = 0; d < r; d++) dot += V[a + d] * V[b + d];
    return dot;
  };
  const g = new Float64Array(r);
  const scale = laneScale(net);
  const objective = (): number => {
    let s = 0;
    for (let e = 0; e < m; e++) s += (laneWeight[e] * (1 - dotLane(e))) / 2;
    return s;
  };
  return {
    V,
    r,
    objective,
    sweep() {
      for (let i = 0; i < n; i++) {
        g.fill(0);
        for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
          const j = adjIndex[p] * r, w = adjWeight[p];
          for (let d = 0; d < r; d++) g[d] += w * V[j + d];
        }
        // g's direction is all that matters; dividing by the weight scale keeps Σg² finite.
        let norm = 0;
        for (let d = 0; d < r; d++) { g[d] /= scale; norm += g[d] * g[d]; }
        norm = Math.sqrt(norm);
        if (norm < 1e-12) continue;
        for (let d = 0; d < r; d++) V[i * r + d] = -g[d] / norm;
      }
      return objective();
    },
    expectedCut() {
      let s = 0;
      for (let e = 0; e < m; e++) s += (laneWeight[e] * Math.acos(Math.max(-1, Math.min(1, dotLane(e))))) / Math.PI;
      return s;
    },
    dualShift() {
      const y = new Float64Array(n);
      for (let e = 0; e < m; e++) {
        const t = laneWeight[e] * (1 - dotLane(e));
        y[laneFrom[e]] += t / 4;
        y[laneTo[e]] += t / 4;
      }
      let mean = 0;
      for (let i = 0; i < n; i++) mean += y[i];
      mean /= n;
      const u = new Float64Array(n);
      for (let i = 0; i < n; i++) u[i] = 4 * (mean - y[i]);
      return u;
    },
  };
}
