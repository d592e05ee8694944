import { minimizeAdam } from '../../../shared/engine/optimizers/adam';
import { minimizeCobyla } from '../../../shared/engine/optimizers/cobyla';
import { centralDifferenceGradient, parameterShiftGradient } from '../../../shared/engine/optimizers/gradients';
import { minimizeNelderMead } from '../../../shared/engine/optimizers/nelder-mead';
import { minimizeWithRestarts } from '../../../shared/engine/optimizers/restarts';
import { minimizeSpsa } from '../../../shared/engine/optimizers/spsa';
import { createRng } from '../../../shared/engine/random';

// Rosenbrock, "An automatic method for finding the greatest or least value of a function",
// Comput. J. 3:175 (1960): f = (1 − x)² + 100(y − x²)², unique minimum f(1, 1) = 0.
const rosenbrock = (x: Float64Array) => (1 - x[0]) ** 2 + 100 * (x[1] - x[0] ** 2) ** 2;
const rosenbrockGradient = (x: Float64Array) =>
  Float64Array.of(-2 * (1 - x[0]) - 400 * x[0] * (x[1] - x[0] ** 2), 200 * (x[1] - x[0] ** 2));
// Extended Rosenbrock in 4 dimensions (common practice): minimum 0 at (1, 1, 1, 1).
const rosenbrock4 = (x: Float64Array) => {
  let s = 0;
  for (let i = 0; i < 3; i++) s += 100 * (x[i + 1] - x[i] ** 2) ** 2 + (1 - x[i]) ** 2;
  return s;
};

describe('Nelder–Mead with adaptive coefficients (Nelder & Mead 1965; Gao & Han 2012)', () => {
  test('reaches the Rosenbrock minimum (1, 1) from the classic start (−1.2, 1)', () => {
    const r = minimizeNelderMead(rosenbrock, [-1.2, 1], { maxIterations: 2000, step: 0.5 });
    expect(r.x[0]).toBeCloseTo(1, 4);
    expect(r.x[1]).toBeCloseTo(1, 4);
    expect(r.fx).toBeLessThan(1e-8);
    expect(r.reason).toBe('converged');
  });
  test('reaches the 4-dimensional Rosenbrock minimum', () => {
    const r = minimizeNelderMead(rosenbrock4, [-1.2, 1, -1.2, 1], { maxIterations: 20000, step: 0.5 });
    r.x.forEach((v) => expect(v).toBeCloseTo(1, 3));
  });
  test('stops when asked, and reports every iteration', () => {
    const seen: number[] = [];
    const r = minimizeNelderMead(rosenbrock, [-1.2, 1], { onIteration: (i) => { seen.push(i); return i < 5; } });
    expect(r.iterations).toBe(5);
    expect(seen).toEqual([1, 2, 3, 4, 5]);
    expect(r.reason).toBe('stopped');
  });
});

describe('COBYLA-style linear-model trust region (Powell 1994), unconstrained', () => {
  test('reaches the Rosenbrock minimum (1, 1) from (−1.2, 1)', () => {
    const r = minimizeCobyla(rosenbrock, [-1.2, 1], { rhoBegin: 0.5, rhoEnd: 1e-8, maxIterations: 100000 });
    expect(r.x[0]).toBeCloseTo(1, 4);
    expect(r.x[1]).toBeCloseTo(1, 4);
    expect(r.reason).toBe('converged');
  });
  test('solves a separable quadratic in 6 dimensions to round-off (minimum at (0, 0.3, …, 1.5))', () => {
    const f = (x: Float64Array) => x.reduce((s, v, i) => s + (i + 1) * (v - 0.3 * i) ** 2, 0);
    const r = minimizeCobyla(f, new Float64Array(6), { rhoEnd: 1e-8 });
    r.x.forEach((v, i) => expect(v).toBeCloseTo(0.3 * i, 6));
    expect(r.evaluations).toBeLessThan(2000);
  });
});

describe('SPSA (Spall 1992, 1998: a_k = a/(k+1+A)^0.602, c_k = c/(k+1)^0.101)', () => {
  test('approaches the Rosenbrock minimum (1, 1), and is reproducible with a seed', () => {
    const run = () => minimizeSpsa(rosenbrock, [-1.2, 1], { rng: createRng(7), maxIterations: 50000, c: 0.01, firstStep: 0.2 });
    const r = run();
    expect(Math.hypot(r.x[0] - 1, r.x[1] - 1)).toBeLessThan(0.01);
    expect(r.fx).toBeLessThan(1e-4);
    const again = run();
    expect(Array.from(again.x)).toEqual(Array.from(r.x));
    expect(again.evaluations).toBe(r.evaluations);
  });
  test('tolerates noise: a noisy quadratic bowl centred at (0.3, −0.7, 1.1)', () => {
    const noise = createRng(3);
    const centre = [0.3, -0.7, 1.1];
    const f = (x: Float64Array) => ({ value: x.reduce((s, v, i) => s + (v - centre[i]) ** 2, 0) + 0.01 * noise.normal(), stdError: 0.01 });
    const r = minimizeSpsa(f, [0, 0, 0], { rng: createRng(5), maxIterations: 3000, c: 0.2 });
    const last = r.trace[r.trace.length - 1];
    expect(last.iteration).toBe(3000);
    // The best noisy sample, not the iterate, is returned; it lies near the centre.
    r.x.forEach((v, i) => expect(Math.abs(v - centre[i])).toBeLessThan(0.1));
  });
});

describe('Adam (Kingma & Ba 2015)', () => {
  test('reaches the Rosenbrock minimum (1, 1) with the analytic gradient', () => {
    const r = minimizeAdam(rosenbrock, [-1.2, 1], { gradient: rosenbrockGradient, learningRate: 0.02, maxIterations: 20000, stepTolerance: 1e-10 });
    expect(r.x[0]).toBeCloseTo(1, 2);
    expect(r.x[1]).toBeCloseTo(1, 2);
  });
  test('central differences match the analytic Rosenbrock gradient', () => {
    const g = centralDifferenceGradient(rosenbrock, 1e-6)(Float64Array.of(-0.4, 0.9));
    const exact = rosenbrockGradient(Float64Array.of(-0.4, 0.9));
    expect(g[0]).toBeCloseTo(exact[0], 5);
    expect(g[1]).toBeCloseTo(exact[1], 5);
  });
  test('parameter shift is exact for sinusoids a·cos θ + b·sin θ (one-gate expectation, common practice)', () => {
    const f = (x: Float64Array) => 0.7 * Math.cos(x[0]) - 1.3 * Math.sin(x[0]) + 0.4 * Math.cos(x[1] - 0.2);
    const x = Float64Array.of(0.37, -1.1);
    const g = parameterShiftGradient(f)(x);
    expect(g[0]).toBeCloseTo(-0.7 * Math.sin(0.37) - 1.3 * Math.cos(0.37), 12);
    expect(g[1]).toBeCloseTo(-0.4 * Math.sin(-1.1 - 0.2), 12);
  });
});

test('restarts keep the best run and add up the evaluations', () => {
  // Himmelblau's function has four minima of value 0 (common practice); a start far off still lands on one.
  const f = (x: Float64Array) => (x[0] ** 2 + x[1] - 11) ** 2 + (x[0] + x[1] ** 2 - 7) ** 2;
  const starts = [Float64Array.of(0, 0), Float64Array.of(-4, 4), Float64Array.of(4, -4)];
  const single = starts.map((s) => minimizeNelderMead(f, s));
  const r = minimizeWithRestarts(starts, (s) => minimizeNelderMead(f, s));
  expect(r.evaluations).toBe(single.reduce((s, x) => s + x.evaluations, 0));
  expect(r.fx).toBe(Math.min(...single.map((x) => x.fx)));
  expect(r.fx).toBeLessThan(1e-9);
  expect(r.restarts).toBe(3);
});
