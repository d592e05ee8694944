import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';


import { describeEncoding } from '../../../shared/engine/solvers/orchestrate';
import { qaoaSolver } from '../../../shared/engine/solvers/qaoa';

const petersen = compactFromEdges(10, [
  ...[0, 1, 2, 3, 4].map((i) => [i, (i + 1) % 5, 1] as const),
  ...[0, 1, 2, 3, 4].map((i) => [5 + i, 5 + ((i + 2) % 5), 1] as const),
  ...[0, 1, 2, 3, 4].map((i) => [i, 5 + i, 1] as const),
]);
const cycle = (n: number) => compactFromEdges(n, Array.from({ length: n }, (_, i) => [i, (i + 1) % n, 1] as const));

describe('describeEncoding', () => {
  test('max-cut: one qubit per free depot, one ZZ term per lane, offset −W/2, one measurement group', () => {
    // H = Σ (w/2)(Z_uZ_v − 1) (Lucas 2014 max-cut form, cut = −H).
    const d = describeEncoding(bindProblem(petersen, { kind: 'maxcut' }));
    expect(d).toMatchObject({ qubits: 10, depotQubits: 10, slackQubits: 0, pauliTerms: 15, quadraticTerms: 15, linearTerms: 0, offset: -7.5, commutingGroups: 1, penalties: [] });
    expect(d.groupMethod).toContain('operators/grouping'); // counted by the grouping module, not assumed
  });

  test('max-cut shot budget is (Σ|w|)²/(4ε²) (Popoviciu bound on σ_C; references.md shot-noise section)', () => {
    const d = describeEncoding(bindProblem(petersen, { kind: 'maxcut' }), { precision: 0.5 });
    expect(d.shots).toBe(Math.ceil(15 ** 2 / (4 * 0.5 ** 2))); // 225
    expect(describeEncoding(bindProblem(petersen, { kind: 'maxcut' })).shots).toBe(2500); // default ε = 1 % of Σ|w|
  });

  test('pinned depots leave the register: lanes to them become Z terms', () => {
    const d = describeEncoding(bindProblem(cycle(6), { kind: 'maxcut', pins: { '1': 0 } }));
    expect(d.qubits).toBe(5);
    expect(d.linearTerms).toBe(2);
    expect(d.quadraticTerms).toBe(4);
  });

  test('bisection penalty obeys Lucas (2014): A/B > min(2Δ, N)/8 for unit weights', () => {
    const d = describeEncoding(bindProblem(cycle(8), { kind: 'bisection' }));
    expect(d.penalties.length).toBeGreaterThan(0);
    expect(d.penalties[0].weight).toBeGreaterThan(Math.min(2 * 2, 8) / 8);
    expect(d.qubits).toBe(8);
  });

  test('k-way one-hot uses n·k qubits (common practice); the solver counts it when asked for one-hot', () => {
    const p = bindProblem(cycle(6), { kind: 'kway', k: 3 });
    expect(describeEncoding(p).qubits).toBe(18);
    expect(qaoaSolver.qubits(p, qaoaSolver.parseSettings({ kwayStrategy: 'onehot' }))).toBe(18);
  });

  test('oversized operators are refused instead of built', () => {
    const n = 4000;
    const big = bindProblem(compactFromEdges(n, Array.from({ length: n - 1 }, (_, i) => [i, i + 1, 1] as const)), { kind: 'bisection' });
    expect(() => describeEncoding(big)).toThrow('Pauli terms');
  });
});
