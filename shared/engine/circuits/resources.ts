import type { CircuitResources, PhysicalCircuit } from './types';

/**
 * Gate counts and depths of a routed circuit. Depth is the length of the as-soon-as-possible
 * schedule where each gate takes one step after the last gate on any of its qubits (common
 * practice); two-qubit depth counts only two-qubit gates as steps. Read-out is not a gate.
 */
export function circuitResources(c: PhysicalCircuit): CircuitResources {
  const level = new Int32Array(c.numQubits);
  const level2 = new Int32Array(c.numQubits);
  let one = 0, two = 0, depth = 0, depth2 = 0;
  for (const g of c.gates) {
    if (g.qubits.length === 1) {
      one++;
      const q = g.qubits[0];
      depth = Math.max(depth, ++level[q]);
      continue;
    }
    two++;
    const [p, q] = g.qubits;
    const t = Math.max(level[p], level[q]) + 1;
    level[p] = level[q] = t;
    depth = Math.max(depth, t);
    const t2 = Math.max(level2[p], level2[q]) + 1;
    level2[p] = level2[q] = t2;
    depth2 = Math.max(depth2, t2);
  }
  return { oneQubitGates: one, twoQubitGates: two, twoQubitDepth: depth2, depth, swaps: c.swaps };
}
