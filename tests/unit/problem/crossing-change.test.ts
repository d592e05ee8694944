/**
 * crossingChange (problem/evaluate.ts): the change of crossingWeight when a set of depots takes
 * new sides, from the lanes at those depots only. Checked against crossingWeight recounted over
 * every lane before and after, on random networks (unit, ±1 and real weights; max-cut and k-way).
 */
import { crossingChange, crossingWeight } from '../../../shared/engine/problem/evaluate';
import { createRng } from '../../../shared/engine/random';
import { problemOf, randomGraph } from '../classical/helpers';

describe('crossingChange', () => {
  test('a lane with both ends changing is counted once, with both new ends', () => {
    // Path 0 –1– 1 –2– 2, all on side 0. Moving depots 0 and 1 leaves lane 0–1 uncut and cuts
    // lane 1–2: +2. Adding their single-move gains (+1 and +3) would say +4.
    const problem = problemOf(3, [[0, 1, 1], [1, 2, 2]]);
    expect(crossingChange(problem, [0, 0, 0], [0, 1], [1, 1])).toBe(2);
    expect(crossingWeight(problem, [1, 1, 0]) - crossingWeight(problem, [0, 0, 0])).toBe(2);
  });

  test('depots that keep their side change nothing; a depot listed twice takes its last side', () => {
    const problem = problemOf(3, [[0, 1, 1], [1, 2, 2]]);
    expect(crossingChange(problem, [0, 1, 0], [0, 1, 2], [0, 1, 0])).toBe(0);
    expect(crossingChange(problem, [0, 0, 0], [1, 1], [1, 0])).toBe(0);
    expect(crossingChange(problem, [0, 0, 0], [1, 1], [0, 1])).toBe(3);
  });

  test.each([
    ['maxcut', 'unit', 2], ['maxcut', 'pm1', 2], ['maxcut', 'real', 2], ['kway', 'pm1', 4], ['kway', 'real', 5],
  ] as const)('%s, %s weights: equals crossingWeight recounted, on random depot sets', (kind, weight, k) => {
    for (let seed = 1; seed <= 12; seed++) {
      const n = 25 + 3 * seed;
      const problem = problemOf(n, randomGraph(n, 0.2, 100 * seed + k, weight), kind === 'kway' ? { kind, k } : {});
      const rng = createRng(seed);
      const before = Int32Array.from({ length: n }, () => rng.int(k));
      for (let trial = 0; trial < 20; trial++) {
        // Depot sets of 1…15: many of their lanes join two listed depots.
        const size = 1 + rng.int(15);
        const depots = Array.from({ length: size }, () => rng.int(n));
        const sides = depots.map(() => rng.int(k));
        const after = before.slice();
        depots.forEach((v, i) => (after[v] = sides[i]));
        const recounted = crossingWeight(problem, after) - crossingWeight(problem, before);
        const change = crossingChange(problem, before, depots, sides);
        if (weight === 'real') expect(change).toBeCloseTo(recounted, 9);
        else expect(change).toBe(recounted);
      }
    }
  });
});
