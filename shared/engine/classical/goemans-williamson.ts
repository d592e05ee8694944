import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { createLowRank } from './burer-monteiro';
import { createFlipState } from './flip-state';
import { polishMaxcut } from './local-search';
import type { RunControl } from './run-control';

/**
 * Goemans–Williamson rounding (Goemans & Williamson, J. ACM 42(6) 1995) of a low-rank SDP
 * solution found the Burer–Monteiro way (Burer, Monteiro, Zhang, SIAM J. Optim. 12(2) 2002):
 * depot i gets a unit vector v_i ∈ R^r, r ≈ √(2n), and we maximise Σ w(1 − v_u·v_v)/2.
 * The ascent is block-coordinate: v_i ← −g_i/‖g_i‖ with g_i = Σ_j w_ij v_j, the exact best
 * unit vector for row i with the others fixed (never lowers the objective).
 * The SDP objective reached is an ESTIMATE of the relaxation value, not a bound; the dual
 * candidate from the vectors (dualShift) becomes a bound only once certified (bounds.ts). Rounding: random hyperplanes, each cut polished by 1-flip
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
  /** Diagonal shift from the vectors (dual candidate) for a certified eigenvalue bound. */
  dualShift: Float64Array;
}

export async function goemansWilliamson(problem: Problem, opts: GwOptions, rng: Rng, control: RunControl): Promise<GwRun> {
  const net = problem.network;
  const { n } = net;
  const sdp = createLowRank(net, opts.rank, rng);
  const { V, r } = sdp;
  let value = sdp.objective();
  let sweeps = 0;
  for (; sweeps < opts.maxSweeps; sweeps++) {
    const next = sdp.sweep();
    const gain = next - value;
    value = next;
    if (gain <= opts.tolerance * Math.max(1, Math.abs(value))) { sweeps++; break; }
    if (await control.tick(value, sweeps)) { sweeps++; break; }
  }
  const expectedCut = sdp.expectedCut();
  const dualShift = sdp.dualShift();

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
  return { side: bestSide, cut: bestCut, sdpEstimate: value, expectedCut, sweeps, rounds, dualShift };
}
