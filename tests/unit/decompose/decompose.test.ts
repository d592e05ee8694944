/**
 * qaoa-blocks (decomposition for large max-cut): the merge identity of Zhou, Du, Tian, Tao,
 * "QAOA-in-QAOA: solving large-scale MaxCut problems on small quantum machines", arXiv:2205.11762
 * (2022), the block split, the exact small max-cut against textbook values, and the solver's
 * quality on a seeded random graph against the classical tabu search.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { crossingWeight, isBalanced, respectsPins } from '../../../shared/engine/problem/evaluate';
import { balanceWindow } from '../../../shared/engine/classical/balance';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng } from '../../../shared/engine/random';
import { blockCouplings, exactSmallMaxcut, orientForBisection, splitIntoBlocks } from '../../../shared/engine/variational/decompose';
import { decomposeByBlocks } from '../../../shared/engine/variational/block-stages';
import { qaoaBlocksSolver } from '../../../shared/engine/solvers/qaoa-blocks';
import { solveProblem } from '../../../shared/engine/solvers/orchestrate';
import { getSolver } from '../../../shared/engine/solvers/registry';
import { complete, cycle, petersen, type Edge } from '../classical/helpers';
import { readInstance } from '../../data/load';

/** Pins by 0-based index (compactFromEdges names depot i as "i+1"). */
const maxcut = (n: number, edges: Edge[], pins: Record<number, number> = {}): Problem => bindProblem(compactFromEdges(n, edges), { kind: 'maxcut', pins: Object.fromEntries(Object.entries(pins).map(([i, side]) => [String(Number(i) + 1), side])) });

/** Erdős–Rényi G(n, p) with unit weights, seeded (the "test graph" of the solve service). */
function randomGraph(n: number, p: number, seed: number, signed = false): Edge[] {
  const rng = createRng(seed);
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) edges.push([i, j, signed && rng.next() < 0.5 ? -1 : 1]);
  return edges;
}

describe('merge identity (Zhou et al. 2022): cut = const + Σ w′_ab (1 − t_a t_b)/2', () => {
  test.each([false, true])('holds for every block orientation of a random graph (signed weights: %s)', (signed) => {
    const problem = maxcut(24, randomGraph(24, 0.3, 11, signed));
    const rng = createRng(5);
    const blockOf = Int32Array.from({ length: 24 }, (_, i) => i % 4);
    const sides = Int32Array.from({ length: 24 }, () => rng.int(2));
    const couplings = blockCouplings(problem.network, blockOf, 4, sides);
    const base = crossingWeight(problem, sides);
    // const = cut at t = (+1,…,+1) (the Σ w′(1 − t t)/2 term vanishes there).
    for (let t = 0; t < 16; t++) {
      const flipped = Int32Array.from(sides, (s, i) => ((t >> blockOf[i]) & 1 ? s ^ 1 : s));
      let predicted = base;
      for (const [a, b, w] of couplings) {
        const ta = (t >> a) & 1 ? -1 : 1, tb = (t >> b) & 1 ? -1 : 1;
        predicted += (w * (1 - ta * tb)) / 2;
      }
      expect(crossingWeight(problem, flipped)).toBeCloseTo(predicted, 9);
    }
  });
});

describe('exact small max-cut (enumeration used for the orientation problem)', () => {
  // Textbook values (common practice): Petersen 12, K_n ⌊n²/4⌋, odd cycle n − 1, even cycle n.
  test.each([
    ['Petersen graph', 10, petersen(), 12],
    ['K7', 7, complete(7), 12],
    ['C9', 9, cycle(9), 8],
    ['C10', 10, cycle(10), 10],
  ] as const)('%s', (_name, n, edges, expected) => {
    const problem = maxcut(n, edges as Edge[]);
    expect(crossingWeight(problem, exactSmallMaxcut(problem))).toBe(expected);
  });

  test('keeps pinned vertices on their side', () => {
    const problem = maxcut(7, complete(7), { 0: 1, 1: 1 });
    const sides = exactSmallMaxcut(problem);
    expect([sides[0], sides[1]]).toEqual([1, 1]);
    expect(crossingWeight(problem, sides)).toBe(12); // pinning two depots together still allows ⌊49/4⌋
  });
});

describe('block split', () => {
  test('covers every depot, respects the size limit, keeps dense groups together', () => {
    // Four 5-cliques joined in a ring by single lanes: the best split into blocks of 5 is the cliques.
    const edges: Edge[] = [];
    for (let c = 0; c < 4; c++) {
      for (let i = 0; i < 5; i++) for (let j = i + 1; j < 5; j++) edges.push([5 * c + i, 5 * c + j, 1]);
      edges.push([5 * c + 4, (5 * (c + 1)) % 20, 1]);
    }
    const net = compactFromEdges(20, edges);
    const blockOf = splitIntoBlocks(net, 5, createRng(3));
    const sizes = new Map<number, number>();
    blockOf.forEach((b) => sizes.set(b, (sizes.get(b) ?? 0) + 1));
    expect([...sizes.values()].every((s) => s <= 5)).toBe(true);
    for (let c = 0; c < 4; c++) expect(new Set(Array.from(blockOf.slice(5 * c, 5 * c + 5))).size).toBe(1);
  });

  test('a network no larger than a block stays one block', () => {
    expect(Array.from(splitIntoBlocks(compactFromEdges(10, petersen()), 14, createRng(1)))).toEqual(new Array(10).fill(0));
  });
});

describe('qaoa-blocks solver', () => {
  test('is registered as a variational heuristic for max-cut and bisection and refuses k-way', () => {
    const d = getSolver('qaoa-blocks');
    expect(d.family).toBe('variational');
    expect(d.guarantee).toMatch(/heuristic/i);
    const kway = bindProblem(compactFromEdges(6, cycle(6)), { kind: 'kway', k: 3 });
    expect(d.refuses(kway, d.parseSettings({}))).toMatch(/max-cut and balanced bisection/);
    expect(d.refuses(bindProblem(compactFromEdges(4, cycle(4)), { kind: 'bisection' }), d.parseSettings({}))).toBeNull();
    expect(() => d.parseSettings({ blockSize: 30 })).toThrow(/blockSize/);
    expect(qaoaBlocksSolver.qubits(maxcut(60, randomGraph(60, 0.1, 7)), d.parseSettings({}))).toBe(14);
  });

  test('60-depot seeded random graph G(60, 0.1): within 5 % of the classical tabu search, 1-flip optimal, below the bound', async () => {
    const problem = maxcut(60, randomGraph(60, 0.1, 7));
    const blocks = await solveProblem(problem, 'qaoa-blocks', {}, { seed: 1, timeLimitSeconds: 20 });
    const tabu = await solveProblem(problem, 'tabu', {}, { seed: 1, timeLimitSeconds: 2 }, { bounds: false });
    expect(blocks.value).toBe(crossingWeight(problem, blocks.assignment));
    expect(blocks.value).toBeGreaterThanOrEqual(0.95 * tabu.value);
    expect(blocks.bound).not.toBeNull();
    expect(blocks.value).toBeLessThanOrEqual(blocks.bound!);
    expect(blocks.provenOptimal).toBe(blocks.value === blocks.bound);
    // 1-flip local optimum: no single depot move raises the cut.
    const a = blocks.assignment.slice();
    for (let v = 0; v < 60; v++) {
      a[v] ^= 1;
      expect(crossingWeight(problem, a)).toBeLessThanOrEqual(blocks.value);
      a[v] ^= 1;
    }
    expect(blocks.notes.join(' ')).toMatch(/block\(s\) of at most 14 depots/);
  }, 60_000);

  test('keeps pins and merges by recursive QAOA when there are more free blocks than the exact limit', () => {
    const problem = maxcut(40, randomGraph(40, 0.15, 21), { 0: 1, 39: 0 });
    const out = decomposeByBlocks(problem, { blockSize: 6, layers: 1, shots: 0, readoutShots: 256, restarts: 1, maxIterations: 40, mergeExactLimit: 3, rounds: 1, refine: true }, 2, { shouldStop: () => false });
    expect(out.merge.method).toBe('rqaoa');
    expect(out.assignment[0]).toBe(1);
    expect(out.assignment[39]).toBe(0);
    expect(Math.max(...out.blocks.map((b) => b.qubits))).toBeLessThanOrEqual(6);
    expect(crossingWeight(problem, out.assignment)).toBeGreaterThanOrEqual(out.mergedValue);
  });

  test('stops at once when cancelled and still returns a valid assignment', async () => {
    const problem = maxcut(60, randomGraph(60, 0.1, 7));
    const r = await solveProblem(problem, 'qaoa-blocks', {}, { seed: 1, timeLimitSeconds: 20, cancel: { cancelled: true } }, { bounds: false });
    expect(r.assignment).toHaveLength(60);
    expect(r.notes.join(' ')).toMatch(/stopped early/);
  });
});

describe('qaoa-blocks for balanced bisection', () => {
  test('block orientations: exact search equals brute force over all orientations (crossing and balance)', () => {
    // 6 blocks of 4 depots on a random graph, each block with a fixed internal (unbalanced) split.
    const n = 24;
    const problem = bindProblem(compactFromEdges(n, randomGraph(n, 0.35, 13)), { kind: 'bisection', tolerance: 0.1 });
    const blockOf = Int32Array.from({ length: n }, (_, i) => Math.floor(i / 4));
    const rng = createRng(9);
    const sides = Int32Array.from({ length: n }, () => rng.int(2));
    const imbalance = new Float64Array(6);
    for (let i = 0; i < n; i++) imbalance[blockOf[i]] += sides[i] === 1 ? 1 : -1;
    const fixed = Uint8Array.from([1, 0, 0, 0, 0, 0]);
    const { flip } = orientForBisection(blockCouplings(problem.network, blockOf, 6, sides), imbalance, n, balanceWindow(problem), fixed, 16);
    const apply = (mask: number) => Int32Array.from(sides, (s, i) => ((mask >> blockOf[i]) & 1 ? s ^ 1 : s));
    let best = Infinity;
    for (let mask = 0; mask < 64; mask += 2) { // block 0 fixed
      const a = apply(mask);
      if (isBalanced(problem, a)) best = Math.min(best, crossingWeight(problem, a));
    }
    const mine = apply(flip.reduce((m, f, b) => m | (f << b), 0));
    expect(Number.isFinite(best)).toBe(true); // some orientation is balanced for this seed
    expect(isBalanced(problem, mine)).toBe(true);
    expect(crossingWeight(problem, mine)).toBe(best);
    expect(flip[0]).toBe(0);
  });

  test('60-depot seeded random graph: balanced, pins kept, never below the proven bound', async () => {
    const problem = bindProblem(compactFromEdges(60, randomGraph(60, 0.1, 7)), { kind: 'bisection', pins: { '1': 0, '60': 1 } });
    const r = await solveProblem(problem, 'qaoa-blocks', {}, { seed: 1, timeLimitSeconds: 20 });
    expect(r.infeasible).toBe(false);
    expect(isBalanced(problem, r.assignment)).toBe(true);
    expect(respectsPins(problem, r.assignment)).toBe(true);
    expect(r.value).toBe(crossingWeight(problem, r.assignment));
    expect(r.bound).not.toBeNull();
    expect(r.value).toBeGreaterThanOrEqual(r.bound!);
    expect(r.notes.join(' ')).toMatch(/under the balance rule/);
  }, 60_000);
});

describe('qaoa-blocks at sizes that used to crash', () => {
  test('splitIntoBlocks: 2,000 depots into blocks of 14 — more than 127 blocks, every depot in one, none above 14', () => {
    // Region ids used to live in an Int8Array: block 128 read as −128 and the split read an undefined block.
    const network = compactFromEdges(2000, randomGraph(2000, 0.005, 31));
    const blockOf = splitIntoBlocks(network, 14, createRng(1));
    const count = Math.max(...blockOf) + 1;
    expect(count).toBeGreaterThan(127);
    const sizes = new Array(count).fill(0);
    for (const b of blockOf) sizes[b]++;
    expect(Math.min(...blockOf)).toBe(0);
    expect(Math.max(...sizes)).toBeLessThanOrEqual(14);
    expect(Math.min(...sizes)).toBeGreaterThan(0);
  });

  test('400 depots, 50 free blocks: the merge runs recursive QAOA instead of a 50-qubit circuit', () => {
    const problem = maxcut(400, randomGraph(400, 0.015, 8), { 5: 1 });
    const out = decomposeByBlocks(problem, { blockSize: 8, layers: 1, shots: 0, readoutShots: 64, restarts: 1, maxIterations: 15, mergeExactLimit: 16, rounds: 0, refine: true }, 3, { shouldStop: () => false });
    expect(out.merge.method).toBe('rqaoa');
    expect(out.merge.blocks).toBeGreaterThan(16);
    expect(out.assignment[5]).toBe(1);
    expect(crossingWeight(problem, out.assignment)).toBeGreaterThanOrEqual(out.mergedValue);
  });
});

describe('qaoa-blocks on the G-set instances that used to crash (tests/data/gset, Helmberg & Rendl 2000)', () => {
  const gset = (name: string) => { const { n, edges } = readInstance('gset', name); return bindProblem(compactFromEdges(n, edges), { kind: 'maxcut' }); };

  test('G11 (800 depots, ±1 toroidal): the merge over 57+ blocks answers by recursive QAOA', async () => {
    const problem = gset('G11');
    const r = await solveProblem(problem, 'qaoa-blocks', { maxIterations: 10, rounds: 0 }, { seed: 1, timeLimitSeconds: 3 }, { bounds: false });
    expect(r.assignment).toHaveLength(800);
    expect(r.notes.join(' ')).toMatch(/block orientations by recursive QAOA/);
  });

  test('G22 (2,000 depots): split into more than 127 blocks, then an answer', async () => {
    const problem = gset('G22');
    const r = await solveProblem(problem, 'qaoa-blocks', { maxIterations: 10, rounds: 0 }, { seed: 1, timeLimitSeconds: 3 }, { bounds: false });
    expect(r.assignment).toHaveLength(2000);
    expect(r.notes.join(' ')).toMatch(/1[4-9]\d block\(s\)/);
  });
});

describe('qaoa-blocks refine setting (honest comparison with classical solvers)', () => {
  test('max-cut: refine off reports no classical moves and its own value as unrefined; refine on keeps the value before it', async () => {
    const problem = maxcut(60, randomGraph(60, 0.1, 7));
    const off = await solveProblem(problem, 'qaoa-blocks', { refine: false, maxIterations: 30 }, { seed: 1, timeLimitSeconds: 30 }, { bounds: false });
    expect(off.refinement).toEqual({ applied: false, unrefinedValue: off.value, unrefinedInfeasible: false, moves: 0 });
    const on = await solveProblem(problem, 'qaoa-blocks', { maxIterations: 30 }, { seed: 1, timeLimitSeconds: 30 }, { bounds: false });
    expect(on.refinement!.applied).toBe(true);
    expect(on.value).toBeGreaterThanOrEqual(on.refinement!.unrefinedValue);
    expect(on.notes.join(' ')).toMatch(/refined the answer/);
  });

  test('bisection with refine off: no balance repair — the answer is reported infeasible when it misses the window', async () => {
    const problem = bindProblem(compactFromEdges(60, randomGraph(60, 0.1, 9)), { kind: 'bisection' });
    const r = await solveProblem(problem, 'qaoa-blocks', { refine: false, maxIterations: 20 }, { seed: 2, timeLimitSeconds: 30 }, { bounds: false });
    expect(r.refinement).toMatchObject({ applied: false, moves: 0, unrefinedValue: r.value });
    expect(r.infeasible === true).toBe(!isBalanced(problem, r.assignment));
  });
});

describe('qaoa-blocks result: the blocks the run screen shows', () => {
  test('count, sizes and the block of each depot agree, each block within the block size, the split few-laned', async () => {
    const problem = maxcut(90, randomGraph(90, 0.06, 12));
    const r = await solveProblem(problem, 'qaoa-blocks', { blockSize: 10, maxIterations: 10, rounds: 0 }, { seed: 1, timeLimitSeconds: 30 }, { bounds: false });
    const d = r.decomposition!;
    expect(d.blockOf).toHaveLength(90);
    expect(d.sizes).toHaveLength(d.blocks);
    expect(d.sizes.reduce((a, b) => a + b, 0)).toBe(90);
    expect(Math.max(...d.sizes)).toBeLessThanOrEqual(10);
    d.sizes.forEach((size, b) => expect(d.blockOf.filter((x) => x === b)).toHaveLength(size));
    expect(d.blocks).toBeGreaterThanOrEqual(9);
    expect(d.largestQubits).toBeLessThanOrEqual(10);
    expect(['exact', 'rqaoa']).toContain(d.merge);
    // A partitioner's blocks keep more lanes inside than a random split of the same sizes would
    // (a random split keeps about Σ s(s−1) / (n(n−1)) of them; common practice).
    let inside = 0;
    for (let e = 0; e < problem.network.m; e++) if (d.blockOf[problem.network.laneFrom[e]] === d.blockOf[problem.network.laneTo[e]]) inside++;
    const randomShare = d.sizes.reduce((a, s) => a + s * (s - 1), 0) / (90 * 89);
    expect(inside / problem.network.m).toBeGreaterThan(3 * randomShare);
  });
});
