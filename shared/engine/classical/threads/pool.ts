/**
 * Main-thread side: run a classical task in a fresh worker thread (node:worker_threads).
 * Loaded lazily by the solvers (dynamic import) so pure engine code never imports it.
 * Cancel: the cancel flag is polled and the worker terminated; so is an overdue worker.
 */
import { Worker } from 'node:worker_threads';
import * as path from 'node:path';
import type { CancelToken } from '../../solvers/types';
import type { ClassicalTask, ClassicalTaskResult } from './task-types';

export interface WorkerRunOptions {
  cancel?: CancelToken;
  /** Hard stop: the worker is terminated after this many seconds (null answer). */
  killAfterSeconds?: number;
}

/** Resolves to the task's answer, or null when cancelled or killed. Rejects on worker errors. */
export function runInWorker<T extends ClassicalTask>(task: T, opts: WorkerRunOptions = {}): Promise<ClassicalTaskResult<T> | null> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(path.join(__dirname, 'classical-worker.cjs'), { workerData: task });
    let settled = false;
    const finish = (fn: () => void): void => {
      if (settled) return;
      settled = true;
      clearInterval(poll);
      if (killer) clearTimeout(killer);
      fn();
    };
    const poll = setInterval(() => {
      if (opts.cancel?.cancelled) finish(() => { void worker.terminate(); resolve(null); });
    }, 25);
    const killer = opts.killAfterSeconds !== undefined
      ? setTimeout(() => finish(() => { void worker.terminate(); resolve(null); }), opts.killAfterSeconds * 1000)
      : null;
    worker.once('message', (msg: { ok: boolean; result?: unknown; error?: string }) => {
      finish(() => {
        void worker.terminate();
        if (msg.ok) resolve(msg.result as ClassicalTaskResult<T>);
        else reject(new Error(msg.error));
      });
    });
    worker.once('error', (err) => finish(() => reject(err)));
    worker.once('exit', (code) => finish(() => reject(new Error(`classical worker stopped early (exit code ${code})`))));
  });
}
