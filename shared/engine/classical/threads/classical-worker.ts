/**
 * Worker-thread side of the classical solvers (node:worker_threads; never imported by pure
 * engine code). One message in, one message out: { ok: true, result } or { ok: false, error }.
 */
import { parentPort, workerData } from 'node:worker_threads';
import { runClassicalTask, type ClassicalTask } from './tasks';
import { solverRegistry } from '../../solvers/registry';

async function main(): Promise<void> {
  const task = workerData as ClassicalTask;
  try {
    // Classical solvers only: a worker thread never runs a circuit.
    const result = await runClassicalTask(task, (name) => (solverRegistry.names.includes(name) && solverRegistry.getSolver(name).family !== 'variational' ? solverRegistry.getSolver(name) : undefined));
    parentPort!.postMessage({ ok: true, result });
  } catch (err) {
    parentPort!.postMessage({ ok: false, error: err instanceof Error ? err.message : String(err) });
  }
}

void main();
