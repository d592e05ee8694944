/**
 * Inside a solve thread: build the network, bind the problem and run the engine's orchestrator
 * (the same solveProblem the CLI uses). CPU-heavy and possibly synchronous for seconds, which is
 * why it runs here and not in the worker's main thread (that one must keep renewing queue locks).
 */
import { parentPort } from 'node:worker_threads';
import { buildCompactNetwork } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import { resumeStaged, runStagedTask, solveProblem, startStaged, type StagedRunStep } from '../../shared/engine/solvers/orchestrate';
import type { SolveProgress } from '../../shared/engine/solvers/types';
import { simKernelsBackend } from '../lib/sim-wasm';
import { loadRunsConfig } from '../services/queue-config';
import { INTERNAL_ERROR, type SolveTask, type SolveThreadMessage } from './solve-task';

// Errors that describe the user's input (shown as they are) rather than a fault of ours.
const USER_ERRORS = new Set(['SettingsError', 'SolverRefusedError', 'ProblemError', 'NetworkError', 'UnknownSolverError']);

const simThreads = loadRunsConfig().SIM_THREADS;

const post = (msg: SolveThreadMessage) => parentPort!.postMessage(msg);

async function handle(task: SolveTask): Promise<void> {
  post({ type: 'started' });
  const flag = new Int32Array(task.cancelFlag);
  const cancel = { get cancelled() { return Atomics.load(flag, 0) === 1; } };
  const optimum = new Float64Array(task.optimumFlag);
  const knownOptimum = () => (optimum[0] === 1 ? optimum[1] : null);
  let last = 0;
  const onProgress = (progress: SolveProgress) => {
    const now = Date.now();
    if (now - last < 100 && progress.fraction < 1) return;
    last = now;
    post({ type: 'progress', progress: { ...progress } });
  };
  try {
    const stage = task.stage;
    const stateKernels = simKernelsBackend(simThreads);
    if (stage?.kind === 'tasks') {
      const shouldStop = () => cancel.cancelled || Date.now() >= stage.deadline;
      const answers = stage.tasks.map((t, i) => {
        const answer = runStagedTask(task.solver, t, { shouldStop, stateKernels });
        onProgress({ fraction: (i + 1) / stage.tasks.length });
        return answer;
      });
      post({ type: 'answers', answers });
      return;
    }
    const network = buildCompactNetwork(task.document);
    const problem = bindProblem(network, task.problem);
    const ctx = { seed: task.seed, timeLimitSeconds: task.timeLimitSeconds, cancel, onProgress, knownOptimum, stateKernels };
    if (!stage) {
      const result = await solveProblem(problem, task.solver, task.settings, ctx);
      post({ type: 'done', result, cancelled: cancel.cancelled });
      return;
    }
    const staged = { ...ctx, startedAt: stage.startedAt };
    const shouldStop = () => cancel.cancelled || Date.now() >= stage.startedAt + task.timeLimitSeconds * 1000;
    let step: StagedRunStep = stage.kind === 'start'
      ? await startStaged(problem, task.solver, task.settings, staged)
      : await resumeStaged(problem, task.solver, task.settings, stage.state, stage.answers, staged);
    // Small stages (and every stage once the run is stopping) run here: spreading them costs more than it saves.
    while (step.kind === 'spread' && (step.tasks.length < stage.minSpread || shouldStop())) {
      const { tasks, progress } = step;
      const answers = tasks.map((t, i) => {
        const answer = runStagedTask(task.solver, t, { shouldStop, stateKernels });
        onProgress({ fraction: progress.from + ((progress.to - progress.from) * (i + 1)) / tasks.length });
        return answer;
      });
      step = await resumeStaged(problem, task.solver, task.settings, step.state, answers, staged);
    }
    if (step.kind === 'spread') post({ type: 'spread', state: step.state, tasks: step.tasks, progress: step.progress });
    else post({ type: 'done', result: step.result, cancelled: cancel.cancelled });
  } catch (e) {
    const err = e as Error;
    const userError = USER_ERRORS.has(err?.name);
    // Our faults keep their text (file paths, stack) for the log; members see a fixed sentence.
    if (userError) post({ type: 'error', message: err.message, userError });
    else post({ type: 'error', message: INTERNAL_ERROR, userError, detail: err?.stack ?? String(e) });
  }
}

parentPort!.on('message', (task: SolveTask) => {
  void handle(task);
});
