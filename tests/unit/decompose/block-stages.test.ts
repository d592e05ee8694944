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
import { planBlocks, resumeBlocks, type BlocksState } from '../../../shared/engine/variational/block-stages';
import type { BlockAnswer, BlockTask } from '../../../shared/engine/variational/block-task';
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
