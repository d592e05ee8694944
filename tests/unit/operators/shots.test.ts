/**
 * Shot-based energy estimates and the shot-budget planner.
 * Sources (references.md "Shot noise"; textbook, allocation usually credited to Wecker, Hastings,
 * Troyer, Phys. Rev. A 92, 042303 (2015) [memory]): Var(Ê) = Σ_g Var(H_g)/s_g; optimal
 * s_g ∝ √Var(H_g); max-cut is one group and N ≥ (Σ|w|)²/(4ε²) shots suffice (Popoviciu).
 * Coverage: a normal estimate lies within 3 standard errors with probability 99.73 % (common
 * practice); with 400 seeded trials we require ≥ 99 %.
 */
import { createRng } from '../../../shared/engine/random';
import { estimateByShots } from '../../../shared/engine/operators/estimate';
import { planShotBudget } from '../../../shared/engine/operators/budget';
import { exactExpectation, isingToPauliSum } from '../../../shared/engine/operators/pauli';
import { groupQubitWise } from '../../../shared/engine/operators/grouping';
import type { IsingOperator, PauliSum } from '../../../shared/engine/operators/types';
import { createPlusState, createZeroState } from '../../../shared/engine/statevector/state';
import { applyQaoaLayer } from '../../../shared/engine/statevector/gates';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { randomPauliSum, randomState } from './helpers';

const stats = (xs: number[]) => {
  const m = xs.reduce((a, b) => a + b, 0) / xs.length;
  const v = xs.reduce((a, b) => a + (b - m) ** 2, 0) / (xs.length - 1);
  return { mean: m, sd: Math.sqrt(v) };
};

describe('shot estimation', () => {
  const rng = createRng(2024);
  const p: PauliSum = randomPauliSum(5, 12, rng);
  const state = randomState(5, rng);
  const exact = exactExpectation(state, p);

  test('estimates fall within 3 standard errors in ≥ 99 % of 400 trials; reported error ≈ spread', () => {
    const grouping = groupQubitWise(p);
    expect(grouping.groups.length).toBeGreaterThan(1);
    const trials = 400, shots = 400;
    const estimates: number[] = [], errors: number[] = [];
    let inside = 0;
    const trialRng = createRng(7);
    for (let t = 0; t < trials; t++) {
      const e = estimateByShots(state, p, { shotsPerGroup: shots, rng: trialRng, grouping });
      estimates.push(e.mean);
      errors.push(e.stdError);
      if (Math.abs(e.mean - exact) <= 3 * e.stdError) inside++;
      expect(e.shots).toBe(shots * grouping.groups.length);
    }
    expect(inside / trials).toBeGreaterThanOrEqual(0.99);
    const spread = stats(estimates);
    const meanError = stats(errors).mean;
    expect(Math.abs(meanError / spread.sd - 1)).toBeLessThan(0.15);
    // Unbiased: the average of 400 estimates is within 4 of its own standard errors.
    expect(Math.abs(spread.mean - exact)).toBeLessThan(4 * spread.sd / Math.sqrt(trials));
  });

  test('per-term means and errors match their ±1 expectations', () => {
    const e = estimateByShots(state, p, { shotsPerGroup: 20000, rng: createRng(3) });
    p.terms.forEach((t, k) => {
      const single: PauliSum = { numQubits: 5, offset: 0, terms: [{ letters: t.letters, coeff: 1 }] };
      const truth = exactExpectation(state, single);
      expect(Math.abs(e.terms[k].mean - truth)).toBeLessThan(4.5 * e.terms[k].stdError);
      expect(e.terms[k].stdError).toBeCloseTo(Math.sqrt((1 - truth * truth) / 20000), 3);
    });
  });

  test('zero sample variance is not reported as zero error', () => {
    // |00⟩ is an eigenstate of ZI and IZ: every shot agrees, the estimate is exact...
    const z: PauliSum = { numQubits: 2, offset: 0, terms: [{ letters: 'ZI', coeff: 1 }, { letters: 'IZ', coeff: 2 }] };
    const e = estimateByShots(createZeroState(2), z, { shotsPerGroup: 100, rng: createRng(1) });
    expect(e.mean).toBe(3);
    // ...but a finite sample cannot prove zero variance: add-half chance q = ½/(m+1) of another
    // reading, deviation at most the range 2Σ|c| = 6: Var ≈ 6²·q(1 − q).
    const q = 0.5 / 101;
    expect(e.stdError).toBeCloseTo(Math.sqrt((36 * q * (1 - q)) / 100), 12);
    expect(e.terms[1].stdError).toBeCloseTo(Math.sqrt((4 * q * (1 - q)) / 100), 12);
    expect(e.terms[0].stdError).toBeGreaterThan(0);
    // A conserved sum: Z0 + Z1 on (|01⟩ + |10⟩)/√2 is always 0 while each term is ±1 at random.
    const bell = createZeroState(2);
    bell.amps[0] = 0;
    bell.amps[2] = bell.amps[4] = Math.SQRT1_2;
    const sum: PauliSum = { numQubits: 2, offset: 0, terms: [{ letters: 'ZI', coeff: 1 }, { letters: 'IZ', coeff: 1 }] };
    const b = estimateByShots(bell, sum, { shotsPerGroup: 400, rng: createRng(2) });
    expect(b.mean).toBe(0);
    expect(b.stdError).toBeCloseTo(Math.sqrt((16 * (0.5 / 401) * (1 - 0.5 / 401)) / 400), 12);
    expect(b.terms[0].stdError).toBeGreaterThan(0.04); // ≈ 1/√400
  });
});

describe('shot budget', () => {
  test('planned totals reach the target ε empirically; weighted never needs more than uniform', () => {
    const rng = createRng(99);
    const p = randomPauliSum(4, 10, rng);
    const state = randomState(4, rng);
    const exact = exactExpectation(state, p);
    const eps = 0.1;
    const plan = planShotBudget(p, eps, { state });
    expect(plan.groups).toBe(groupQubitWise(p).groups.length);
    expect(plan.weighted.total).toBeLessThanOrEqual(plan.uniform.total);
    expect(plan.weighted.perGroup.reduce((a, b) => a + b, 0)).toBe(plan.weighted.total);
    const trialRng = createRng(5);
    for (const alloc of [plan.uniform.perGroup, plan.weighted.perGroup]) {
      const errs: number[] = [];
      for (let t = 0; t < 150; t++) errs.push(estimateByShots(state, p, { shotsPerGroup: alloc, rng: trialRng }).mean - exact);
      const rms = Math.sqrt(errs.reduce((a, b) => a + b * b, 0) / errs.length);
      // RMS error of 150 trials estimates ε within ~±12 % (χ² spread); allow 20 %.
      expect(rms).toBeLessThan(eps * 1.2);
      expect(rms).toBeGreaterThan(eps * 0.7);
    }
  });

  test('weighted ≤ uniform for many random operators, with and without a state', () => {
    const rng = createRng(17);
    for (let t = 0; t < 30; t++) {
      const p = randomPauliSum(4, 3 + rng.int(12), rng);
      for (const opts of [undefined, { state: randomState(4, rng) }]) {
        const plan = planShotBudget(p, 0.01 + rng.next() * 0.1, opts);
        expect(plan.weighted.total).toBeLessThanOrEqual(plan.uniform.total);
      }
    }
  });

  test('max-cut cost (one group): the state-free plan is (Σ|w|)²/(4ε²) and it suffices (Popoviciu)', () => {
    // Cut operator C = Σ w (1 − Z_uZ_v)/2 on a 5-cycle with a chord, weights 1…6.
    const edges = [[0, 1], [1, 2], [2, 3], [3, 4], [4, 0], [0, 2]];
    const w = [1, 2, 3, 4, 5, 6];
    const op: IsingOperator = {
      numQubits: 5, offset: w.reduce((a, b) => a + b, 0) / 2, linear: new Float64Array(5),
      quadI: Int32Array.from(edges.map((e) => e[0])), quadJ: Int32Array.from(edges.map((e) => e[1])), quadCoeff: Float64Array.from(w.map((x) => -x / 2)),
    };
    const p = isingToPauliSum(op);
    const eps = 0.2;
    const plan = planShotBudget(p, eps);
    expect(plan.groups).toBe(1);
    const sumW = 21;
    expect(plan.uniform.total).toBe(Math.ceil((sumW * sumW) / (4 * eps * eps)));
    expect(plan.weighted.total).toBe(plan.uniform.total);
    // A p = 1 QAOA state: the bound-based plan achieves ≤ ε.
    const s = createPlusState(5);
    applyQaoaLayer(s, isingDiagonal(op), 0.4, 0.3);
    const exact = exactExpectation(s, p);
    const trialRng = createRng(8);
    const errs: number[] = [];
    for (let t = 0; t < 200; t++) errs.push(estimateByShots(s, p, { shotsPerGroup: plan.uniform.perGroup, rng: trialRng }).mean - exact);
    const rms = Math.sqrt(errs.reduce((a, b) => a + b * b, 0) / errs.length);
    expect(rms).toBeLessThan(eps);
    // The state's own variance plan is smaller than the bound.
    expect(planShotBudget(p, eps, { state: s }).uniform.total).toBeLessThan(plan.uniform.total);
  });
});
