import { laneScale, scaleLanes } from '../network/scale';
import { Matrix } from 'ml-matrix';
import { maxPartWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createRng } from '../random';
import { integerLanes } from './result';
import { createLowRank } from './burer-monteiro';
import { certifiesLaplacianUpper, certifiesUpper, denseLaplacian, denseTop, lanczosTop, laplacianApply } from './spectral';

/**
 * Proven bounds attached to every run (upper for max-cut, lower for the min kinds).
 *  - Eigenvalue bound (Mohar & Poljak, "Eigenvalues and the max-cut problem", Czechoslovak
 *    Math. J. 40 (1990)): mc ≤ (n/4)·λmax(L + diag(u)) for every u with Σu = 0; u = 0 is
 *    the plain bound, and a few projected subgradient steps on the top eigenvector lower it
 *    towards the Delorme–Poljak (1993) value (equal to the SDP relaxation).
 *  - Σ of positive lane weights (no cut can do better), the tighter for ±1 weights.
 *  - Bisection: for any split with s and n − s depots, x = 1_S − s/n gives
 *    cut = xᵀLx ≥ λ₂·‖x‖² = λ₂·s(n − s)/n (Fiedler / Donath–Hoffman argument, any lane
 *    weights; λ₂ = smallest eigenvalue of L on 1⊥), minimised over the counts s the
 *    balance rule allows. With non-negative lanes 0 is also a bound; otherwise Σ negative.
 *  - The MILP dual bound when HiGHS ran (passed in by the caller).
 * Pins only shrink the feasible set, so bounds computed without them stay valid.
 * λ from Lanczos is certified by a dense Cholesky test before use (n ≤ denseLimit);
 * small networks (n ≤ 200) use ml-matrix's EigenvalueDecomposition directly.
 */
export interface BoundOptions {
  /** Bound proven by the MILP run, if one happened. */
  milpBound?: number | null;
  /** A known achievable value (cut for max-cut) to aim the subgradient steps. */
  knownValue?: number | null;
  /** Subgradient steps for the diagonal shift after the SDP start (0 = none). */
  shiftSteps?: number;
  /** Burer–Monteiro sweeps for the starting shift (0 = start from u = 0). */
  sdpSweeps?: number;
  /** A ready diagonal shift (e.g. from the gw solver's vectors) instead of a fresh SDP run. */
  dualShift?: Float64Array;
  /** Largest n for dense certification / dense λ₂. */
  denseLimit?: number;
  seed?: number;
}

export interface BoundReport {
  bound: number | null;
  source: string;
  details: {
    eigenvalue?: number | null;
    shiftedEigenvalue?: number | null;
    positiveWeight?: number;
    spectralBisection?: number | null;
    trivial?: number;
    milp?: number | null;
    notes: string[];
  };
}

export interface EigenBound {
  /** (n/4)·λmax(L), certified. */
  plain: number;
  /** (n/4)·λmax(L + diag u) after the shift steps, certified (≤ plain by construction). */
  shifted: number;
  method: string;
}

/** Certified (n/4)·λ for a shift vector, or null if certification fails or n is too large. */
function certifiedEigenBound(problem: Problem, shift: Float64Array | null, estimate: number, denseLimit: number): number | null {
  const n = problem.network.n;
  if (n <= 200) {
    const top = denseTop(denseLaplacian(problem.network, shift));
    return (n / 4) * (top.value + 1e-9 * Math.max(1, Math.abs(top.value)));
  }
  if (n > denseLimit) return null;
  let margin = 1e-7 * Math.max(1, Math.abs(estimate));
  for (let t = 0; t < 6; t++, margin *= 10) if (certifiesLaplacianUpper(problem.network, shift, estimate + margin)) return (n / 4) * (estimate + margin);
  return null;
}

/**
 * Certified (n/4)·λmax(L + diag u) for a given shift u with Σu = 0 (e.g. the gw solver's dual
 * candidate), or null when n is above the dense limit or certification fails.
 */
export function certifiedShiftBound(problem: Problem, u: Float64Array, denseLimit = 1500, seed = 1): number | null {
  const f = laneScale(problem.network);
  if (f === 1) return shiftBoundUnscaled(problem, u, denseLimit, seed);
  const b = shiftBoundUnscaled(scaledProblem(problem, f), u.map((x) => x / f), denseLimit, seed);
  return b === null ? null : b * f;
}

function shiftBoundUnscaled(problem: Problem, u: Float64Array, denseLimit: number, seed: number): number | null {
  const n = problem.network.n;
  if (n === 0) return 0;
  const est = lanczosTop(n, (x, out) => laplacianApply(problem.network, u, x, out), createRng(seed), { steps: 100, restarts: 8 });
  return certifiedEigenBound(problem, u, est.value, denseLimit);
}

export function maxcutEigenBound(problem: Problem, opts: BoundOptions = {}): EigenBound | null {
  const f = laneScale(problem.network);
  if (f === 1) return eigenBoundUnscaled(problem, opts);
  const scaled = eigenBoundUnscaled(scaledProblem(problem, f), {
    ...opts,
    knownValue: opts.knownValue === undefined || opts.knownValue === null ? opts.knownValue : opts.knownValue / f,
    ...(opts.dualShift ? { dualShift: opts.dualShift.map((x) => x / f) } : {}),
  });
  return scaled === null ? null : { ...scaled, plain: scaled.plain * f, shifted: scaled.shifted * f };
}

function eigenBoundUnscaled(problem: Problem, opts: BoundOptions): EigenBound | null {
  const net = problem.network;
  const n = net.n;
  if (n === 0) return { plain: 0, shifted: 0, method: 'empty network' };
  const denseLimit = opts.denseLimit ?? 2500;
  const rng = createRng(opts.seed ?? 1);
  const shift = new Float64Array(n);
  const tmp = new Float64Array(n);
  const applyWith = (u: Float64Array) => (x: Float64Array, out: Float64Array) => laplacianApply(net, u, x, out);
  let top = lanczosTop(n, applyWith(shift), rng);
  const plainEstimate = top.value;
  const plain = certifiedEigenBound(problem, null, plainEstimate, denseLimit);
  if (plain === null) return null;
  // Start the shift from the dual candidate of a low-rank SDP solution (Burer–Monteiro),
  // which lands near the Delorme–Poljak optimum; then projected subgradient steps on u
  // (Σu = 0): ∂λmax = v∘v, projected by removing its mean, Polyak step aimed at the known
  // value (any achievable cut keeps the step safe).
  let bestU = new Float64Array(n);
  let bestLambda = plainEstimate;
  const sweeps = opts.sdpSweeps ?? 100;
  if (sweeps > 0 && net.m > 0) {
    const sdp = createLowRank(net, 0, rng);
    let value = sdp.objective();
    for (let t = 0; t < sweeps; t++) {
      const next = sdp.sweep();
      if (next - value <= 1e-7 * Math.max(1, Math.abs(next))) break;
      value = next;
    }
    const u = opts.dualShift ?? sdp.dualShift();
    const est = lanczosTop(n, applyWith(u), rng, { steps: 80, restarts: 6 });
    if (est.value < bestLambda) {
      bestLambda = est.value;
      bestU = u.slice();
      shift.set(u);
      top = est;
    }
  }
  const steps = opts.shiftSteps ?? 5;
  const target = opts.knownValue !== undefined && opts.knownValue !== null ? (4 * opts.knownValue) / n : bestLambda * 0.95;
  for (let s = 0; s < steps; s++) {
    const v = top.vector;
    let mean = 0;
    for (let i = 0; i < n; i++) mean += v[i] * v[i];
    mean /= n;
    let g2 = 0;
    for (let i = 0; i < n; i++) { tmp[i] = v[i] * v[i] - mean; g2 += tmp[i] * tmp[i]; }
    if (g2 < 1e-18) break;
    const step = (0.5 * Math.max(top.value - target, 1e-6 * Math.abs(top.value))) / g2;
    for (let i = 0; i < n; i++) shift[i] -= step * tmp[i];
    top = lanczosTop(n, applyWith(shift), rng, { start: top.vector, steps: 40 });
    if (top.value < bestLambda) { bestLambda = top.value; bestU = shift.slice(); }
  }
  let shifted = plain;
  if (bestLambda < plainEstimate) {
    // Re-estimate tightly before certifying (the steps used short Lanczos runs).
    const fine = lanczosTop(n, applyWith(bestU), rng, { start: top.vector, steps: 100, restarts: 8 });
    const c = certifiedEigenBound(problem, bestU, Math.max(fine.value, bestLambda), denseLimit);
    if (c !== null && c < shifted) shifted = c;
  }
  return { plain, shifted, method: n <= 200 ? 'dense eigendecomposition (ml-matrix)' : 'Lanczos + dense Cholesky certificate' };
}

/** Smallest eigenvalue of L on 1⊥, certified (lower estimate), or null. */
export function fiedlerValue(problem: Problem, denseLimit = 2500, seed = 1): number | null {
  const f = laneScale(problem.network);
  if (f === 1) return fiedlerUnscaled(problem, denseLimit, seed);
  const lam = fiedlerUnscaled(scaledProblem(problem, f), denseLimit, seed);
  return lam === null ? null : lam * f;
}

/** The problem with lane weights divided by f (see network/scale.ts): bounds scale back linearly. */
function scaledProblem(problem: Problem, f: number): Problem {
  return { ...problem, network: scaleLanes(problem.network, f) };
}

function fiedlerUnscaled(problem: Problem, denseLimit: number, seed: number): number | null {
  const net = problem.network;
  const n = net.n;
  if (n < 2) return null;
  // M = L + c·J/n pushes the all-ones direction up to c, leaving the rest of the spectrum.
  let trace = 0;
  for (let p = 0; p < net.adjWeight.length; p++) trace += Math.abs(net.adjWeight[p]);
  const c = 2 * trace + 1;
  if (n <= 200) {
    const a = denseLaplacian(net, null);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a.set(i, j, a.get(i, j) + c / n);
    const neg = a.neg();
    const top = denseTop(neg);
    const lam = -top.value;
    return lam - 1e-9 * Math.max(1, Math.abs(lam));
  }
  if (n > denseLimit) return null;
  // Lanczos on σI − L restricted to 1⊥ finds σ − λ₂.
  const sigma = 2 * trace + 1;
  const ones = new Float64Array(n).fill(1);
  const tmp = new Float64Array(n);
  const apply = (x: Float64Array, out: Float64Array): void => {
    laplacianApply(net, null, x, tmp);
    for (let i = 0; i < n; i++) out[i] = sigma * x[i] - tmp[i];
  };
  const top = lanczosTop(n, apply, createRng(seed), { steps: 120, restarts: 8, deflate: ones });
  const estimate = sigma - top.value;
  // Certify: (L + c·J/n) − (λ − margin)·I ⪰ 0  ⇔  λmax((λ − margin)·I − L − cJ/n) ≤ 0.
  const a = denseLaplacian(net, null);
  const shifted = new Matrix(n, n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) shifted.set(i, j, -(a.get(i, j) + c / n));
  let margin = 1e-7 * Math.max(1, Math.abs(estimate));
  for (let t = 0; t < 6; t++, margin *= 10) if (certifiesUpper(shifted, -(estimate - margin))) return estimate - margin;
  return null;
}

/** Lower bound on the crossing weight of any balanced bisection. */
export function bisectionSpectralBound(problem: Problem, lambda2: number): number {
  const n = problem.network.n;
  const dw = Array.from(problem.network.depotWeight).sort((a, b) => b - a);
  let total = 0;
  for (const w of dw) total += w;
  const lo = total - maxPartWeight(problem);
  // Fewest depots a side can hold: the heaviest ones first until it reaches lo.
  let sMin = 0, acc = 0;
  while (acc < lo - 1e-12 && sMin < n) acc += dw[sMin++];
  sMin = Math.min(sMin, n - sMin);
  const counts = lambda2 >= 0 ? sMin * (n - sMin) : Math.floor(n / 2) * Math.ceil(n / 2);
  return (lambda2 * counts) / n;
}

export function computeBounds(problem: Problem, opts: BoundOptions = {}): BoundReport {
  const net = problem.network;
  const notes: string[] = [];
  const integral = integerLanes(problem);
  let positive = 0, negative = 0;
  for (let e = 0; e < net.m; e++) {
    if (net.laneWeight[e] > 0) positive += net.laneWeight[e];
    else negative += net.laneWeight[e];
  }
  const candidates: Array<{ value: number; source: string }> = [];
  const details: BoundReport['details'] = { notes };
  if (problem.kind === 'maxcut') {
    details.positiveWeight = positive;
    candidates.push({ value: positive, source: 'sum of positive lane weights' });
    const eig = maxcutEigenBound(problem, opts);
    if (eig) {
      details.eigenvalue = eig.plain;
      details.shiftedEigenvalue = eig.shifted;
      candidates.push({ value: eig.plain, source: `eigenvalue bound (n/4)·λmax(L) (Mohar & Poljak 1990), ${eig.method}` });
      candidates.push({ value: eig.shifted, source: `eigenvalue bound with optimised diagonal shift (Delorme & Poljak 1993), ${eig.method}` });
    } else {
      details.eigenvalue = null;
      details.shiftedEigenvalue = null;
      notes.push(`eigenvalue bound skipped: n = ${net.n} is above the dense certification limit`);
    }
  } else {
    const trivial = negative;
    details.trivial = trivial;
    candidates.push({ value: trivial, source: negative < 0 ? 'sum of negative lane weights' : 'non-negative lanes (crossing weight ≥ 0)' });
    if (problem.kind === 'bisection') {
      const lam = fiedlerValue(problem, opts.denseLimit ?? 2500, opts.seed ?? 1);
      if (lam !== null) {
        const b = bisectionSpectralBound(problem, lam);
        details.spectralBisection = b;
        candidates.push({ value: b, source: 'spectral bisection bound λ₂·s(n−s)/n (Fiedler; Donath & Hoffman)' });
      } else {
        details.spectralBisection = null;
        notes.push(`spectral bisection bound skipped: n = ${net.n} is above the dense certification limit`);
      }
    }
  }
  if (opts.milpBound !== undefined && opts.milpBound !== null && Number.isFinite(opts.milpBound)) {
    details.milp = opts.milpBound;
    candidates.push({ value: opts.milpBound, source: 'MILP dual bound (HiGHS)' });
  }
  const maximise = problem.kind === 'maxcut';
  let best: { value: number; source: string } | null = null;
  for (const c of candidates) if (!best || (maximise ? c.value < best.value - 1e-12 : c.value > best.value + 1e-12)) best = c;
  if (!best) return { bound: null, source: 'none', details };
  let bound = best.value;
  // Integer lanes: the optimum is an integer, so the bound rounds inwards.
  if (integral) bound = maximise ? Math.floor(bound + 1e-9) : Math.ceil(bound - 1e-9);
  return { bound, source: best.source + (integral ? ', rounded to an integer (integer lanes)' : ''), details };
}
