/**
 * The max-cut merge of qaoa-blocks (variational/block-merge.ts): which route a block graph takes
 * (exact, recursive QAOA, or blocks of blocks by the closed form's counted work), and blocks of
 * blocks as a stage of its own — spread like the first block solves, the same answer through JSON
 * in any order as in one process, a valid assignment, and pins kept. Seeds fixed.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import { crossingWeight } from '../../../shared/engine/problem/evaluate';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng } from '../../../shared/engine/random';
import { mergeRoute, orientationProblem, orientHere, rqaoaPassWork } from '../../../shared/engine/variational/block-merge';
import { decomposeByBlocks, planBlocks, resumeBlocks, type BlocksStep } from '../../../shared/engine/variational/block-stages';
import { runBlockTask, type BlockTask } from '../../../shared/engine/variational/block-task';
import type { DecomposeOptions } from '../../../shared/engine/variational/decompose';
import type { Edge } from '../classical/helpers';

const maxcut = (n: number, edges: Edge[], pins: Record<string, number> = {}): Problem => bindProblem(compactFromEdges(n, edges), { kind: 'maxcut', pins });
const complete = (n: number, weight: (i: number, j: number) => number = () => 1): Edge[] => {
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) edges.push([i, j, weight(i, j)]);
  return edges;
};
const ring = (n: number): Edge[] => Array.from({ length: n }, (_, i): Edge => [i, (i + 1) % n, 1 + (i % 3)]);
const random = (n: number, p: number, seed: number): Edge[] => {
  const rng = createRng(seed);
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) edges.push([i, j, 1 + rng.int(4)]);
  return edges;
};
const json = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

describe('merge route', () => {
  test('recursive QAOA work counts couplings and triangles per pass times the rounds', () => {
    // K10 with depot 0 pinned: 9 free spins, K9 among them (36 couplings, 3·C(9,3) = 252 coupling–triangle pairs), 9 − 4 rounds.
    expect(rqaoaPassWork(maxcut(10, complete(10), { '1': 0 }), 4)).toBe((36 + 252) * 5);
    // A ring has no triangles; the pin turns the pinned depot's two couplings into fields: 38 couplings on 39 free spins.
    expect(rqaoaPassWork(maxcut(40, ring(40), { '1': 0 }), 16)).toBe(38 * (39 - 16));
    expect(rqaoaPassWork(maxcut(10, complete(10), { '1': 0 }), 9)).toBe(0);
  });

  test('few free blocks: exact; a sparse block graph: recursive QAOA; a dense one: blocks of blocks', () => {
    expect(mergeRoute(maxcut(12, complete(12), { '1': 0 }), 16)).toBe('exact');
    expect(mergeRoute(maxcut(170, ring(170), { '1': 0 }), 16)).toBe('rqaoa');
    expect(mergeRoute(maxcut(170, complete(170), { '1': 0 }), 16)).toBe('blocks');
    // The threshold is the rule: the same dense graph under a higher work limit stays with recursive QAOA.
    expect(mergeRoute(maxcut(170, complete(170), { '1': 0 }), 16, 1e12)).toBe('rqaoa');
  });

  test('the orientation problem pins the blocks holding pinned depots (or block 0) and orients to the same cut as flipping depots', () => {
    const problem = maxcut(9, random(9, 0.6, 3), { '5': 1 });
    const blockOf = [0, 0, 0, 1, 1, 1, 2, 2, 2];
    const sides = [0, 1, 0, 1, 1, 0, 0, 1, 1];
    const mp = orientationProblem(problem, blockOf, 3, sides);
    expect(Array.from(mp.pins)).toEqual([-1, 0, -1]); // depot 5 (id '5' = index 4) lies in block 1
    const { flip, method } = orientHere(mp, 16, () => false);
    expect(method).toBe('exact');
    const flipped = sides.map((s, i) => s ^ (flip[blockOf[i]] as number));
    // Exact over 2² orientations: no orientation of the free blocks beats it.
    for (let f = 0; f < 4; f++) {
      const t = [f & 1, 0, (f >> 1) & 1];
      expect(crossingWeight(problem, sides.map((s, i) => s ^ t[blockOf[i]]))).toBeLessThanOrEqual(crossingWeight(problem, flipped) + 1e-9);
    }
  });
});

describe('blocks of blocks as a stage', () => {
  // 90 depots in blocks of ≤ 5 (18+ blocks), dense enough that every pair of blocks shares lanes.
  const problem = maxcut(90, random(90, 0.5, 11), { '3': 1, '50': 0 });
  const opts: DecomposeOptions = { blockSize: 5, layers: 1, shots: 0, readoutShots: 128, restarts: 1, maxIterations: 15, mergeExactLimit: 4, rounds: 1, refine: true, mergeRqaoaWork: 1000 };
  const control = { shouldStop: () => false };

  /** Stages as the worker runs them: tasks through JSON in reverse order, state through JSON. */
  function staged(o: DecomposeOptions, seed: number): { steps: BlocksStep[]; final: Extract<BlocksStep, { kind: 'done' }> } {
    const steps: BlocksStep[] = [];
    let step = planBlocks(problem, o, seed);
    while (step.kind === 'spread') {
      steps.push(step);
      const answers = json(step.tasks).reverse().map((t: BlockTask) => json(runBlockTask(t, { shouldStop: () => false })));
      step = resumeBlocks(problem, o, seed, json(step.state), answers, control);
    }
    return { steps, final: step };
  }

  test('a dense block graph is merged by a stage of sub-block tasks (not in the job thread), the same answer as in one process', () => {
    const { steps, final } = staged(opts, 5);
    expect(steps.map((s) => (s.kind === 'spread' ? s.state.phase : 'done'))).toEqual(['blocks', 'merge', 'round', 'orient']); // the round re-oriented as blocks of blocks too
    const merge = steps[1];
    if (merge.kind !== 'spread') throw new Error('no merge stage');
    const blocks = final.outcome.merge.blocks;
    // Sub-blocks of ≤ blockSize blocks, covering every block once.
    expect(merge.tasks.reduce((s, t) => s + t.n, 0)).toBe(blocks);
    expect(merge.tasks.every((t) => t.n <= opts.blockSize)).toBe(true);
    expect(final.outcome.merge.method).toBe('blocks');
    const local = decomposeByBlocks(problem, opts, 5, control);
    expect(Array.from(final.outcome.assignment)).toEqual(Array.from(local.assignment));
    expect(final.outcome.mergedValue).toBe(local.mergedValue);
    // Valid: pins kept (depot '3' is index 2, '50' is index 49).
    expect(final.outcome.assignment[2]).toBe(1);
    expect(final.outcome.assignment[49]).toBe(0);
  }, 60_000);

  test('the merge gain is what the orientations changed: merged cut − cut of the first block answers', () => {
    const { steps, final } = staged({ ...opts, rounds: 0 }, 5);
    const first = steps[1];
    if (first.kind !== 'spread') throw new Error('no merge stage');
    const beforeMerge = crossingWeight(problem, first.state.sides);
    expect(final.outcome.merge.gain).toBeCloseTo(final.outcome.mergedValue - beforeMerge, 9);
  }, 60_000);

  test('a sub-block whose child never answered (cancelled) keeps its blocks as they are; the answer is still whole and keeps the pins', () => {
    let step = planBlocks(problem, opts, 5);
    if (step.kind !== 'spread') throw new Error('no tasks');
    step = resumeBlocks(problem, opts, 5, step.state, step.tasks.map((t) => runBlockTask(t, { shouldStop: () => false })), control);
    if (step.kind !== 'spread' || step.state.phase !== 'merge') throw new Error('no merge stage');
    const stopped = resumeBlocks(problem, { ...opts, rounds: 0 }, 5, json(step.state), [], control);
    if (stopped.kind !== 'done') throw new Error('unfinished');
    expect(stopped.outcome.assignment).toHaveLength(90);
    expect(stopped.outcome.assignment[2]).toBe(1);
    expect(stopped.outcome.assignment[49]).toBe(0);
  }, 60_000);

  test('under the default work limit this small graph merges by recursive QAOA or exactly, in the job thread (no merge stage)', () => {
    const { steps, final } = staged({ ...opts, mergeRqaoaWork: undefined }, 5);
    expect(steps.map((s) => (s.kind === 'spread' ? s.state.phase : ''))).not.toContain('merge');
    expect(['rqaoa', 'exact']).toContain(final.outcome.merge.method);
  }, 60_000);
});
