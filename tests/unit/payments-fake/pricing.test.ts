import fc from 'fast-check';
import { PLAN_IDS, formatMoney, paidRunPlan, priceOfRun, runLimits, runPriceCeiling, runSizeRefusal, seatLimit } from '../../../shared/plans';

/**
 * The one pricing rule (shared/plans.ts), checked by hand-worked examples from its price table
 * and by properties that any per-solve price must keep: integer cents (common practice for
 * money), free inside the included size, never cheaper for a larger run.
 */
describe('priceOfRun', () => {
  it('hand-worked examples from the free plan table', () => {
    // 210 depots, one classical solver: 200 base + 1 started 100 depots × 50 = 250.
    expect(priceOfRun('free', { depots: 210, secondsPerSolver: 10, solvers: [{ family: 'heuristic', qubits: null }] })).toMatchObject({ amount: 250, currency: 'eur' });
    // 20 qubits QAOA: 200 + 25 × (2⁴ − 1) = 575.
    expect(priceOfRun('free', { depots: 20, secondsPerSolver: 10, solvers: [{ family: 'variational', qubits: 20 }] })!.amount).toBe(575);
    // 120 s with two solvers: 200 + 1 started minute × 10 × 2 = 220.
    expect(priceOfRun('free', { depots: 10, secondsPerSolver: 120, solvers: [{ family: 'heuristic', qubits: null }, { family: 'exact', qubits: null }] })!.amount).toBe(220);
    expect(formatMoney({ amount: 575, currency: 'eur' })).toBe('€5.75');
  });

  it('is free inside the included size until the monthly allowance is used, then a small-run price', () => {
    const small = { depots: 50, secondsPerSolver: 10, solvers: [{ family: 'variational', qubits: 12 }] };
    expect(priceOfRun('free', { ...small, runsThisMonth: 0 })).toBeNull();
    expect(priceOfRun('free', { ...small, runsThisMonth: 10_000 })).toMatchObject({ amount: 50 });
  });

  it('classical solvers pay no qubit surcharge however many qubits the network would need', () => {
    expect(priceOfRun('free', { depots: 150, secondsPerSolver: 10, solvers: [{ family: 'heuristic', qubits: 150 }] })).toBeNull();
  });

  it('integer cents, free inside the limits, at most the ceiling, monotone in depots, qubits and seconds (every plan); beyond the ceiling refused', () => {
    const size = fc.record({
      depots: fc.integer({ min: 1, max: 25_000 }),
      secondsPerSolver: fc.integer({ min: 1, max: 3600 }),
      qubits: fc.integer({ min: 1, max: 26 }),
      plan: fc.constantFrom(...PLAN_IDS),
    });
    fc.assert(
      fc.property(size, fc.integer({ min: 0, max: 500 }), fc.integer({ min: 0, max: 4 }), ({ depots, secondsPerSolver, qubits, plan }, moreDepots, moreQubits) => {
        const sizeA = { depots, secondsPerSolver, solvers: [{ family: 'variational', qubits }] };
        const sizeB = { depots: depots + moreDepots, secondsPerSolver, solvers: [{ family: 'variational', qubits: qubits + moreQubits }] };
        // Beyond the paid ceiling there is no price: refused (and refusal is monotone too).
        if (runSizeRefusal(plan, sizeA)) {
          expect(() => priceOfRun(plan, sizeA)).toThrow(RangeError);
          expect(runSizeRefusal(plan, sizeB)).not.toBeNull();
          return;
        }
        const a = priceOfRun(plan, sizeA);
        const amountA = a?.amount ?? 0;
        if (a) {
          expect(Number.isSafeInteger(a.amount) && a.amount > 0).toBe(true);
          expect(a.lines.reduce((s, l) => s + l.amount, 0)).toBe(a.amount);
          expect(a.amount).toBeLessThanOrEqual(runPriceCeiling(plan));
        }
        const lim = runLimits(plan);
        if (depots <= lim.maxDepots && qubits <= lim.maxQubits && secondsPerSolver <= lim.maxSecondsPerSolver) expect(a).toBeNull();
        if (runSizeRefusal(plan, sizeB)) return;
        expect(priceOfRun(plan, sizeB)?.amount ?? 0).toBeGreaterThanOrEqual(amountA);
      }),
      { numRuns: 300 },
    );
  });
});

describe('seats and the paid ceiling', () => {
  it('purchased seats add to the plan limit; negative or fractional input never adds seats by mistake', () => {
    expect(seatLimit('free')).toBe(3);
    expect(seatLimit('free', 3)).toBe(6);
    expect(seatLimit('free', -5)).toBe(3);
    expect(seatLimit('unknown-plan', 1.9)).toBe(4);
  });
  it('a paid run is bounded by the next plan up, the top plan by its own', () => {
    expect(paidRunPlan('free')).toBe('team');
    expect(paidRunPlan('team')).toBe('fleet');
    expect(paidRunPlan('fleet')).toBe('fleet');
    expect(paidRunPlan('nonsense')).toBe('team');
  });
});
