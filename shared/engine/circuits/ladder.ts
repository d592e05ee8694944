import type { Gate, Interaction, LogicalCircuit, Stage } from './types';

export interface LadderCircuitOptions {
  numQubits: number;
  layers: number;
  entangler?: 'line' | 'ring';
  /** Start from this basis state (x on qubits whose bit is set). */
  initialBits?: ArrayLike<number>;
}

/**
 * The gate-level form of the ladder ansatz (ansatz/ladder.ts): per rung ry(θ) and rz(φ) on every
 * qubit then cz on neighbouring pairs (line, or ring closing (n−1, 0) when n > 2), and one final
 * rotation layer. Parameter order as the ansatz: rung by rung, θ_0 … θ_(n−1), φ_0 … φ_(n−1).
 */
export function ladderCircuit(opts: LadderCircuitOptions): LogicalCircuit {
  const { numQubits: n, layers } = opts;
  const ring = (opts.entangler ?? 'ring') === 'ring' && n > 2;
  const pairs: Interaction[] = [];
  for (let q = 0; q + 1 < n; q++) pairs.push({ a: q, b: q + 1, kind: 'cz' });
  if (ring) pairs.push({ a: 0, b: n - 1, kind: 'cz' });
  const paramNames: string[] = [];
  const stages: Stage[] = [];
  if (opts.initialBits) {
    const xs: Gate[] = [];
    for (let q = 0; q < n; q++) if (opts.initialBits[q]) xs.push({ name: 'x', qubits: [q] });
    if (xs.length > 0) stages.push({ type: 'gates', gates: xs });
  }
  for (let l = 0; l <= layers; l++) {
    const base = 2 * n * l;
    const gates: Gate[] = [];
    for (let q = 0; q < n; q++) gates.push({ name: 'ry', qubits: [q], angle: { param: base + q, scale: 1 } });
    for (let q = 0; q < n; q++) gates.push({ name: 'rz', qubits: [q], angle: { param: base + n + q, scale: 1 } });
    for (let q = 0; q < n; q++) paramNames.push(`θ${l}.${q}`);
    for (let q = 0; q < n; q++) paramNames.push(`φ${l}.${q}`);
    stages.push({ type: 'gates', gates });
    if (l < layers && pairs.length > 0) stages.push({ type: 'diagonal', singles: [], interactions: pairs.map((p) => ({ ...p })) });
  }
  return { name: 'ladder', numQubits: n, paramNames, stages };
}
