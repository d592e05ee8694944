import { level1Coefficients, level1Energy, type Level1Coefficients } from './level1';
import type { Level1Graph } from './level1-graph';

/**
 * Angle search for one QAOA layer on the closed form (shared/engine/variational/level1.ts).
 *
 * For a fixed γ the energy is offset + a·sin x + b·sin 2x + c·sin²x with x = 2β, so β is found
 * per γ on a fine grid refined by golden section at O(1) per try; only γ costs a pass over the
 * graph. E(−γ, −β) = E(γ, β) (complex conjugation: H and |+⟩ are real), so γ > 0 suffices.
 * γ is searched on the scale 1/ρ with ρ = 2·√(mean_u Σ_k J_uk² + h_u²) (for an unweighted
 * d-regular max-cut ρ = √d, where the best γ is of order 1/√d — common practice): a grid of
 * `gridPoints` values of θ = γρ in (0, 4], denser near 0, then golden section around the best.
 * A warm start searches only [γ₀/1.6, 1.6·γ₀].
 */
export interface Level1Angles {
  gamma: number;
  beta: number;
  /** ⟨H⟩ at (gamma, beta): the minimum found. */
  energy: number;
  coefficients: Level1Coefficients;
  /** Passes over the graph (one per γ tried). */
  evaluations: number;
}

export interface Level1AngleOptions {
  /** Warm start: the previous round's γ. */
  aroundGamma?: number;
  gridPoints?: number;
  goldenSteps?: number;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Minimise f on [lo, hi] by golden section (f unimodal near its best grid point). */
function golden(f: (x: number) => number, lo: number, hi: number, steps: number): { x: number; y: number } {
  let a = lo, b = hi;
  let x1 = b - GOLDEN * (b - a), x2 = a + GOLDEN * (b - a);
  let f1 = f(x1), f2 = f(x2);
  for (let s = 0; s < steps; s++) {
    if (f1 <= f2) { b = x2; x2 = x1; f2 = f1; x1 = b - GOLDEN * (b - a); f1 = f(x1); }
    else { a = x1; x1 = x2; f1 = f2; x2 = a + GOLDEN * (b - a); f2 = f(x2); }
  }
  return f1 <= f2 ? { x: x1, y: f1 } : { x: x2, y: f2 };
}

/** Best β for the γ of `co` (in [−π/2, π/2], in [−π/4, π/4] without fields). */
export function bestBeta(co: Level1Coefficients): { beta: number; energy: number } {
  const f = (x: number) => level1Energy(co, x / 2);
  const grid = 96, step = (2 * Math.PI) / grid;
  let bestX = 0, bestY = f(0);
  for (let i = 1; i < grid; i++) {
    const x = -Math.PI + i * step, y = f(x);
    if (y < bestY) { bestY = y; bestX = x; }
  }
  const r = golden(f, bestX - step, bestX + step, 40);
  const x = r.y < bestY ? r.x : bestX;
  // Without fields β and β + π/2 give the same state energy: report the one in (−π/4, π/4].
  const beta = co.a === 0 ? x / 2 - (Math.PI / 2) * Math.round(x / Math.PI) : x / 2;
  return { beta, energy: Math.min(r.y, bestY) };
}

export function gammaScale(g: Level1Graph): number {
  const { n, op, start, term } = g;
  if (n === 0) return 1;
  let sum = 0;
  for (let u = 0; u < n; u++) {
    let s = op.linear[u] * op.linear[u];
    for (let x = start[u]; x < start[u + 1]; x++) s += op.quadCoeff[term[x]] ** 2;
    sum += s;
  }
  const rho = 2 * Math.sqrt(sum / n);
  return rho > 0 ? rho : 1;
}

export function optimiseLevel1Angles(g: Level1Graph, opts: Level1AngleOptions = {}): Level1Angles {
  let evaluations = 0;
  const found: { best: { gamma: number; beta: number; energy: number; co: Level1Coefficients } | null } = { best: null };
  const tryGamma = (gamma: number): number => {
    evaluations++;
    const co = level1Coefficients(g, gamma);
    const { beta, energy } = bestBeta(co);
    if (!found.best || energy < found.best.energy) found.best = { gamma, beta, energy, co };
    return energy;
  };
  const steps = opts.goldenSteps ?? 14;
  if (opts.aroundGamma !== undefined && opts.aroundGamma > 0) {
    const g0 = opts.aroundGamma;
    tryGamma(g0);
    golden(tryGamma, g0 / 1.6, g0 * 1.6, Math.max(4, Math.round(steps * 0.6)));
  } else {
    const rho = gammaScale(g);
    const points = opts.gridPoints ?? 40;
    const thetas = Array.from({ length: points }, (_, i) => 4 * ((i + 1) / points) ** 1.5);
    const values = thetas.map((t) => tryGamma(t / rho));
    let i = 0;
    for (let j = 1; j < points; j++) if (values[j] < values[i]) i = j;
    golden(tryGamma, (i > 0 ? thetas[i - 1] : 0) / rho, (i + 1 < points ? thetas[i + 1] : thetas[i] * 1.2) / rho, steps);
  }
  const b = found.best!;
  return { gamma: b.gamma, beta: b.beta, energy: b.energy, coefficients: b.co, evaluations };
}
