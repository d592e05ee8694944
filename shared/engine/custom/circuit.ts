import { ladderCircuit } from '../circuits/ladder';
import { qaoaCircuit } from '../circuits/qaoa';
import type { LogicalCircuit } from '../circuits/types';
import type { IsingOperator, PauliSum } from '../operators/types';

/** The Z-only part of a custom operator as an Ising operator, or why it is not one (≥ 3 Z factors). */
export function diagonalPartAsIsing(p: PauliSum): { ok: true; operator: IsingOperator } | { ok: false; reason: string } {
  const n = p.numQubits;
  const linear = new Float64Array(n);
  const qi: number[] = [], qj: number[] = [], qc: number[] = [];
  for (const t of p.terms) {
    if (/[XY]/.test(t.letters)) continue;
    const zs: number[] = [];
    for (let q = 0; q < n; q++) if (t.letters[q] === 'Z') zs.push(q);
    if (zs.length === 1) linear[zs[0]] += t.coeff;
    else if (zs.length === 2) { qi.push(zs[0]); qj.push(zs[1]); qc.push(t.coeff); }
    else if (zs.length > 2) return { ok: false, reason: `a term with ${zs.length} Z factors needs a multi-qubit phase gadget; gate counts cover one- and two-body Z terms only` };
  }
  return { ok: true, operator: { numQubits: n, offset: p.offset, linear, quadI: Int32Array.from(qi), quadJ: Int32Array.from(qj), quadCoeff: Float64Array.from(qc) } };
}

/** The gate-level circuit of an operator run (the same circuits as network runs), or why none. */
export function operatorCircuit(p: PauliSum, ansatz: 'ladder' | 'alternating', layers: number, entangler: 'line' | 'ring'): { circuit: LogicalCircuit } | { reason: string } {
  if (ansatz === 'ladder') return { circuit: ladderCircuit({ numQubits: p.numQubits, layers, entangler }) };
  const d = diagonalPartAsIsing(p);
  return d.ok ? { circuit: qaoaCircuit({ operator: d.operator, layers }) } : { reason: d.reason };
}
