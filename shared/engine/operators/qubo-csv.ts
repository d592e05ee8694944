import { quboToIsing } from '../encodings/qubo';
import { MAX_OPERATOR_QUBITS, type OperatorIssue, type OperatorParse } from './format';
import { isingToPauliSum } from './pauli';

/**
 * A QUBO matrix as CSV: n rows of n numbers (comma or semicolon separated), the objective
 *   E(x) = Σ_i Σ_j Q_ij x_i x_j,   x_i ∈ {0, 1}
 * (upper-triangular or symmetric matrices both work: Q_ij and Q_ji add up; the diagonal is the
 * linear part since x_i² = x_i). Lines starting with "#" and blank lines are skipped. Variable i
 * becomes qubit i with bit 1 ⇔ x_i = 1 (the engine's convention: Z = +1 ⇔ bit 0).
 * Errors name the line and column and say what to do; nothing is thrown.
 */
export function parseQuboCsv(text: string): OperatorParse {
  const issues: OperatorIssue[] = [];
  const add = (line: number, msg: string) => issues.push({ line, message: `line ${line}: ${msg}` });
  const rows: { line: number; values: number[] }[] = [];
  text.split(/\r?\n/).forEach((raw, i) => {
    const body = raw.trim();
    if (body === '' || body.startsWith('#')) return;
    const cells = body.split(/[;,]/).map((c) => c.trim());
    const values: number[] = [];
    cells.forEach((c, col) => {
      const v = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(c) ? Number(c) : NaN;
      if (Number.isNaN(v)) add(i + 1, `column ${col + 1}: "${c}" is not a number; write plain numbers like 0, -2.5 or 1e-3 (no header row)`);
      values.push(v);
    });
    rows.push({ line: i + 1, values });
  });
  const n = rows.length;
  if (n === 0) return { ok: false, issues: [{ line: 1, message: 'line 1: no matrix rows; give n lines of n numbers each' }] };
  if (n > MAX_OPERATOR_QUBITS) return { ok: false, issues: [{ line: rows[MAX_OPERATOR_QUBITS].line, message: `line ${rows[MAX_OPERATOR_QUBITS].line}: more than ${MAX_OPERATOR_QUBITS} rows; at most ${MAX_OPERATOR_QUBITS} variables` }] };
  for (const r of rows) if (r.values.length !== n) add(r.line, `${r.values.length} values, expected ${n} (the matrix has ${n} rows, so each row needs ${n} numbers)`);
  if (issues.length > 0) return { ok: false, issues: issues.sort((a, b) => a.line! - b.line!) };
  const linear = new Float64Array(n);
  const pairs = new Map<number, number>();
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const q = rows[i].values[j];
      if (q === 0) continue;
      if (i === j) linear[i] += q;
      else pairs.set(Math.min(i, j) * n + Math.max(i, j), (pairs.get(Math.min(i, j) * n + Math.max(i, j)) ?? 0) + q);
    }
  }
  const keys = [...pairs.keys()];
  const ising = quboToIsing({
    numVars: n, offset: 0, linear,
    quadI: Int32Array.from(keys, (k) => Math.floor(k / n)), quadJ: Int32Array.from(keys, (k) => k % n), quadCoeff: Float64Array.from(keys, (k) => pairs.get(k)!),
  });
  return { ok: true, operator: isingToPauliSum(ising), issues: [] };
}
