/**
 * qaoa-blocks in stages (variational/block-stages.ts): the stages a worker spreads over the job
 * queue give the same answer as the in-process solve — tasks and answers through JSON, run in
 * any order, the state carried as JSON between stages — for max-cut with improvement rounds,
 * pins, and bisection. Seeds fixed.
 */
import { compactFromEdges } from '../../../shared/engine/network/build';
import { bindProblem } from '../../../shared/engine/problem/bind';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng, deriveSeed } from '../../../shared/engine/random';
import { runStagedTask, resumeStaged, solveProblem, startStaged, type StagedRunStep } from '../../../shared/engine/solvers/orchestrate';
import { crossingWeight } from '../../../shared/engine/problem/evaluate';
import { planBlocks, resumeBlocks, decomposeByBlocks, type BlocksState, type BlocksStep } from '../../../shared/engine/variational/block-stages';
import { runBlockTask, type BlockAnswer, type BlockTask } from '../../../shared/engine/variational/block-task';
import type { DecomposeOptions } from '../../../shared/engine/variational/decompose';
import type { Edge } from '../classical/helpers';

const graph = (n: number, p: number, seed: number): Edge[] => {
  const rng = createRng(seed);
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) edges.push([i, j, 1 + rng.int(4)]);
  return edges;
};
const problemOf = (kind: 'maxcut' | 'bisection', n: number, seed: number, pins: Record<string, number> = {}): Problem =>
  bindProblem(compactFromEdges(n, graph(n, 0.12, seed)), kind === 'maxcut' ? { kind, pins } : { kind, pins, tolerance: 0.1 });

const json = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;
const SETTINGS = { blockSize: 6, layers: 1, maxIterations: 30, readoutShots: 256, rounds: 2, mergeExactLimit: 4 };

/** What the worker does: every stage's tasks through JSON, run in reverse order, answers through JSON, resumed from the JSON state. */
async function spreadSolve(problem: Problem, settings: Record<string, unknown>, seed: number): Promise<{ step: StagedRunStep; stages: number; tasks: number }> {
  const ctx = { seed, timeLimitSeconds: 600, startedAt: Date.now() };
  let step = await startStaged(problem, 'qaoa-blocks', settings, ctx, { bounds: false });
  let stages = 0, tasks = 0;
  while (step.kind === 'spread') {
    stages++;
    tasks += step.tasks.length;
    const answers = json(step.tasks).reverse().map((task) => json(runStagedTask('qaoa-blocks', task, { shouldStop: () => false })));
    step = await resumeStaged(problem, 'qaoa-blocks', settings, json(step.state), answers, ctx, { bounds: false });
  }
  return { step, stages, tasks };
}

describe('qaoa-blocks stages: spread over tasks = the in-process solve', () => {
  test.each([
    ['max-cut with improvement rounds', problemOf('maxcut', 48, 3), 11],
    ['max-cut with pins', problemOf('maxcut', 40, 4, { '1': 1, '40': 0, '17': 1 }), 5],
    ['bisection', problemOf('bisection', 44, 6), 2],
  ] as const)('%s: same assignment and value for the same seed', async (_name, problem, seed) => {
    const local = await solveProblem(problem, 'qaoa-blocks', SETTINGS, { seed, timeLimitSeconds: 600 }, { bounds: false });
    const { step, stages, tasks } = await spreadSolve(problem, SETTINGS, seed);
    if (step.kind !== 'done') throw new Error('unfinished');
    expect(stages).toBeGreaterThanOrEqual(1);
    expect(tasks).toBeGreaterThan(problem.network.n / 6 - 1); // one task per block at least
    expect(step.result.assignment).toEqual(local.assignment);
    expect(step.result.value).toBe(local.value);
    expect(step.result.refinement).toEqual(local.refinement);
    expect(step.result.evaluations).toBe(local.evaluations);
  }, 120_000);

  test('max-cut runs its improvement rounds as further stages (blocks re-solved with fixed surroundings)', async () => {
    const { stages } = await spreadSolve(problemOf('maxcut', 48, 3), SETTINGS, 11);
    expect(stages).toBeGreaterThanOrEqual(2);
    const { stages: none } = await spreadSolve(problemOf('maxcut', 48, 3), { ...SETTINGS, rounds: 0 }, 11);
    expect(none).toBe(1);
  }, 120_000);

  test('a different seed gives a different plan or answer (the seed reaches every task)', () => {
    const problem = problemOf('maxcut', 48, 3);
    const opts = { ...SETTINGS, shots: 0, restarts: 1, refine: true };
    const a = planBlocks(problem, opts, 1), b = planBlocks(problem, opts, 2);
    if (a.kind !== 'spread' || b.kind !== 'spread') throw new Error('no tasks');
    expect(a.tasks.map((t) => t.seed)).not.toEqual(b.tasks.map((t) => t.seed));
    expect(new Set(a.tasks.map((t) => t.seed)).size).toBe(a.tasks.length);
    expect(a.tasks[0].seed).toBe(deriveSeed(1, 0, 0));
  });

  test('answers are matched by block: a repeated or unknown block is refused, a missing one (cancelled child) keeps its starting sides', () => {
    const problem = problemOf('maxcut', 30, 8);
    const opts = { ...SETTINGS, shots: 0, restarts: 1, refine: false, rounds: 0 };
    const plan = planBlocks(problem, opts, 4);
    if (plan.kind !== 'spread') throw new Error('no tasks');
    const answers = plan.tasks.map((t: BlockTask): BlockAnswer => ({ block: t.block, sides: t.pins.map((p) => (p >= 0 ? p : 1)), qubits: t.n, value: 0, evaluations: 1, shots: 0, stopped: false, solved: true }));
    const state = () => json(plan.state) as BlocksState;
    const control = { shouldStop: () => false };
    expect(() => resumeBlocks(problem, opts, 4, state(), [...answers, answers[0]], control)).toThrow(/repeated/);
    expect(() => resumeBlocks(problem, opts, 4, state(), [{ ...answers[0], block: 999 }], control)).toThrow(/unknown/);
    const partial = resumeBlocks(problem, opts, 4, state(), answers.slice(1), control);
    if (partial.kind !== 'done') throw new Error('rounds were off');
    expect(partial.outcome.stopped).toBe(true);
    expect(partial.outcome.assignment).toHaveLength(30);
  });
});

describe('improvement rounds on a dense block graph: the re-orientation is a stage of sub-block tasks (blocks of blocks)', () => {
  // 60 depots at lane density 0.5 in blocks of ≤ 5: every pair of blocks shares lanes. A low work
  // limit sends the block graph to sub-blocks (G22's 167-block graph is over the default limit).
  const problem = bindProblem(compactFromEdges(60, graph(60, 0.5, 21)), { kind: 'maxcut', pins: { '7': 1 } });
  const opts: DecomposeOptions = { blockSize: 5, layers: 1, shots: 0, readoutShots: 128, restarts: 1, maxIterations: 15, mergeExactLimit: 4, rounds: 3, refine: true, mergeRqaoaWork: 1000 };
  const control = { shouldStop: () => false };

  /** The worker's way: tasks and answers through JSON, run in reverse order, the state through JSON. */
  function staged(o: DecomposeOptions, seed: number): { steps: Extract<BlocksStep, { kind: 'spread' }>[]; final: Extract<BlocksStep, { kind: 'done' }> } {
    const steps: Extract<BlocksStep, { kind: 'spread' }>[] = [];
    let step = planBlocks(problem, o, seed);
    while (step.kind === 'spread') {
      steps.push(json(step));
      const answers = json(step.tasks).reverse().map((t: BlockTask) => json(runBlockTask(t, { shouldStop: () => false })));
      step = resumeBlocks(problem, o, seed, json(step.state), answers, control);
    }
    return { steps, final: step };
  }

  test('every round is followed by an orient stage whose sub-blocks cover the round\'s blocks; the answer equals the in-process solve', () => {
    const { steps, final } = staged(opts, 9);
    const phases = steps.map((s) => s.state.phase);
    expect(phases).toEqual(['blocks', 'merge', 'round', 'orient', 'round', 'orient', 'round', 'orient']);
    expect(phases.filter((p) => p === 'orient').length).toBe(final.outcome.rounds);
    expect(final.outcome.rounds).toBeGreaterThanOrEqual(1);
    steps.forEach((s, i) => {
      if (s.state.phase !== 'orient') return;
      const roundBlocks = new Set(steps[i - 1].state.roundBlockOf).size;
      expect(s.tasks.reduce((sum, t) => sum + t.n, 0)).toBe(roundBlocks); // each of the round's blocks in one sub-block
      expect(s.tasks.every((t) => t.n <= opts.blockSize)).toBe(true);
      expect(s.state.mergeBlockOf).toHaveLength(roundBlocks);
    });
    const local = decomposeByBlocks(problem, opts, 9, control);
    expect(Array.from(final.outcome.assignment)).toEqual(Array.from(local.assignment));
    expect(final.outcome.roundsGain).toBe(local.roundsGain);
    expect(final.outcome.evaluations).toBe(local.evaluations);
    expect(final.outcome.assignment[6]).toBe(1); // pin kept (depot '7' is index 6)
    expect(crossingWeight(problem, final.outcome.assignment)).toBeGreaterThanOrEqual(final.outcome.mergedValue);
  }, 60_000);

  test('each round\'s sub-block tasks have seeds of their own (apart from the merge\'s and the other rounds\')', () => {
    const { steps } = staged({ ...opts, rounds: 2 }, 9);
    const seeds = steps.filter((s) => s.state.phase !== 'blocks').flatMap((s) => s.tasks.map((t) => t.seed));
    expect(new Set(seeds).size).toBe(seeds.length);
  }, 60_000);

  test('an orient stage without answers (cancelled children) still closes its round, never below the cut after the proposals', () => {
    const { steps } = staged(opts, 9);
    const orient = steps.find((s) => s.state.phase === 'orient')!;
    const after = resumeBlocks(problem, { ...opts, refine: false, rounds: orient.state.round + 1 }, 9, json(orient.state), [], control);
    if (after.kind !== 'done') throw new Error('the last round should end the solve');
    expect(after.outcome.rounds).toBe(orient.state.round + 1);
    expect(after.outcome.unrefinedValue).toBeGreaterThanOrEqual(crossingWeight(problem, orient.state.sides));
    expect(after.outcome.assignment[6]).toBe(1);
  }, 60_000);

  test('under the default work limit this small block graph is re-oriented in the job\'s thread (no orient stage)', () => {
    const { steps } = staged({ ...opts, mergeRqaoaWork: undefined }, 9);
    expect(steps.map((s) => s.state.phase)).not.toContain('orient');
    expect(steps.map((s) => s.state.phase)).toContain('round');
  }, 60_000);
});
