import type { IsingOperator } from '../operators/types';

/**
 * Imposing spin relations on an Ising operator: the reduction step of recursive QAOA.
 *
 * A relation either ties a spin to another (s_q = sign·s_partner) or fixes it (s_q = sign,
 * partner −1). Substituting it keeps H(s) equal on every state that satisfies the relations,
 * so the reduced operator's minimum is the original's minimum under them. Relations passed in
 * one call must not chain (no partner is itself eliminated in the same call).
 */
export interface SpinRelation {
  /** Qubit index in the operator being reduced. */
  qubit: number;
  /** The qubit it follows, or −1 when its value is fixed. */
  partner: number;
  sign: 1 | -1;
}

export interface Reduced {
  op: IsingOperator;
  /** Old qubit index → new index, −1 for eliminated qubits. */
  newIndex: Int32Array;
}

export function eliminateSpins(op: IsingOperator, relations: readonly SpinRelation[]): Reduced {
  const n = op.numQubits;
  const target = new Int32Array(n), sign = new Int8Array(n).fill(1);
  for (let q = 0; q < n; q++) target[q] = q;
  const gone = new Uint8Array(n);
  for (const r of relations) { target[r.qubit] = r.partner; sign[r.qubit] = r.sign; gone[r.qubit] = 1; }
  for (const r of relations) if (r.partner >= 0 && gone[r.partner]) throw new Error(`relations chain through qubit ${r.partner}; impose them in separate calls`);
  const newIndex = new Int32Array(n).fill(-1);
  let m = 0;
  for (let q = 0; q < n; q++) if (!gone[q]) newIndex[q] = m++;
  let offset = op.offset;
  const linear = new Float64Array(m);
  for (let q = 0; q < n; q++) {
    const h = op.linear[q];
    if (h === 0) continue;
    if (target[q] < 0) offset += h * sign[q];
    else linear[newIndex[target[q]]] += h * sign[q];
  }
  // Terms between untouched qubits keep their place; only moved terms can collide with others.
  const pairs = new Map<number, number>();
  const key = (a: number, b: number) => (a < b ? a * m + b : b * m + a);
  const T = op.quadCoeff.length;
  for (let t = 0; t < T; t++) {
    const i = op.quadI[t], j = op.quadJ[t], c = op.quadCoeff[t] * sign[i] * sign[j];
    const ti = target[i], tj = target[j];
    if (ti < 0 && tj < 0) offset += c;
    else if (ti < 0) linear[newIndex[tj]] += c;
    else if (tj < 0) linear[newIndex[ti]] += c;
    else if (ti === tj) offset += c;
    else {
      const k = key(newIndex[ti], newIndex[tj]);
      pairs.set(k, (pairs.get(k) ?? 0) + c);
    }
  }
  const keys = [...pairs.keys()].filter((k) => pairs.get(k) !== 0);
  const quadI = new Int32Array(keys.length), quadJ = new Int32Array(keys.length), quadCoeff = new Float64Array(keys.length);
  keys.forEach((k, t) => { quadI[t] = Math.floor(k / m); quadJ[t] = k % m; quadCoeff[t] = pairs.get(k)!; });
  return { op: { numQubits: m, offset, linear, quadI, quadJ, quadCoeff }, newIndex };
}
