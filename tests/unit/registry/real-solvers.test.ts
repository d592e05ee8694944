/**
 * The registry and solveProblem over the real solver lists (shared/engine/solvers/classical.ts
 * and variational.ts), on textbook instances.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { listSolvers, getSolver, solverRegistry } from '../../../shared/engine/solvers/registry';
import { solveProblem } from '../../../shared/engine/solvers/orchestrate';

const ctx = { seed: 1, timeLimitSeconds: 5 };
const complete = (n: number) => compactFromEdges(n, Array.from({ length: n }, (_, i) => Array.from({ length: n - i - 1 }, (_, j) => [i, i + j + 1, 1] as const)).flat());
const petersen = compactFromEdges(10, [
  ...[0, 1, 2, 3, 4].map((i) => [i, (i + 1) % 5, 1] as const),
  ...[0, 1, 2, 3, 4].map((i) => [5 + i, 5 + ((i + 2) % 5), 1] as const),
  ...[0, 1, 2, 3, 4].map((i) => [i, 5 + i, 1] as const),
]);
/** L×L grid graph, depot r·L + c. */
const grid = (L: number) => {
  const e: [number, number, number][] = [];
  for (let r = 0; r < L; r++) for (let c = 0; c < L; c++) {
    if (c + 1 < L) e.push([r * L + c, r * L + c + 1, 1]);
    if (r + 1 < L) e.push([r * L + c, (r + 1) * L + c, 1]);
  }
  return compactFromEdges(L * L, e);
};

describe('registry over the real solvers', () => {
  test('every solver the product documents is registered once, with a guarantee', () => {
    expect(solverRegistry.names).toEqual(expect.arrayContaining(['exact', 'milp', 'greedy', 'tabu', 'anneal', 'gw', 'fm', 'best', 'vqe', 'qaoa']));
    expect(new Set(solverRegistry.names).size).toBe(solverRegistry.names.length);
    for (const s of listSolvers()) {
      expect(['exact', 'bound', 'heuristic', 'variational']).toContain(s.family);
      expect(s.guarantee.length).toBeGreaterThan(20);
      expect(s.kinds.length).toBeGreaterThan(0);
    }
    expect(listSolvers('kway').map((s) => s.name)).not.toContain('gw'); // Goemans–Williamson is a max-cut method
    expect(getSolver('qaoa').family).toBe('variational');
  });
});

describe('solveProblem with real solvers (textbook values, common practice)', () => {
  test('Petersen graph max-cut = 12, proven by exact enumeration', async () => {
    const r = await solveProblem(bindProblem(petersen, { kind: 'maxcut' }), 'exact', {}, ctx);
    expect(r.value).toBe(12);
    expect(r.provenOptimal).toBe(true);
    expect(r.bound).toBe(12);
  });

  test('K_8 max-cut = ⌊n²/4⌋ = 16 by tabu; the bound is a true upper bound', async () => {
    const r = await solveProblem(bindProblem(complete(8), { kind: 'maxcut' }), 'tabu', {}, { seed: 1, timeLimitSeconds: 0.5 });
    expect(r.value).toBe(16);
    expect(r.bound).not.toBeNull();
    expect(r.bound!).toBeGreaterThanOrEqual(16);
  });

  test('4×4 grid minimum bisection = L = 4 (exact), balanced', async () => {
    const r = await solveProblem(bindProblem(grid(4), { kind: 'bisection' }), 'exact', {}, ctx);
    expect(r.value).toBe(4);
    expect(r.infeasible).toBe(false);
    expect(r.assignment.filter((a) => a === 0)).toHaveLength(8);
  });

  test('K_6 in 3 balanced regions crosses C(6,2) − 3·C(2,2) = 12 lanes whatever the split', async () => {
    const r = await solveProblem(bindProblem(complete(6), { kind: 'kway', k: 3 }), 'fm', {}, { seed: 1, timeLimitSeconds: 0.5 });
    expect(r.infeasible).toBe(false);
    expect(r.value).toBe(12);
  });

  test('pins are honoured by the real solvers and checked by the orchestrator', async () => {
    const r = await solveProblem(bindProblem(petersen, { kind: 'maxcut', pins: { '1': 1, '2': 1 } }), 'exact', {}, ctx);
    expect(r.assignment[0]).toBe(1);
    expect(r.assignment[1]).toBe(1);
    expect(r.infeasible).toBe(false);
    // Independent optimum under the pins: all 2^8 assignments of the other depots.
    let best = 0;
    for (let mask = 0; mask < 256; mask++) {
      const a = [1, 1, ...Array.from({ length: 8 }, (_, i) => (mask >> i) & 1)];
      let cut = 0;
      for (let e = 0; e < petersen.m; e++) if (a[petersen.laneFrom[e]] !== a[petersen.laneTo[e]]) cut++;
      best = Math.max(best, cut);
    }
    expect(r.value).toBe(best);
    // The Petersen graph is edge-transitive, so some maximum cut leaves lane 1–2 uncut: still 12.
    expect(best).toBe(12);

  });
});
