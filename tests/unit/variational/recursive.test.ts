import { encodeBisection } from '../../../shared/engine/encodings/bisection';
import { isingEnergyAt } from '../../../shared/engine/encodings/qubo';
import { crossingWeight, isBalanced } from '../../../shared/engine/problem/evaluate';
import { createRng } from '../../../shared/engine/random';
import { firstBisectionStep, inducedNetwork, recursiveBisection } from '../../../shared/engine/variational/recursive-bisection';
import { bruteForceBest, problemOf, randomGraph } from '../encodings/fixtures';

/** Exact bisection of a step: ground state of its encoding (brute force over the qubits). */
async function exactSplit(step: Parameters<Parameters<typeof recursiveBisection>[1]>[0]) {
  const enc = encodeBisection(step.problem, { imbalanceWindow: step.imbalanceWindow });
  let best = 0, bestE = Infinity;
  for (let x = 0; x < 2 ** enc.numQubits; x++) {
    const e = isingEnergyAt(enc.operator, x);
    if (e < bestE) { bestE = e; best = x; }
  }
  const sides = enc.decode(best);
  expect(enc.feasible(sides)).toBe(true);
  return sides;
}

describe('recursive bisection for k-way (driver strategy)', () => {
  test('induced sub-network keeps lanes inside and depot weights', () => {
    const p = problemOf(5, [[0, 1, 2], [1, 2, 3], [2, 3, 4], [3, 4, 5], [0, 4, 6]], { kind: 'kway', k: 3 }, [1, 2, 3, 4, 5]);
    const sub = inducedNetwork(p.network, Int32Array.of(1, 2, 4));
    expect(sub.n).toBe(3);
    expect(Array.from(sub.depotWeight)).toEqual([2, 3, 5]);
    expect(sub.m).toBe(1); // only lane 1–2 (weight 3) has both ends inside
    expect(sub.laneWeight[0]).toBe(3);
  });

  test('k = 3 gets uneven targets: side 0 holds one region, side 1 two', () => {
    const p = problemOf(9, randomGraph(createRng(1), 9, 0.4), { kind: 'kway', k: 3 });
    const step = firstBisectionStep(p);
    expect([step.regions0, step.regions1]).toEqual([1, 2]);
    // maxPartWeight = 9/3 + 2/3 = 3.667, unit depots ⇒ L = 3: W₀ ≤ L and W₁ ≤ 2L ⇒ D ∈ [9 − 4L, 2L − 9].
    const L = 3;
    expect(step.imbalanceWindow.min).toBeCloseTo(9 - 4 * L, 6);
    expect(step.imbalanceWindow.max).toBeCloseTo(2 * L - 9, 6);
  });

  test.each([[3, 7], [4, 8], [5, 10], [8, 16]])('k = %i on %i depots with exact splits: balanced, pins kept, value ≥ brute-force optimum', async (k, n) => {
    const p = problemOf(n, randomGraph(createRng(k * n), n, 0.45, () => 1 + (k % 2)), { kind: 'kway', k, pins: { '1': k - 1 } });
    const a = await recursiveBisection(p, exactSplit);
    expect(a[0]).toBe(k - 1);
    expect(new Set(a).size).toBe(k);
    expect(isBalanced(p, a)).toBe(true);
    // Recursive splitting is a heuristic: never better than the true k-way optimum.
    if (n <= 8) expect(crossingWeight(p, a)).toBeGreaterThanOrEqual(bruteForceBest(p).value - 1e-9);
  });
});
