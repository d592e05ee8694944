import type { NetworkDocument } from '../../shared/engine/network/types';
import type { ProblemSpec } from '../../shared/engine/problem/types';
import type { SolveProgress } from '../../shared/engine/solvers/types';
import type { RunResult } from '../../shared/engine/solvers/orchestrate';

/**
 * The job error members see when the fault is ours (the details are in the worker's log, found
 * by job id). Job errors are shown to every member, viewers included: never file paths or stack.
 */
export const INTERNAL_ERROR = "internal error in the solver; the details are in the solve worker's log";

/**
 * Staged solvers (qaoa-blocks) in a solve thread: `start` / `resume` run stages here while a
 * stage has fewer than `minSpread` tasks (or the run is stopping) and hand back a larger stage's
 * tasks to spread over the queue (spread-job.ts); `tasks` runs a batch of one stage's tasks.
 */
export type StageRequest =
  | { kind: 'start'; startedAt: number; minSpread: number }
  | { kind: 'resume'; startedAt: number; minSpread: number; state: unknown; answers: unknown[] }
  | { kind: 'tasks'; tasks: unknown[]; deadline: number };

/** What the worker's main thread sends a solve thread (plain data, structured-cloned). */
export interface SolveTask {
  /** Absent: the whole solve here (solveProblem). A `tasks` request reads neither document nor problem. */
  stage?: StageRequest;
  document: NetworkDocument;
  problem: ProblemSpec;
  solver: string;
  settings: Record<string, unknown>;
  seed: number;
  timeLimitSeconds: number;
  /** Int32Array(1) over a SharedArrayBuffer: 1 = stop. Read by the CancelToken even while the thread is busy. */
  cancelFlag: SharedArrayBuffer;
  /**
   * Float64Array(2) over a SharedArrayBuffer: [1, value] once another solver of the run has proven
   * `value` optimal (the orchestrator then stops a heuristic that reaches it), else [0, 0].
   */
  optimumFlag: SharedArrayBuffer;
}

/** Messages a solve thread posts back. */
export type SolveThreadMessage =
  /** The thread took the task (the engine is loaded): the hard time limit counts from here. */
  | { type: 'started' }
  | { type: 'progress'; progress: SolveProgress }
  | { type: 'done'; result: RunResult; cancelled: boolean }
  /** A staged solve's next stage, to spread: its tasks and the state to resume from. */
  | { type: 'spread'; state: unknown; tasks: unknown[]; progress: { from: number; to: number } }
  /** Answers to a `tasks` request, in its order. */
  | { type: 'answers'; answers: unknown[] }
  /** `message` is shown to every member of the organisation; `detail` (stack text) goes to the worker's log only. */
  | { type: 'error'; message: string; userError: boolean; detail?: string };
