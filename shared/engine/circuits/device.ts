import type { CircuitResources, Gate } from './types';

/** One assumed device figure, with where it came from (shown beside it in the app and docs). */
export interface DeviceFigure {
  value: number;
  unit: 's' | 'probability';
  label: string;
  source: string;
}

export interface DeviceAssumptions {
  oneQubitGateSeconds: number;
  twoQubitGateSeconds: number;
  readoutSeconds: number;
  /** Reset and control latency between shots. */
  shotOverheadSeconds: number;
  /** Depolarizing parameter per gate: the gate's qubits are replaced by the maximally mixed state. */
  oneQubitError: number;
  twoQubitError: number;
  /** Probability that a read-out bit comes out flipped. */
  readoutError: number;
}

const SYCAMORE = 'Arute et al., "Quantum supremacy using a programmable superconducting processor", Nature 574, 505 (2019) — value from memory';

/**
 * Defaults: a published superconducting device. Published Pauli error rates e are turned into
 * depolarizing parameters ε = e·4ᵏ/(4ᵏ − 1) for k-qubit gates (a depolarizing channel with
 * parameter ε applies a non-identity Pauli with probability ε(4ᵏ − 1)/4ᵏ; common practice).
 * Every figure is an ASSUMPTION an analyst may replace with their device's calibration data.
 */
export const DEVICE_DEFAULTS: Record<keyof DeviceAssumptions, DeviceFigure> = {
  oneQubitGateSeconds: { value: 25e-9, unit: 's', label: 'one-qubit gate duration', source: SYCAMORE },
  twoQubitGateSeconds: { value: 12e-9, unit: 's', label: 'two-qubit gate duration', source: SYCAMORE },
  readoutSeconds: { value: 1e-6, unit: 's', label: 'read-out duration', source: 'order of a microsecond for superconducting read-out — assumption, value from memory' },
  shotOverheadSeconds: { value: 100e-6, unit: 's', label: 'reset and latency per shot', source: 'assumption (typical order for superconducting devices, value from memory; no single published source)' },
  oneQubitError: { value: (0.0016 * 4) / 3, unit: 'probability', label: 'one-qubit depolarizing error', source: `Pauli error 0.16 % (simultaneous), ${SYCAMORE}` },
  twoQubitError: { value: (0.0062 * 16) / 15, unit: 'probability', label: 'two-qubit depolarizing error', source: `Pauli error 0.62 % (simultaneous), ${SYCAMORE}` },
  readoutError: { value: 0.038, unit: 'probability', label: 'read-out error', source: `3.8 % (simultaneous), ${SYCAMORE}` },
};

/**
 * Shots per estimate assumed for device time when a run used exact expectations (shots = 0): the
 * shot rule S = ⌈(Σ|c|/ε)²⌉ at the inspector's default precision ε = 1 % of Σ|c|.
 */
export const EXACT_RUN_SHOTS = 10_000;

export function defaultAssumptions(): DeviceAssumptions {
  return Object.fromEntries(Object.entries(DEVICE_DEFAULTS).map(([k, f]) => [k, f.value])) as unknown as DeviceAssumptions;
}

/**
 * Duration of a circuit: the longest path of its as-soon-as-possible schedule with one-qubit
 * gates taking t₁ and two-qubit gates t₂ (read-out not included).
 */
export function circuitSeconds(numQubits: number, gates: Gate[], a: Pick<DeviceAssumptions, 'oneQubitGateSeconds' | 'twoQubitGateSeconds'>): number {
  const free = new Float64Array(numQubits);
  let end = 0;
  for (const g of gates) {
    if (g.qubits.length === 1) { end = Math.max(end, (free[g.qubits[0]] += a.oneQubitGateSeconds)); continue; }
    const [p, q] = g.qubits;
    const t = Math.max(free[p], free[q]) + a.twoQubitGateSeconds;
    free[p] = free[q] = t;
    end = Math.max(end, t);
  }
  return end;
}

export interface DeviceTime {
  /** One shot: circuit + read-out + reset. */
  shotSeconds: number;
  /** One energy estimate: measurement settings × shots per setting × shot time. */
  estimateSeconds: number;
  /** The whole optimisation: estimates × estimate time + final read-out shots. */
  runSeconds: number;
}

/**
 * Time on a device (docs/runs.md, "Time on a device"): measurement settings (qubit-wise commuting
 * groups) × shots × (circuit time + read-out + reset), per estimate and for the run's estimates.
 */
export function deviceTime(circuitTime: number, opts: { settings: number; shotsPerSetting: number; estimates: number; readoutShots: number }, a: DeviceAssumptions): DeviceTime {
  const shotSeconds = circuitTime + a.readoutSeconds + a.shotOverheadSeconds;
  const estimateSeconds = opts.settings * opts.shotsPerSetting * shotSeconds;
  return { shotSeconds, estimateSeconds, runSeconds: opts.estimates * estimateSeconds + opts.readoutShots * shotSeconds };
}

/** Probability that no gate of the circuit suffers a depolarizing error: ∏(1 − ε) over gates. */
export function circuitFidelity(r: Pick<CircuitResources, 'oneQubitGates' | 'twoQubitGates'>, a: Pick<DeviceAssumptions, 'oneQubitError' | 'twoQubitError'>): number {
  return (1 - a.oneQubitError) ** r.oneQubitGates * (1 - a.twoQubitError) ** r.twoQubitGates;
}
