import type { Problem } from '../problem/types';
import { circuitOf, encodingOf, type CircuitSpec } from './of-run';
import { toQasm, type QasmVersion } from './qasm';
import { routeCircuit } from './route';
import type { LayoutName } from './types';

export interface RunQasmOptions {
  version: QasmVersion;
  layout: LayoutName;
  form: 'bound' | 'parameterised';
}

/** A finished variational run's circuit as OpenQASM, rebuilt from the problem and its spec. */
export function runQasm(problem: Problem, spec: CircuitSpec, params: ArrayLike<number>, opts: RunQasmOptions): string {
  const encoding = encodingOf(problem, spec);
  const logical = circuitOf(encoding, spec);
  if (params.length !== logical.paramNames.length) throw new RangeError(`the circuit has ${logical.paramNames.length} parameters, ${params.length} given`);
  const physical = routeCircuit(logical, opts.layout);
  const notes = [
    `Operator: ${spec.encoding === 'first-split' ? 'first split of a recursive k-way run' : `${encoding.method} encoding`}, ${encoding.numQubits} qubits; qubit q is the encoding's qubit q.`,
    'Decision support: a device run adds noise; see docs/runs.md.',
  ];
  return toQasm(physical, { version: opts.version, params, form: opts.form, notes });
}
