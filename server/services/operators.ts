import * as path from 'node:path';
import { Worker } from 'node:worker_threads';
import { inspectOperator } from '../../shared/engine/custom/inspect';
import { readCustomOperator } from '../../shared/engine/custom/parse';
import type { OperatorSolveOptions, OperatorSolveResult } from '../../shared/engine/custom/solve';
import type { PauliSum } from '../../shared/engine/operators/types';
import { SettingsError } from '../../shared/engine/classical/settings';
import { getSolver } from '../../shared/engine/solvers/registry';
import { OPERATOR_API_MAX_QUBITS, type OperatorInspectBody, type OperatorSolveBody } from '../../shared/schemas/operators';
import { badRequest, unavailable } from '../lib/http-error';

/** Parse or answer 400 with every problem under `text` (each message names its line). */
function parsed(body: { text: string; kind?: 'operator' | 'qubo-csv' }): PauliSum {
  const r = readCustomOperator(body.text, body.kind);
  if (!r.ok) throw badRequest(`The operator has ${r.issues.length} problem(s); the first: ${r.issues[0].message}`, { text: r.issues.map((i) => i.message) });
  return r.operator;
}

export function inspectCustomOperator(body: OperatorInspectBody) {
  return inspectOperator(parsed(body), body.precision);
}

const ENTRY = path.join(__dirname, '..', 'workers', 'operator-thread.cjs');

/**
 * A VQE or QAOA run on a custom operator, in a thread of its own (terminated if it overruns its
 * time limit by 30 s), next to the exact ground energy. Settings are the solvers' own.
 */
export async function solveCustomOperator(body: OperatorSolveBody): Promise<OperatorSolveResult> {
  const operator = parsed(body);
  if (operator.numQubits > OPERATOR_API_MAX_QUBITS) {
    throw badRequest(`${operator.numQubits} qubits is above the ${OPERATOR_API_MAX_QUBITS} a run from the app takes; use the command line (spinyard solve --operator) for larger operators.`, { text: ['too many qubits'] });
  }
  let s: Record<string, unknown>;
  try {
    s = getSolver(body.solver).parseSettings(body.settings ?? {}) as Record<string, unknown>;
  } catch (e) {
    if (!(e instanceof SettingsError)) throw e;
    throw badRequest(`Some ${body.solver} settings are not valid: ${e.message}`, Object.fromEntries(Object.entries(e.fields).map(([k, v]) => [`settings.${k}`, [v]])));
  }
  const options: OperatorSolveOptions = {
    solver: body.solver, ansatz: (s.ansatz as OperatorSolveOptions['ansatz'] | undefined) ?? 'alternating', layers: s.layers as number,
    entangler: (s.entangler as OperatorSolveOptions['entangler'] | undefined) ?? 'ring', optimizer: s.optimizer as OperatorSolveOptions['optimizer'],
    shots: s.shots as number, restarts: s.restarts as number, maxIterations: s.maxIterations as number, seed: body.seed, timeLimitSeconds: body.timeLimitSeconds,
  };
  const worker = new Worker(ENTRY, { workerData: { operator, options } });
  try {
    return await new Promise<OperatorSolveResult>((resolve, reject) => {
      const hard = setTimeout(() => reject(unavailable('The operator run overran its time limit and was stopped; lower maxIterations or the layers.')), (body.timeLimitSeconds + 30) * 1000);
      worker.once('message', (m: { ok: true; result: OperatorSolveResult } | { ok: false; message: string; refusal: boolean }) => {
        clearTimeout(hard);
        if (m.ok) resolve(m.result);
        else reject(m.refusal ? badRequest(m.message, { solver: [m.message] }) : new Error(m.message));
      });
      worker.once('error', (e) => { clearTimeout(hard); reject(e); });
    });
  } finally {
    void worker.terminate();
  }
}
