/**
 * The block-coordinate descent of qaoa-blocks and rqaoa (variational/block-stages.ts): a block
 * re-solved with its surroundings fixed sees them as Ising fields whose energy is the whole cut
 * up to a constant (checked on the statevector diagonal, every block state); every round after the
 * first draws a new split; the descent keeps answers valid and never lowers the cut; the time
 * limit ends it. After Zhou, Du, Tian & Tao, "QAOA-in-QAOA: solving large-scale MaxCut problems
 * on small quantum machines", arXiv:2205.11762 (2022); the redrawn splits are ours.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { crossingWeight, respectsPins } from '../../../shared/engine/problem/evaluate';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng } from '../../../shared/engine/random';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import { isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { blockInContext, blockMembers } from '../../../shared/engine/variational/decompose';
import { applyProposals, BLOCK_QAOA_DEFAULTS, descendByBlocks, descentStalled, IDLE_ROUNDS_TO_STOP, PLATEAU_ROUNDS_TO_STOP, resumeBlocks, roundBlocking, type BlocksState } from '../../../shared/engine/variational/block-stages';
import type { BlockAnswer } from '../../../shared/engine/variational/block-task';
import { solveProblem } from '../../../shared/engine/solvers/orchestrate';
import type { Edge } from '../classical/helpers';

const maxcut = (n: number, edges: Edge[], pins: Record<number, number> = {}): Problem => bindProblem(compactFromEdges(n, edges), { kind: 'maxcut', pins: Object.fromEntries(Object.entries(pins).map(([i, side]) => [String(Number(i) + 1), side])) });

/** Seeded G(n, p); `signed`: weights ±1…±3 (frustrated lanes, as in the ±1 G-set instances). */
function randomGraph(n: number, p: number, seed: number, signed = false): Edge[] {
  const rng = createRng(seed);
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) edges.push([i, j, signed ? (rng.next() < 0.5 ? -1 : 1) * (1 + Math.floor(3 * rng.next())) : 1]);
  return edges;
}

const OPTS = { ...BLOCK_QAOA_DEFAULTS, blockSize: 8, readoutShots: 256, rounds: 6, refine: false };

describe('a block with fixed surroundings: boundary lanes become fields', () => {
  test.each([[false, 3], [true, 5]])('signed weights %s: the statevector energy of every block state is minus the whole cut plus a constant', (signed, seed) => {
    const problem = maxcut(30, randomGraph(30, 0.25, seed, signed), { 2: 1 });
    const rng = createRng(seed + 100);
    const sides = Int32Array.from({ length: 30 }, (_, i) => (problem.pins[i] >= 0 ? problem.pins[i] : rng.next() < 0.5 ? 1 : 0));
    const members = [0, 1, 2, 5, 8, 13, 21, 29]; // depot 2 pinned: one free qubit fewer
    const { sub, around } = blockInContext(problem, members, sides);
    expect(around.length).toBeGreaterThan(0);
    const encoding = encodeMaxCut(sub);
    expect(encoding.numQubits).toBe(members.length - 1);
    const diagonal = isingDiagonal(encoding.operator);
    // The lanes that touch no block depot: the constant the fields leave out.
    const inBlock = new Set(members);
    let outside = 0;
    const { m, laneFrom, laneTo, laneWeight } = problem.network;
    for (let e = 0; e < m; e++) if (!inBlock.has(laneFrom[e]) && !inBlock.has(laneTo[e]) && sides[laneFrom[e]] !== sides[laneTo[e]]) outside += laneWeight[e];
    for (let x = 0; x < diagonal.length; x++) {
      const local = encoding.decode(x);
      const whole = sides.slice();
      members.forEach((v, i) => (whole[v] = local[i]));
      around.forEach((v, i) => expect(local[members.length + i]).toBe(sides[v]));
      expect(crossingWeight(problem, whole)).toBeCloseTo(outside - diagonal[x], 9);
    }
  });
});

describe('descent rounds', () => {
  test('round 0 keeps the plan\'s split; later rounds draw new ones, each block within the size', () => {
    const problem = maxcut(120, randomGraph(120, 0.05, 4));
    const plan = blockMembers(problem.network, 10, createRng(1)).blockOf;
    expect(Array.from(roundBlocking(problem, { ...OPTS, blockSize: 10 }, 1, plan, 0))).toEqual(Array.from(plan));
    const r1 = roundBlocking(problem, { ...OPTS, blockSize: 10 }, 1, plan, 1);
    const r2 = roundBlocking(problem, { ...OPTS, blockSize: 10 }, 1, plan, 2);
    expect(Array.from(r1)).not.toEqual(Array.from(plan));
    expect(Array.from(r2)).not.toEqual(Array.from(r1));
    for (const split of [r1, r2]) {
      const sizes = new Map<number, number>();
      for (const b of split) sizes.set(b, (sizes.get(b) ?? 0) + 1);
      expect(Math.max(...sizes.values())).toBeLessThanOrEqual(10);
      expect(split).toHaveLength(120);
    }
  });

  test.each([[false], [true]])('signed %s: from all depots on one side, valid, pins kept, never lower, and several rounds run', (signed) => {
    const problem = maxcut(60, randomGraph(60, 0.12, 9, signed), { 0: 1, 17: 0 });
    const start = Int32Array.from(problem.pins, (p) => (p >= 0 ? p : 0));
    const before = crossingWeight(problem, start);
    const out = descendByBlocks(problem, start, OPTS, 3, { shouldStop: () => false });
    expect(out.assignment).toHaveLength(60);
    expect(Array.from(out.assignment).every((s) => s === 0 || s === 1)).toBe(true);
    expect(respectsPins(problem, Array.from(out.assignment))).toBe(true);
    expect(out.unrefinedValue).toBeGreaterThan(before);
    expect(out.roundsGain).toBeCloseTo(out.unrefinedValue - before, 9);
    // refine off: the answer is the rounds' own
    expect(out.refineFlips).toBe(0);
    expect(crossingWeight(problem, out.assignment)).toBeCloseTo(out.unrefinedValue, 9);
    expect(out.rounds).toBeGreaterThanOrEqual(2);
  }, 60_000);

  test('rqaoa with the descent is never below its recursion alone (refinement off, same seed)', async () => {
    const problem = maxcut(80, randomGraph(80, 0.1, 12, true));
    const off = await solveProblem(problem, 'rqaoa', { refine: false, descent: false }, { seed: 2, timeLimitSeconds: 120 }, { bounds: false });
    const on = await solveProblem(problem, 'rqaoa', { refine: false }, { seed: 2, timeLimitSeconds: 120 }, { bounds: false });
    expect(on.value).toBeGreaterThanOrEqual(off.value);
    expect(on.refinement?.unrefinedValue).toBe(on.value);
    expect(on.notes.join(' ')).toMatch(/descent round/);
    expect(respectsPins(problem, on.assignment)).toBe(true);
  }, 120_000);
});

describe('plateaus: equal-cut proposals move the descent (±1 weights give blocks many optima of one cut)', () => {
  // An odd ring of 5 with unit lanes: every optimum leaves exactly one lane uncut (cut 4), so
  // moving the uncut lane is a move of equal cut. Sides 0 1 0 1 0 leave lane 4–0 uncut.
  const ring = maxcut(5, [[0, 1, 1], [1, 2, 1], [2, 3, 1], [3, 4, 1], [4, 0, 1]]);
  const sides = [0, 1, 0, 1, 0];
  const roundBlockOf = [0, 0, 1, 1, 2];
  const members = [[0, 1], [2, 3], [4]];
  const answer = (block: number, blockSides: number[]): BlockAnswer => ({ block, sides: blockSides, qubits: blockSides.length, value: 0, evaluations: 0, shots: 0, stopped: false, solved: true });

  test('a proposal of equal cut is kept, one that lowers the cut is not', () => {
    expect(crossingWeight(ring, sides)).toBe(4);
    const equal = applyProposals(ring, sides, members, [undefined, undefined, answer(2, [1])], 4);
    expect(Array.from(equal.assignment)).toEqual([0, 1, 0, 1, 1]);
    expect(equal.value).toBe(4);
    const lower = applyProposals(ring, sides, members, [answer(0, [0, 0]), undefined, undefined], 4);
    expect(Array.from(lower.assignment)).toEqual(sides);
    expect(lower.value).toBe(4);
  });

  test('a round that moved depots without raising the cut does not count towards the idle stop', () => {
    const state: BlocksState = {
      kind: 'maxcut', phase: 'round', round: 5, blockOf: [0, 0, 1, 1, 2], sides, roundBlockOf, idleRounds: IDLE_ROUNDS_TO_STOP - 1, stillRounds: 0, roundStart: 4, blocks: [],
      merge: { method: 'single', blocks: 3, gain: 0 }, blocksValue: 4, mergedValue: 4, roundsGain: 0, refineFlips: 0, evaluations: 0, shots: 0, stopped: false, trace: [],
    };
    const opts = { ...BLOCK_QAOA_DEFAULTS, blockSize: 2, refine: false };
    const moved = resumeBlocks(ring, opts, 1, structuredClone(state), [answer(2, [1])], { shouldStop: () => false });
    // Another round is due, from the moved sides.
    expect(moved.kind).toBe('spread');
    if (moved.kind !== 'spread') return;
    expect(moved.state.sides).toEqual([0, 1, 0, 1, 1]);
    expect(moved.state.stillRounds).toBe(0);
    // The same round with nothing moved: the third still round in a row ends the descent.
    const still = resumeBlocks(ring, opts, 1, { ...structuredClone(state), stillRounds: IDLE_ROUNDS_TO_STOP - 1 }, [answer(2, [0])], { shouldStop: () => false });
    expect(still.kind).toBe('done');
  });

  test('the stop rule: no move for IDLE_ROUNDS_TO_STOP rounds, or no rise for PLATEAU_ROUNDS_TO_STOP', () => {
    expect(descentStalled({ idleRounds: IDLE_ROUNDS_TO_STOP + 2, stillRounds: 0 })).toBe(false);
    expect(descentStalled({ idleRounds: IDLE_ROUNDS_TO_STOP, stillRounds: IDLE_ROUNDS_TO_STOP })).toBe(true);
    expect(descentStalled({ idleRounds: PLATEAU_ROUNDS_TO_STOP, stillRounds: 0 })).toBe(true);
  });
});

describe('the time limit ends the descent (a mid-size network)', () => {
  // Without the limit, 100 rounds on 700 depots run for minutes; the margin covers one block solve and the final pass on a loaded machine.
  test.each(['qaoa-blocks', 'rqaoa'])('%s at a 3 s limit on 700 depots answers validly within 3 s + 4 s', async (solver) => {
    const problem = maxcut(700, randomGraph(700, 0.01, 21));
    const r = await solveProblem(problem, solver, {}, { seed: 1, timeLimitSeconds: 3 }, { bounds: false });
    expect(r.assignment).toHaveLength(700);
    expect(r.seconds).toBeLessThan(7);
    expect(crossingWeight(problem, r.assignment)).toBe(r.value);
  }, 60_000);
});
