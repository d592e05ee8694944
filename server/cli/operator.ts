/**
 * `spinyard solve --operator FILE` and `spinyard inspect --operator FILE`: a custom operator
 * (our "spinyard-operator 1" text or JSON, or a QUBO matrix as CSV) run with VQE or QAOA next to
 * its exact ground energy (docs/runs.md, "Operators of your own"). Settings are the vqe/qaoa
 * solvers' own (their parseSettings is the one rule for names, ranges and defaults).
 */
import { writeFileSync } from 'node:fs';
import { readText, UserError } from './load';
/** Where output goes (the CLI's io, structurally). */
interface CliIo { out: (text: string) => void; err: (text: string) => void }

type Num = (x: number | null) => string;
const num: Num = (x) => (x === null ? '—' : Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(10))));

function readOperatorFile(file: string) {
  const { readCustomOperator } = require('../../shared/engine/custom/parse') as typeof import('../../shared/engine/custom/parse');
  const parsed = readCustomOperator(readText(file), /\.csv$/i.test(file) ? 'qubo-csv' : undefined);
  if (!parsed.ok) throw new UserError(`${file}: the operator has ${parsed.issues.length} problem(s)`, parsed.issues.map((i) => `${file} ${i.message}`));
  return parsed.operator;
}

export function operatorInspect(file: string, precision: number | undefined, json: boolean, io: CliIo): number {
  const { inspectOperator } = require('../../shared/engine/custom/inspect') as typeof import('../../shared/engine/custom/inspect');
  const r = { file, ...inspectOperator(readOperatorFile(file), precision) };
  if (json) { io.out(JSON.stringify(r)); return 0; }
  const lines = [
    `custom operator ${file}`,
    `  qubits             ${r.qubits}`,
    `  Pauli terms        ${r.terms} + offset ${num(r.offset)}${r.diagonal ? ' (Z terms only: diagonal, QAOA applies)' : ''}`,
    `  commuting groups   ${r.groups.length} (qubit-wise, one measurement setting each)`,
    `  shots              ${r.shots.uniformTotal} uniform (${r.shots.uniformPerGroup} per group), ${r.shots.weightedTotal} weighted, for standard error ${num(r.precision)} (Σ|c| = ${num(r.coefficientNorm)})`,
    ...r.largest.slice(0, 12).map((t) => `  ${t.coeff >= 0 ? '+' : '−'}${num(Math.abs(t.coeff)).padStart(12)}  ${t.factors}`),
  ];
  io.out(lines.join('\n'));
  return 0;
}

export interface OperatorSolveFlags {
  file: string;
  solver: string;
  settings: Record<string, unknown>;
  seed: number;
  timeLimitSeconds: number;
  json: boolean;
  qasm: { file: string; version: 2 | 3; layout: 'all' | 'line' | 'grid'; form: 'bound' | 'parameterised' } | null;
}

export function operatorSolve(f: OperatorSolveFlags, io: CliIo): number {
  if (f.solver !== 'vqe' && f.solver !== 'qaoa') throw new UserError(`--operator runs vqe or qaoa, not ${f.solver}`);
  const p = readOperatorFile(f.file);
  const { getSolver } = require('../../shared/engine/solvers/registry') as typeof import('../../shared/engine/solvers/registry');
  const s = getSolver(f.solver).parseSettings(f.settings) as Record<string, unknown>;
  const { solveOperator, OperatorRefusal } = require('../../shared/engine/custom/solve') as typeof import('../../shared/engine/custom/solve');
  let r;
  try {
    r = solveOperator(p, {
      solver: f.solver, ansatz: (s.ansatz as 'ladder' | 'alternating' | undefined) ?? 'alternating', layers: s.layers as number,
      entangler: (s.entangler as 'line' | 'ring' | undefined) ?? 'ring', optimizer: s.optimizer as never, shots: s.shots as number,
      restarts: s.restarts as number, maxIterations: s.maxIterations as number, seed: f.seed, timeLimitSeconds: f.timeLimitSeconds,
    });
  } catch (e) {
    if (e instanceof OperatorRefusal) throw new UserError(e.message);
    throw e;
  }
  if (f.qasm) {
    const { operatorCircuit } = require('../../shared/engine/custom/circuit') as typeof import('../../shared/engine/custom/circuit');
    const { routeCircuit } = require('../../shared/engine/circuits/route') as typeof import('../../shared/engine/circuits/route');
    const { toQasm } = require('../../shared/engine/circuits/qasm') as typeof import('../../shared/engine/circuits/qasm');
    const built = operatorCircuit(p, r.ansatz, s.layers as number, (s.entangler as 'line' | 'ring' | undefined) ?? 'ring');
    if ('reason' in built) io.err(`spinyard: warning: --qasm: ${built.reason}; no file written`);
    else writeFileSync(f.qasm.file, toQasm(routeCircuit(built.circuit, f.qasm.layout), { version: f.qasm.version, params: r.params, form: f.qasm.form, notes: [`Custom operator ${f.file}, ${r.qubits} qubits.`] }));
  }
  const { trace: _trace, ...report } = { file: f.file, ...r };
  if (f.json) { io.out(JSON.stringify(report)); return 0; }
  const lines = [
    `custom operator ${f.file}: ${r.qubits} qubits, ${r.terms} terms; solver ${r.solver} (${r.ansatz} ansatz)`,
    `  energy     ${num(r.energy)} (exact ⟨H⟩ at the optimised parameters)`,
    `  exact      ${r.exact ? `${num(r.exact.energy)} (${r.exact.method})` : '— (too many qubits to diagonalise)'}`,
    `  gap        ${r.gap === null ? '—' : `${num(r.gap)}${r.relativeGap !== null ? ` (${(100 * r.relativeGap).toFixed(3)} % of |exact|)` : ''}`}`,
  ];
  if (r.circuit) for (const [layout, c] of Object.entries(r.circuit.layouts)) lines.push(`  ${(layout === 'all' ? 'all-to-all' : layout).padEnd(10)} ${c.oneQubitGates} one-qubit + ${c.twoQubitGates} two-qubit gates, two-qubit depth ${c.twoQubitDepth}, depth ${c.depth}${c.swaps ? `, ${c.swaps} swaps` : ''}`);
  else if (r.circuitNote) lines.push(`  circuit    ${r.circuitNote}`);
  lines.push(`  time       ${r.seconds.toFixed(2)} s   evaluations ${r.evaluations}   shots ${r.shots}   seed ${f.seed}${r.stopped ? '   (stopped at the time limit)' : ''}`);
  io.out(lines.join('\n'));
  return 0;
}
