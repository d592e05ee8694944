/**
 * Worker-thread side of the classical solvers (node:worker_threads; never imported by pure
 * engine code). One message in, one message out: { ok: true, result } or { ok: false, error }.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runClassicalTask, type ClassicalTask } from './tasks';
import { classicalSolvers } from '../../solvers/classical';

async function main(): Promise<void> {
  const task = workerData as ClassicalTask;
  try {
    const result = await runClassicalTask(task, (name) => classicalSolvers.find((d) => d.name === name));
    parentPort!.postMessage({ ok: true, result });
  } catch (err) {
    parentPort!.postMessage({ ok: false, error: err instanceof Error ? err.message : String(err) });
  }
}

void main();
