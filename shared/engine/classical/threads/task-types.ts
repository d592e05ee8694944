/**
 * The tasks a classical worker thread can run, as plain data (the Problem travels by structured
 * clone: typed arrays and strings). Types only, so the pool and the worker side share them
 * without importing each other.
 */
import type { Problem } from '../../problem/types';
import type { SolveResult } from '../../solvers/types';
import type { ExactBest, ExactPlan } from '../exact';
import type { MilpRunResult } from './milp-run';

export type ClassicalTask =
  | { task: 'exact'; problem: Problem; plan: ExactPlan; chunks: number[]; deadlineMs: number }
  | { task: 'milp'; problem: Problem; timeLimitSeconds: number; seed: number; start?: number[] | null }
  | { task: 'solve'; solver: string; problem: Problem; settings: unknown; seed: number; timeLimitSeconds: number };

export type ClassicalTaskResult<T extends ClassicalTask> = T extends { task: 'exact' }
  ? ExactBest
  : T extends { task: 'milp' }
    ? MilpRunResult
    : SolveResult;
