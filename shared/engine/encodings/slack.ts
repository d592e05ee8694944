/**
 * Bounded binary expansion of an integer slack x ∈ {0, …, max}: bits b_j with coefficients
 * 1, 2, 4, …, 2^(r−2) and a last coefficient max − (2^(r−1) − 1), so every value in range is
 * reachable and nothing beyond it (common practice for inequality constraints in QUBOs).
 */
export function slackCoefficients(max: number): number[] {
  if (!(max >= 1)) return [];
  const r = Math.ceil(Math.log2(max + 1));
  const coeffs: number[] = [];
  for (let j = 0; j < r - 1; j++) coeffs.push(2 ** j);
  coeffs.push(max - (2 ** (r - 1) - 1));
  return coeffs;
}

/** Greatest common divisor of non-negative integers (0 when all are 0). */
export function gcdOf(values: ArrayLike<number>): number {
  let g = 0;
  for (let i = 0; i < values.length; i++) {
    let a = Math.round(values[i]), b = g;
    while (b) [a, b] = [b, a % b];
    g = Math.abs(a);
  }
  return g;
}

/**
 * Grid for depot weights: the balance penalty needs integer weights. Integer weights use
 * their gcd (exact); otherwise, or when the window would need more than maxSlackBits slack
 * bits, the grid is coarsened and the weights are rounded (approximate — reported).
 */
export function depotWeightGrid(weights: Float64Array, window: number, maxSlackBits: number): { unit: number; grid: Float64Array; approximate: boolean } {
  const integral = Array.from(weights).every((w) => Math.abs(w - Math.round(w)) < 1e-9);
  let unit = integral ? gcdOf(weights) || 1 : Math.max(...Array.from(weights), 1e-12) / 16;
  const cap = 2 ** maxSlackBits - 1;
  if (window / unit > cap) unit = window / cap;
  const grid = weights.map((w) => Math.round(w / unit));
  const approximate = weights.some((w, i) => Math.abs(w / unit - grid[i]) > 1e-9);
  return { unit, grid, approximate };
}
