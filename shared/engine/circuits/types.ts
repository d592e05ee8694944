/**
 * Circuits as gate lists, for counting resources and exporting OpenQASM (the statevector
 * simulates the same circuits with fused kernels; tests check that the two agree).
 *
 * Gate set (common practice, the OpenQASM standard library names): one-qubit h, x, rx, ry, rz;
 * two-qubit cx (control, target) and cz. Angles follow OpenQASM: rz(θ) = e^{−iθZ/2} etc.
 * Qubit q of a gate is a PHYSICAL qubit (a position of the layout); `placement` maps logical
 * qubits (the operator's qubits) to physical ones before and after the circuit.
 */

/** An angle `scale · params[param]`, or the constant `scale` when param = −1. */
export interface Angle {
  param: number;
  scale: number;
}

export type OneQubitName = 'h' | 'x' | 'rx' | 'ry' | 'rz';
export type TwoQubitName = 'cx' | 'cz';

export type Gate =
  | { name: OneQubitName; qubits: [number]; angle?: Angle }
  | { name: TwoQubitName; qubits: [number, number] };

/**
 * A commuting two-qubit diagonal interaction between LOGICAL qubits a < b:
 * 'zz' is e^{−i(angle/2) Z_a Z_b} (= cx·rz(angle)·cx), 'cz' the controlled-Z.
 */
export interface Interaction {
  a: number;
  b: number;
  kind: 'zz' | 'cz';
  angle?: Angle;
}

/**
 * A circuit before routing, as stages on logical qubits:
 * - 'gates': one-qubit gates, applied as they stand;
 * - 'diagonal': one-qubit rz gates and interactions that all commute, so a router may apply
 *   the interactions in any order (this is what lets swap networks serve them).
 */
export type Stage =
  | { type: 'gates'; gates: Gate[] }
  | { type: 'diagonal'; singles: Gate[]; interactions: Interaction[] };

export interface LogicalCircuit {
  /** What the circuit is ('qaoa', 'qaoa-warm', 'ladder'); names the QASM gate. */
  name: string;
  numQubits: number;
  paramNames: string[];
  stages: Stage[];
}

export type LayoutName = 'all' | 'line' | 'grid';
export const LAYOUT_NAMES: readonly LayoutName[] = ['all', 'line', 'grid'];

/** A circuit on physical qubits, ready to count or export. */
export interface PhysicalCircuit {
  name: string;
  layout: LayoutName;
  numQubits: number;
  paramNames: string[];
  gates: Gate[];
  /** Logical qubit → physical qubit at the start and at the end (routing moves them). */
  initialPlacement: Int32Array;
  finalPlacement: Int32Array;
  /** Swaps the router inserted (merged with an interaction or alone). */
  swaps: number;
}

/** Resources of one physical circuit (counting rules: docs/runs.md, "Circuit resources"). */
export interface CircuitResources {
  oneQubitGates: number;
  twoQubitGates: number;
  /** Time steps when only two-qubit gates take a step (one-qubit gates are free). */
  twoQubitDepth: number;
  /** Time steps when every gate takes one step (as-soon-as-possible schedule). */
  depth: number;
  swaps: number;
}

export const angleValue = (a: Angle, params: ArrayLike<number>): number => (a.param < 0 ? a.scale : a.scale * params[a.param]);
export const isTwoQubit = (g: Gate): g is Extract<Gate, { name: TwoQubitName }> => g.qubits.length === 2;
