/**
 * Worker-thread side: run one classical task (types in task-types.ts). A 'solve' task finds its
 * solver through the lookup the thread entry gives (classical-worker.ts), so this file does not
 * import the solvers that start it.
 */
import type { SolverDefinition } from '../../solvers/types';
import { enumerateChunks } from '../exact';
import { buildMilp } from '../milp-model';
import { runMilp } from './milp-run';
import type { ClassicalTask } from './task-types';

export type { ClassicalTask, ClassicalTaskResult } from './task-types';

/** Finds a classical solver by name (undefined when there is none). */
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
