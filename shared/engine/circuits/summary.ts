import { circuitResources } from './resources';
import { routeCircuit } from './route';
import { LAYOUT_NAMES, type CircuitResources, type LayoutName, type LogicalCircuit, type PhysicalCircuit } from './types';

/** The `circuit` block of a run result and of `spinyard solve --json`. */
export interface CircuitSummary {
  qubits: number;
  layouts: Record<LayoutName, CircuitResources>;
}

/** The circuit routed onto every layout. */
export function routeAll(circuit: LogicalCircuit): Record<LayoutName, PhysicalCircuit> {
  return Object.fromEntries(LAYOUT_NAMES.map((l) => [l, routeCircuit(circuit, l)])) as Record<LayoutName, PhysicalCircuit>;
}

/** Qubits and, per layout, gate counts and depths (counting rules: docs/runs.md). */
export function circuitSummary(circuit: LogicalCircuit): CircuitSummary {
  const routed = routeAll(circuit);
  return {
    qubits: circuit.numQubits,
    layouts: Object.fromEntries(LAYOUT_NAMES.map((l) => [l, circuitResources(routed[l])])) as Record<LayoutName, CircuitResources>,
  };
}
