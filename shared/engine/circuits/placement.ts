import type { LogicalCircuit } from './types';

/**
 * Where each logical qubit starts (logical → physical) on a line or grid: when the circuit's
 * interaction graph is a set of paths, the paths are laid end to end along the layout's
 * numbering (every interaction is then between coupled qubits and needs no swap); otherwise
 * qubit q starts on physical qubit q.
 */
export function initialPlacement(circuit: LogicalCircuit): Int32Array {
  const n = circuit.numQubits;
  const identity = Int32Array.from({ length: n }, (_, q) => q);
  const neighbours: Set<number>[] = Array.from({ length: n }, () => new Set());
  for (const stage of circuit.stages) {
    if (stage.type !== 'diagonal') continue;
    for (const { a, b } of stage.interactions) { neighbours[a].add(b); neighbours[b].add(a); }
  }
  if (neighbours.some((s) => s.size > 2)) return identity;
  const placement = new Int32Array(n).fill(-1);
  let next = 0;
  // Walk each path from an end (degree ≤ 1); vertices left over lie on cycles.
  for (let start = 0; start < n; start++) {
    if (placement[start] >= 0 || neighbours[start].size > 1) continue;
    let prev = -1, cur = start;
    while (cur >= 0) {
      placement[cur] = next++;
      const step: number = [...neighbours[cur]].find((v) => v !== prev && placement[v] < 0) ?? -1;
      prev = cur;
      cur = step;
    }
  }
  return next === n ? placement : identity;
}
