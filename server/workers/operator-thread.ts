import { parentPort, workerData } from 'node:worker_threads';
import { solveOperator, type OperatorSolveOptions } from '../../shared/engine/custom/solve';
import type { PauliSum } from '../../shared/engine/operators/types';

/** Runs one custom-operator solve (already parsed and checked by the API) and posts the answer. */
const { operator, options } = workerData as { operator: PauliSum; options: OperatorSolveOptions };
try {
  parentPort!.postMessage({ ok: true, result: solveOperator(operator, options) });
} catch (e) {
  parentPort!.postMessage({ ok: false, message: e instanceof Error ? e.message : String(e), refusal: e instanceof Error && e.name === 'OperatorRefusal' });
}
