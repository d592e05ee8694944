import type { IsingOperator } from '../operators/types';
import type { Gate, Interaction, LogicalCircuit, Stage } from './types';

export interface QaoaCircuitOptions {
  operator: IsingOperator;
  layers: number;
  /** Warm start: probability c_q that qubit q reads 1 and the regulariser ε (ansatz/qaoa.ts). */
  warmStart?: { probabilities: ArrayLike<number>; epsilon?: number };
}

/**
 * The gate-level form of the engine's QAOA circuit (ansatz/qaoa.ts), parameters
 * [γ_1 … γ_p, β_1 … β_p]:
 *   h on every qubit (warm start: ry(θ_q));
 *   per layer ℓ: e^{+iγ_ℓ H} = Π_q rz(−2h_q γ_ℓ) · Π_(i<j) e^{−i(−2J_ij γ_ℓ)/2 Z_i Z_j}
 *   (the offset only adds a global phase), then the mixer rx(2β_ℓ) on every qubit
 *   (warm start: ry(−θ_q), rz(2β_ℓ), ry(θ_q) in time order).
 * Repeated pairs in the operator are merged and zero coefficients dropped: both would only add
 * gates a compiler removes.
 */
export function qaoaCircuit(opts: QaoaCircuitOptions): LogicalCircuit {
  const { operator: op, layers: p } = opts;
  const n = op.numQubits;
  const pairs = mergedPairs(op);
  const paramNames = [...Array.from({ length: p }, (_, l) => `γ${l + 1}`), ...Array.from({ length: p }, (_, l) => `β${l + 1}`)];
  const theta = opts.warmStart ? warmAngles(n, opts.warmStart.probabilities, opts.warmStart.epsilon ?? 0.25) : null;
  const stages: Stage[] = [];
  const first: Gate[] = [];
  for (let q = 0; q < n; q++) first.push(theta ? { name: 'ry', qubits: [q], angle: { param: -1, scale: theta[q] } } : { name: 'h', qubits: [q] });
  stages.push({ type: 'gates', gates: first });
  for (let l = 0; l < p; l++) {
    const singles: Gate[] = [];
    for (let q = 0; q < n; q++) if (op.linear[q] !== 0) singles.push({ name: 'rz', qubits: [q], angle: { param: l, scale: -2 * op.linear[q] } });
    const interactions: Interaction[] = pairs.map(([a, b, J]) => ({ a, b, kind: 'zz' as const, angle: { param: l, scale: -2 * J } }));
    stages.push({ type: 'diagonal', singles, interactions });
    const mixer: Gate[] = [];
    for (let q = 0; q < n; q++) {
      if (!theta) { mixer.push({ name: 'rx', qubits: [q], angle: { param: p + l, scale: 2 } }); continue; }
      mixer.push(
        { name: 'ry', qubits: [q], angle: { param: -1, scale: -theta[q] } },
        { name: 'rz', qubits: [q], angle: { param: p + l, scale: 2 } },
        { name: 'ry', qubits: [q], angle: { param: -1, scale: theta[q] } },
      );
    }
    stages.push({ type: 'gates', gates: mixer });
  }
  return { name: theta ? 'qaoa_warm' : 'qaoa', numQubits: n, paramNames, stages };
}

/** θ_q = 2·arcsin√c_q with c_q clipped into [ε, 1 − ε] — the rule of ansatz/qaoa.ts. */
function warmAngles(n: number, probabilities: ArrayLike<number>, eps: number): Float64Array {
  const theta = new Float64Array(n);
  for (let q = 0; q < n; q++) theta[q] = 2 * Math.asin(Math.sqrt(Math.min(1 - eps, Math.max(eps, probabilities[q]))));
  return theta;
}

/** (a, b, J) with a < b, one entry per coupled pair, in first-appearance order. */
export function mergedPairs(op: IsingOperator): [number, number, number][] {
  const index = new Map<number, number>();
  const out: [number, number, number][] = [];
  for (let t = 0; t < op.quadCoeff.length; t++) {
    const a = Math.min(op.quadI[t], op.quadJ[t]), b = Math.max(op.quadI[t], op.quadJ[t]);
    const key = a * op.numQubits + b;
    const at = index.get(key);
    if (at === undefined) { index.set(key, out.length); out.push([a, b, op.quadCoeff[t]]); } else out[at][2] += op.quadCoeff[t];
  }
  return out.filter(([, , J]) => J !== 0);
}
