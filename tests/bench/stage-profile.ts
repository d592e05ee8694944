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

/**
 * On its own: the stage profile of one `qaoa-blocks` solve of a G-set graph (lanes at volume |w|,
 * as bench/spread.ts builds it), seed 1 — no services, one thread plus the simulator's own.
 *
 *   npx tsx tests/bench/stage-profile.ts [--instance G22] [--max-iterations 150] [--min-spread 16] [--settings JSON]
 */
async function main(): Promise<void> {
  const args = process.argv.slice(2);
  if (args.includes('--help')) {
    console.log('npx tsx tests/bench/stage-profile.ts [--instance G22] [--max-iterations 150] [--min-spread 16] [--settings JSON]');
    return;
  }
  const opt = (name: string): string | undefined => { const i = args.indexOf(name); return i >= 0 ? args[i + 1] : undefined; };
  const instance = opt('--instance') ?? 'G22';
  const settings = { maxIterations: Number(opt('--max-iterations') ?? 150), ...(JSON.parse(opt('--settings') ?? '{}') as Record<string, unknown>) };
  const minSpread = Number(opt('--min-spread') ?? 16);
  const { readInstance } = await import('../data/load');
  const { compactFromEdges } = await import('../../shared/engine/network/build');
  const { bindProblem } = await import('../../shared/engine/problem/bind');
  const { simKernelsBackend } = await import('../../server/lib/sim-wasm');
  const { n, edges } = readInstance('gset', instance);
  const problem = bindProblem(compactFromEdges(n, edges.map(([a, b, w]) => [a, b, Math.abs(w)] as [number, number, number])), { kind: 'maxcut' });
  const started = performance.now();
  const p = await profileStages(problem, 'qaoa-blocks', settings, 1, minSpread, simKernelsBackend());
  console.log(`${instance} (${n} depots, ${edges.length} lanes), settings ${JSON.stringify(settings)}, seed 1, stages of ≥ ${minSpread} tasks spread`);
  console.log('| stage | tasks | where the tasks run | tasks CPU s | then in the job\'s thread CPU s |\n|---|---|---|---|---|');
  console.log(`| plan | – | – | – | ${p.planSeconds.toFixed(2)} |`);
  for (const st of p.stages) console.log(`| ${st.label} | ${st.tasks} | ${st.spread ? 'spread' : "job's thread"} | ${st.taskSeconds.toFixed(2)} | ${st.resumeSeconds.toFixed(2)} |`);
  const total = p.serialSeconds + p.parallelSeconds;
  console.log(`cut ${p.value}; serial ${p.serialSeconds.toFixed(2)} s of ${total.toFixed(2)} s CPU (${((100 * p.serialSeconds) / total).toFixed(1)} %); Amdahl bound at 2 workers ${p.bound(2).toFixed(2)}; wall ${((performance.now() - started) / 1000).toFixed(1)} s`);
  process.exit(0);
}

if (require.main === module) {
  main().catch((e) => {
    console.error(e);
    process.exit(1);
  });
}
