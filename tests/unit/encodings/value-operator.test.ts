import { encodeBisection } from '../../../shared/engine/encodings/bisection';
import { encodeKwayOneHot } from '../../../shared/engine/encodings/kway-onehot';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import { isingEnergyAt } from '../../../shared/engine/encodings/qubo';
import { slackCoefficients } from '../../../shared/engine/encodings/slack';
import { crossingWeight } from '../../../shared/engine/problem/evaluate';
import { createRng } from '../../../shared/engine/random';
import { problemOf, randomGraph } from './fixtures';

describe('value operators read the business value on the same qubits', () => {
  const rng = createRng(77);
  const n = 6;
  const edges = randomGraph(rng, n, 0.6, () => 1 + rng.int(4));

  test.each(['maxcut', 'bisection'] as const)('%s: value operator = crossingWeight(decode(x)) on every state', (kind) => {
    const p = problemOf(n, edges, { kind, pins: { '3': 1 }, tolerance: 0.2 });
    const enc = kind === 'maxcut' ? encodeMaxCut(p) : encodeBisection(p);
    for (let x = 0; x < 2 ** enc.numQubits; x++) expect(isingEnergyAt(enc.valueOperator, x)).toBeCloseTo(crossingWeight(p, enc.decode(x)), 10);
  });

  test('kway one-hot: value operator = crossing weight on every valid one-hot state', () => {
    const p = problemOf(4, randomGraph(rng, 4, 0.8, () => 1 + rng.int(3)), { kind: 'kway', k: 3 });
    const enc = encodeKwayOneHot(p);
    let checked = 0;
    for (let code = 0; code < 3 ** 4; code++) {
      const a = [0, 1, 2, 3].map((i) => Math.floor(code / 3 ** i) % 3);
      const bits = enc.encodeAssignment(a);
      let x = 0;
      bits.forEach((b, q) => (x += b * 2 ** q));
      expect(Array.from(enc.decode(x))).toEqual(a);
      expect(isingEnergyAt(enc.valueOperator, x)).toBeCloseTo(crossingWeight(p, a), 10);
      checked++;
    }
    expect(checked).toBe(81);
  });

  test('encodeAssignment inverts decode on the depot qubits', () => {
    const p = problemOf(n, edges, { kind: 'maxcut', pins: { '2': 0, '5': 1 } });
    const enc = encodeMaxCut(p);
    for (let x = 0; x < 2 ** enc.numQubits; x++) {
      const bits = enc.encodeAssignment(enc.decode(x));
      let y = 0;
      bits.forEach((b, q) => (y += b * 2 ** q));
      expect(y).toBe(x);
    }
  });
});

describe('bounded binary slack (common practice)', () => {
  test.each([1, 2, 3, 4, 5, 6, 7, 8, 13, 31])('x ∈ {0…%i}: every value reachable, nothing beyond', (max) => {
    const c = slackCoefficients(max);
    const reach = new Set<number>();
    for (let b = 0; b < 2 ** c.length; b++) reach.add(c.reduce((s, v, j) => s + (((b >> j) & 1) ? v : 0), 0));
    expect([...reach].sort((a, b) => a - b)).toEqual(Array.from({ length: max + 1 }, (_, i) => i));
    expect(c.length).toBe(Math.ceil(Math.log2(max + 1)));
  });
});
