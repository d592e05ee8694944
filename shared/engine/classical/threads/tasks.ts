/**
 * The tasks a classical worker thread can run. Plain data in (the Problem travels by
 * structured clone: typed arrays and strings), plain data out.
 */
import type { Problem } from '../../problem/types';
import type { SolveResult, SolverDefinition } from '../../solvers/types';
import { enumerateChunks, type ExactBest, type ExactPlan } from '../exact';
import { buildMilp } from '../milp-model';
import { runMilp, type MilpRunResult } from './milp-run';

export type ClassicalTask =
  | { task: 'exact'; problem: Problem; plan: ExactPlan; chunks: number[]; deadlineMs: number }
  | { task: 'milp'; problem: Problem; timeLimitSeconds: number; seed: number; start?: number[] | null }
  | { task: 'solve'; solver: string; problem: Problem; settings: unknown; seed: number; timeLimitSeconds: number };

export type ClassicalTaskResult<T extends ClassicalTask> = T extends { task: 'exact' }
  ? ExactBest
  : T extends { task: 'milp' }
    ? MilpRunResult
    : SolveResult;

/** Finds a classical solver by name (given by the thread entry, so this file does not import the solvers that start it). */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type ClassicalLookup = (name: string) => SolverDefinition<any> | undefined;

export async function runClassicalTask(t: ClassicalTask, lookup: ClassicalLookup): Promise<unknown> {
  if (t.task === 'exact') return enumerateChunks(t.problem, t.plan, t.chunks, t.deadlineMs);
  if (t.task === 'milp') return runMilp(buildMilp(t.problem), { timeLimitSeconds: t.timeLimitSeconds, seed: t.seed, start: t.start });
  const def = lookup(t.solver);
  if (!def) throw new Error(`no classical solver named "${t.solver}"`);
  const settings = def.parseSettings(t.settings);
  return def.solve(t.problem, settings, { seed: t.seed, timeLimitSeconds: t.timeLimitSeconds });
}
