import { createLadderAnsatz } from '../../../shared/engine/ansatz/ladder';
import { createRng } from '../../../shared/engine/random';
import { createCvarEstimator } from '../../../shared/engine/variational/cvar';

/** CVaR_α by its definition (Barkoutsos et al., Quantum 4, 256 (2020)): sort outcomes, average the best α share. */
function cvarByDefinition(probs: number[], energies: number[], alpha: number): number {
  const order = energies.map((e, x) => ({ e, p: probs[x] })).sort((a, b) => a.e - b.e);
  let left = alpha, sum = 0;
  for (const { e, p } of order) { const take = Math.min(left, p); sum += take * e; left -= take; if (left <= 0) break; }
  return sum / alpha;
}

describe('CVaR objective', () => {
  const n = 5;
  const rng = createRng(3);
  const diag = Float64Array.from({ length: 2 ** n }, () => Math.round(rng.normal() * 4)); // ties included
  const state = createLadderAnsatz({ numQubits: n, layers: 1 }).prepare(Float64Array.from({ length: 4 * n }, () => rng.normal()));
  const probs = Array.from({ length: 2 ** n }, (_, x) => state.amps[2 * x] ** 2 + state.amps[2 * x + 1] ** 2);

  test.each([1, 0.5, 0.2, 0.05])('exact CVaR_%f equals the sorted-outcome definition', (alpha) => {
    expect(createCvarEstimator(diag, alpha, 0, rng)(state).value).toBeCloseTo(cvarByDefinition(probs, Array.from(diag), alpha), 12);
  });

  test('α = 1 is the expectation; smaller α never gives more', () => {
    const mean = probs.reduce((s, p, x) => s + p * diag[x], 0);
    expect(createCvarEstimator(diag, 1, 0, rng)(state).value).toBeCloseTo(mean, 12);
    expect(createCvarEstimator(diag, 0.3, 0, rng)(state).value).toBeLessThanOrEqual(mean);
  });

  test('with shots it is the mean of the lowest ⌈α·shots⌉ sampled energies, close to the exact value', () => {
    const exact = createCvarEstimator(diag, 0.25, 0, rng)(state).value;
    const est = createCvarEstimator(diag, 0.25, 20000, createRng(5))(state);
    expect(Math.abs(est.value - exact)).toBeLessThan(5 * est.stdError + 0.05);
  });

  test('refuses α outside (0, 1]', () => {
    expect(() => createCvarEstimator(diag, 0, 0, rng)).toThrow(/cvarAlpha/);
    expect(() => createCvarEstimator(diag, 1.5, 0, rng)).toThrow(/cvarAlpha/);
  });
});
