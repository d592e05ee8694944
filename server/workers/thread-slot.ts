import { Worker } from 'node:worker_threads';
import * as path from 'node:path';
import type { SolveProgress } from '../../shared/engine/solvers/types';
import type { RunResult } from '../../shared/engine/solvers/orchestrate';
import type { SolveTask, SolveThreadMessage } from './solve-task';

/**
 * One solve slot of a worker process: a long-lived thread that runs one task at a time (so the
 * engine is loaded once, not per job). A thread that must be stopped — cancel not honoured in
 * time, hard time limit passed, crash — is terminated and a fresh one starts with the next task.
 */
export type SlotOutcome =
  | { kind: 'done'; result: RunResult; cancelled: boolean }
  | { kind: 'spread'; state: unknown; tasks: unknown[]; progress: { from: number; to: number } }
  | { kind: 'answers'; answers: unknown[] }
  | { kind: 'error'; message: string; userError: boolean; detail?: string }
  | { kind: 'killed'; reason: 'cancel' | 'timeout' | 'crash'; message: string; detail?: string };
// `message` is what members see (no paths, no stack); `detail` is for the worker's log.

export interface SlotRun {
  outcome: Promise<SlotOutcome>;
  /** Ask the solver to stop (it returns its best so far); terminate the thread after `graceMs` if it does not. */
  cancel(graceMs: number): void;
  /** Tell the solver a value another solver of its run has proven optimal (heuristics stop on reaching it). */
  setKnownOptimum(value: number): void;
}

export interface ThreadSlot {
  run(task: Omit<SolveTask, 'cancelFlag' | 'optimumFlag'>, opts: { hardLimitMs: number; onProgress: (p: SolveProgress) => void }): SlotRun;
  close(): Promise<void>;
}

const ENTRY = path.join(__dirname, 'solve-thread.cjs');
const STARTUP_MS = 120_000;

/** `entry` is the thread's script (tests give a faulty one). */
export function createThreadSlot(entry: string = ENTRY): ThreadSlot {
  let worker: Worker | null = null;
  const fresh = (): Worker => {
    if (!worker) {
      worker = new Worker(entry);
      worker.unref();
    }
    return worker;
  };
  const kill = (w: Worker) => {
    if (worker === w) worker = null;
    void w.terminate();
  };
  return {
    run(task, opts) {
      const w = fresh();
      const flagBuffer = new SharedArrayBuffer(4);
      const flag = new Int32Array(flagBuffer);
      const optimumBuffer = new SharedArrayBuffer(16);
      const optimum = new Float64Array(optimumBuffer);
      let settle!: (o: SlotOutcome) => void;
      const outcome = new Promise<SlotOutcome>((resolve) => (settle = resolve));
      let settled = false;
      let cancelTimer: NodeJS.Timeout | null = null;
      const finish = (o: SlotOutcome) => {
        if (settled) return;
        settled = true;
        clearTimeout(hard);
        if (cancelTimer) clearTimeout(cancelTimer);
        w.off('message', onMessage);
        w.off('error', onError);
        w.off('exit', onExit);
        settle(o);
      };
      const onMessage = (msg: SolveThreadMessage) => {
        if (msg.type === 'started') {
          clearTimeout(hard);
          hard = overdue(opts.hardLimitMs, `stopped after ${Math.round(opts.hardLimitMs / 1000)} s: the solver went past its time limit and grace period`);
        } else if (msg.type === 'progress') opts.onProgress(msg.progress);
        else if (msg.type === 'done') finish({ kind: 'done', result: msg.result, cancelled: msg.cancelled });
        else if (msg.type === 'spread') finish({ kind: 'spread', state: msg.state, tasks: msg.tasks, progress: msg.progress });
        else if (msg.type === 'answers') finish({ kind: 'answers', answers: msg.answers });
        else finish({ kind: 'error', message: msg.message, userError: msg.userError, detail: msg.detail });
      };
      const onError = (err: Error) => {
        kill(w);
        finish({ kind: 'killed', reason: 'crash', message: "the solver thread crashed; the details are in the solve worker's log", detail: err.stack ?? err.message });
      };
      const onExit = (code: number) => {
        if (worker === w) worker = null;
        finish({ kind: 'killed', reason: 'crash', message: `the solver thread stopped unexpectedly (exit code ${code})` });
      };
      // The hard limit counts from the thread's "started" (a fresh thread first loads the engine,
      // which on a busy machine takes seconds); loading itself gets STARTUP_MS.
      const overdue = (ms: number, message: string) => setTimeout(() => {
        kill(w);
        finish({ kind: 'killed', reason: 'timeout', message });
      }, ms);
      let hard = overdue(STARTUP_MS, `the solver thread did not start within ${STARTUP_MS / 1000} s`);
      w.on('message', onMessage);
      w.on('error', onError);
      w.on('exit', onExit);
      w.postMessage({ ...task, cancelFlag: flagBuffer, optimumFlag: optimumBuffer } satisfies SolveTask);
      return {
        outcome,
        setKnownOptimum(value) {
          // Value first, then the flag that says it is there.
          optimum[1] = value;
          optimum[0] = 1;
        },
        cancel(graceMs) {
          if (settled || Atomics.load(flag, 0) === 1) return;
          Atomics.store(flag, 0, 1);
          cancelTimer = setTimeout(() => {
            kill(w);
            finish({ kind: 'killed', reason: 'cancel', message: 'cancelled; the solver was stopped before it returned an answer' });
          }, graceMs);
        },
      };
    },
    async close() {
      const w = worker;
      worker = null;
      if (w) await w.terminate();
    },
  };
}
