import { qaoaSolver } from '../../../shared/engine/solvers/qaoa';
import { listSolvers } from '../../../shared/engine/solvers/registry';
import { vqeSolver } from '../../../shared/engine/solvers/vqe';
import { SettingsError } from '../../../shared/engine/classical/settings';
import { crossingWeight, isBalanced, respectsPins } from '../../../shared/engine/problem/evaluate';
import type { SolveContext } from '../../../shared/engine/solvers/types';
import { createRng } from '../../../shared/engine/random';
import * as builder from '../../../shared/engine/encodings/builder';
import { encodeProblem } from '../../../shared/engine/encodings';
import { bruteForceBest, problemOf, randomGraph, ringEdges } from '../encodings/fixtures';

const ctx = (seed: number, extra: Partial<SolveContext> = {}): SolveContext => ({ seed, timeLimitSeconds: 30, ...extra });
const withoutTimes = <T extends { seconds: number; trace?: { seconds: number }[] }>(r: T) => ({ ...r, seconds: 0, trace: r.trace?.map((p) => ({ ...p, seconds: 0 })) });

describe('settings', () => {
  test('defaults are filled and the optimizer follows the shots', () => {
    const s = qaoaSolver.parseSettings({});
    expect(s).toMatchObject({ layers: 2, shots: 0, optimizer: 'nelder-mead', restarts: 2, maxQubits: 24, warmStart: false, kwayStrategy: 'recursive' });
    expect(qaoaSolver.parseSettings({ shots: 500 }).optimizer).toBe('spsa');
    expect(vqeSolver.parseSettings({ ansatz: 'alternating', optimizer: 'adam' })).toMatchObject({ ansatz: 'alternating', optimizer: 'adam', entangler: 'ring' });
  });
  test('bad fields are named one by one', () => {
    try {
      qaoaSolver.parseSettings({ layers: 11, shots: 2.5, optimizer: 'newton', lyers: 2 });
      throw new Error('no SettingsError');
    } catch (e) {
      expect(e).toBeInstanceOf(SettingsError);
      const fields = (e as SettingsError).fields;
      expect(Object.keys(fields).sort()).toEqual(['layers', 'lyers', 'optimizer', 'shots']);
      expect(fields.layers).toMatch(/1…10/);
    }
    expect(() => vqeSolver.parseSettings({ ansatz: 'brick' })).toThrow(/ansatz/);
  });
  test('both solvers are registered as variational', () => {
    expect(listSolvers().filter((s) => s.family === 'variational').map((s) => s.name)).toEqual(expect.arrayContaining(['qaoa', 'vqe']));
  });
});

describe('refuses', () => {
  test('more qubits than the limit are refused with the numbers and what to do', () => {
    const big = problemOf(30, ringEdges(30), { kind: 'maxcut' });
    const reason = qaoaSolver.refuses(big, qaoaSolver.parseSettings({}));
    expect(reason).toMatch(/30 qubits/);
    expect(reason).toMatch(/16 GiB/); // 16·2³⁰ bytes
    expect(reason).toMatch(/allows 24/);
    expect(qaoaSolver.refuses(problemOf(12, ringEdges(12), { kind: 'maxcut' }), qaoaSolver.parseSettings({}))).toBeNull();
    // Pinning depots removes qubits.
    const pins = Object.fromEntries(Array.from({ length: 8 }, (_, i) => [String(i + 1), i % 2]));
    expect(qaoaSolver.refuses(problemOf(30, ringEdges(30), { kind: 'maxcut', pins }), qaoaSolver.parseSettings({}))).toBeNull();
  });
  test('a large network is refused from the depot count, without building its operator', () => {
    // Every encoding is assembled by the builders (a built operator here would hold ~12.5 M terms).
    const ising = jest.spyOn(builder, 'createIsingBuilder');
    const qubo = jest.spyOn(builder, 'createQuboBuilder');
    try {
      encodeProblem(problemOf(6, ringEdges(6), { kind: 'bisection' })); // the spies do see a build
      expect(ising).toHaveBeenCalled();
      ising.mockClear();
      const n = 5000;
      const big = problemOf(n, ringEdges(n), { kind: 'bisection' });
      expect(vqeSolver.refuses(big, vqeSolver.parseSettings({}))).toMatch(/at least 5000 qubits/);
      expect(ising).not.toHaveBeenCalled();
      expect(qubo).not.toHaveBeenCalled();
    } finally {
      ising.mockRestore();
      qubo.mockRestore();
    }
  });
  test('k-way one-hot counts n·k qubits; recursive counts the first split only', () => {
    const p = problemOf(10, ringEdges(10), { kind: 'kway', k: 3 });
    expect(qaoaSolver.refuses(p, qaoaSolver.parseSettings({ kwayStrategy: 'onehot' }))).toMatch(/one-hot k-way encoding needs (at least )?3\d qubits/);
    expect(qaoaSolver.refuses(p, qaoaSolver.parseSettings({}))).toBeNull();
  });
});

describe('solve', () => {
  const rng = createRng(21);
  const n = 8;
  const edges = randomGraph(rng, n, 0.5, () => 1 + rng.int(3));

  test('max-cut: value and every sample value are the crossing weight of their assignment; seeded runs repeat exactly', async () => {
    const p = problemOf(n, edges, { kind: 'maxcut' });
    const s = qaoaSolver.parseSettings({ layers: 2, restarts: 1, maxIterations: 100 });
    const r = await qaoaSolver.solve(p, s, ctx(5));
    expect(r.value).toBe(crossingWeight(p, r.assignment));
    for (const smp of r.samples!) expect(smp.value).toBe(crossingWeight(p, smp.assignment));
    expect(r.value).toBeGreaterThanOrEqual(Math.max(...r.samples!.map((x) => x.value))); // best over all distinct samples
    expect(r.expectation!).toBeLessThanOrEqual(bruteForceBest(p).value + 1e-9); // ⟨C⟩ never exceeds the max cut
    expect(r.energy!).toBeCloseTo(-r.expectation!, 9);
    expect(r.params).toHaveLength(4);
    expect(r.trace!.length).toBeGreaterThan(0);
    const again = await qaoaSolver.solve(p, s, ctx(5));
    expect(withoutTimes(again)).toEqual(withoutTimes(r));
  });

  test('bisection with shot noise: best FEASIBLE sample returned, shots counted', async () => {
    const p = problemOf(n, edges, { kind: 'bisection' });
    const s = vqeSolver.parseSettings({ layers: 1, shots: 256, restarts: 1, maxIterations: 60 });
    const r = await vqeSolver.solve(p, s, ctx(3));
    expect(r.infeasible).toBeUndefined();
    expect(isBalanced(p, r.assignment)).toBe(true);
    expect(r.value).toBe(crossingWeight(p, r.assignment));
    expect(r.shots).toBe(r.evaluations * 256 + 1024);
    expect(r.trace!.some((t) => t.stdError! > 0)).toBe(true);
  });

  test('k-way by recursive bisection respects pins and regions 0…k−1', async () => {
    const m = 9;
    const p = problemOf(m, randomGraph(createRng(2), m, 0.4), { kind: 'kway', k: 3, pins: { '1': 2 } });
    const r = await qaoaSolver.solve(p, qaoaSolver.parseSettings({ layers: 1, restarts: 1, maxIterations: 80 }), ctx(1));
    expect(respectsPins(p, r.assignment)).toBe(true);
    expect(new Set(r.assignment).size).toBe(3);
    expect(r.value).toBe(crossingWeight(p, r.assignment));
    expect(r.infeasible ?? false).toBe(!isBalanced(p, r.assignment));
  });

  test('warm start notes the classical answer it started from', async () => {
    const p = problemOf(n, edges, { kind: 'maxcut' });
    const r = await qaoaSolver.solve(p, qaoaSolver.parseSettings({ layers: 1, warmStart: true, restarts: 1, maxIterations: 50 }), ctx(2));
    expect(r.notes!.some((x) => /warm start from/.test(x))).toBe(true);
    expect(r.value).toBe(crossingWeight(p, r.assignment));
  });

  test('k-way one-hot on a tiny network returns regions 0…k−1 and reports balance honestly', async () => {
    const p = problemOf(4, randomGraph(createRng(6), 4, 0.8), { kind: 'kway', k: 3 });
    const r = await qaoaSolver.solve(p, qaoaSolver.parseSettings({ kwayStrategy: 'onehot', layers: 1, restarts: 1, maxIterations: 40 }), ctx(4));
    expect(r.assignment.every((x) => x >= 0 && x < 3)).toBe(true);
    expect(r.value).toBe(crossingWeight(p, r.assignment));
    expect(r.infeasible ?? false).toBe(!isBalanced(p, r.assignment));
    expect(r.notes!.some((x) => /one-hot/.test(x))).toBe(true);
  });

  test('a zero time limit stops after the first iteration', async () => {
    const p = problemOf(n, edges, { kind: 'bisection' });
    const r = await vqeSolver.solve(p, vqeSolver.parseSettings({ restarts: 4, optimizer: 'adam' }), { seed: 1, timeLimitSeconds: 0 });
    expect(r.trace!.length).toBe(1);
    expect(r.notes).toContain('stopped early (time limit or cancel)');
  });

  test('a cancelled recursive k-way run still answers every depot and says it stopped', async () => {
    const p = problemOf(8, randomGraph(createRng(12), 8, 0.5), { kind: 'kway', k: 4 });
    const r = await qaoaSolver.solve(p, qaoaSolver.parseSettings({ layers: 1 }), ctx(2, { cancel: { cancelled: true } }));
    expect(r.assignment).toHaveLength(8);
    expect(r.trace!.length).toBe(3); // one iteration per split, k − 1 = 3 splits
    expect(r.notes).toContain('stopped early (time limit or cancel)');
  });

  test('a cancelled run stops after its first iteration and says so', async () => {
    const p = problemOf(n, edges, { kind: 'maxcut' });
    const progress: number[] = [];
    const r = await qaoaSolver.solve(p, qaoaSolver.parseSettings({ restarts: 3 }), ctx(2, { cancel: { cancelled: true }, onProgress: (x) => progress.push(x.fraction) }));
    expect(r.trace!.length).toBe(1);
    expect(r.notes).toContain('stopped early (time limit or cancel)');
    expect(r.value).toBe(crossingWeight(p, r.assignment));
    expect(progress.length).toBe(1);
  });
});
