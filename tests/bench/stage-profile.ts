/**
 * Where a staged solve's CPU time goes, stage by stage, measured in this process: the same
 * calls a solve thread makes (startStaged / resumeStaged with the bound, runStagedTask per task),
 * one after another on one thread, with this process's CPU time around each. A stage of at least
 * `minSpread` tasks is what the solve worker spreads over the queue (the parallel part); the
 * plan, every resume (merge, rounds' bookkeeping, refinement, bound) and smaller stages run in
 * the job's own thread (the serial part). From the two shares, Amdahl's law bounds the wall-time
 * ratio w workers can reach: (S + P) / (S + P / w) — before any queue traffic.
 */
import { resumeStaged, runStagedTask, startStaged, type StagedRunStep } from '../../shared/engine/solvers/orchestrate';
import type { Problem } from '../../shared/engine/problem/types';
import type { LayerBackend } from '../../shared/engine/statevector/backend';

export interface StageCost {
  /** 'plan', then per stage: its phase (blocks, merge, round) as the state says. */
  label: string;
  tasks: number;
  /** CPU seconds of the stage's tasks, and of the resume that follows them (merge, next stage's plan, refinement, bound). */
  taskSeconds: number;
  resumeSeconds: number;
  spread: boolean;
}

export interface StageProfile {
  stages: StageCost[];
  planSeconds: number;
  serialSeconds: number;
  parallelSeconds: number;
  /** Amdahl's bound on the 1-worker / w-worker wall-time ratio. */
  bound(workers: number): number;
  value: number;
}

const cpuSeconds = () => {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1e6;
};

export async function profileStages(problem: Problem, solver: string, settings: Record<string, unknown>, seed: number, minSpread: number, stateKernels?: LayerBackend): Promise<StageProfile> {
  const ctx = { seed, timeLimitSeconds: 3600, startedAt: Date.now(), stateKernels };
  let t = cpuSeconds();
  let step: StagedRunStep = await startStaged(problem, solver, settings, ctx);
  const planSeconds = cpuSeconds() - t;
  const stages: StageCost[] = [];
  while (step.kind === 'spread') {
    const label = String((step.state as { phase?: string }).phase ?? 'stage');
    t = cpuSeconds();
    const answers = step.tasks.map((task) => runStagedTask(solver, task, { shouldStop: () => false, stateKernels }));
    const taskSeconds = cpuSeconds() - t;
    t = cpuSeconds();
    const tasks = step.tasks.length;
    step = await resumeStaged(problem, solver, settings, step.state, answers, ctx);
    stages.push({ label, tasks, taskSeconds, resumeSeconds: cpuSeconds() - t, spread: tasks >= minSpread });
  }
  const parallelSeconds = stages.reduce((s, x) => s + (x.spread ? x.taskSeconds : 0), 0);
  const serialSeconds = planSeconds + stages.reduce((s, x) => s + x.resumeSeconds + (x.spread ? 0 : x.taskSeconds), 0);
  return {
    stages, planSeconds, serialSeconds, parallelSeconds, value: step.result.value,
    bound: (w) => (serialSeconds + parallelSeconds) / (serialSeconds + parallelSeconds / w),
  };
}
