import type { Encoding } from '../encodings/types';
import type { IsingOperator } from '../operators/types';
import type { Rng } from '../random';
import { expectationOfDiagonal, isingDiagonal } from '../statevector/diagonal';
import { sampleBasisIndices } from '../statevector/sample';
import { createZeroState, type StateVector } from '../statevector/state';
import { bestSample, type DecodedSample } from '../variational/samples';
import { circuitFidelity, type DeviceAssumptions } from './device';
import { circuitResources } from './resources';
import { applyGate, applyPauli } from './simulate';
import type { PhysicalCircuit } from './types';

/** Largest circuit the trajectory simulation takes (a 20-qubit state is 16 MiB). */
export const TRAJECTORY_MAX_QUBITS = 20;

/** The operator split into its parts: ⟨H⟩ = offset + L + Q with L the Z terms, Q the ZZ terms. */
function parts(op: IsingOperator): { linear: IsingOperator; quadratic: IsingOperator } {
  const none = { quadI: new Int32Array(0), quadJ: new Int32Array(0), quadCoeff: new Float64Array(0) };
  return {
    linear: { numQubits: op.numQubits, offset: 0, linear: op.linear, ...none },
    quadratic: { numQubits: op.numQubits, offset: 0, linear: new Float64Array(op.numQubits), quadI: op.quadI, quadJ: op.quadJ, quadCoeff: op.quadCoeff },
  };
}

/**
 * ⟨H⟩ under read-out flips with probability ε_ro, from a state in LOGICAL qubit order:
 * a flipped bit turns Z into −Z, so ⟨Z_i⟩ shrinks by (1 − 2ε_ro) and ⟨Z_iZ_j⟩ by (1 − 2ε_ro)².
 */
export function readoutExpectation(s: StateVector, op: IsingOperator, readoutError: number): number {
  const { linear, quadratic } = parts(op);
  const f = 1 - 2 * readoutError;
  return op.offset + f * expectationOfDiagonal(s, isingDiagonal(linear)) + f * f * expectationOfDiagonal(s, isingDiagonal(quadratic));
}

export interface DepolarizingEstimate {
  model: 'depolarizing';
  /** ∏(1 − ε) over the routed circuit's gates. */
  fidelity: number;
  energy: number;
}

/**
 * Quick estimate: the state is the ideal one with probability F = ∏(1 − ε) and maximally mixed
 * otherwise (global depolarizing); the mixed state has ⟨Z_i⟩ = ⟨Z_iZ_j⟩ = 0, so
 *   ⟨H⟩ ≈ offset + F·[(1 − 2ε_ro)·L + (1 − 2ε_ro)²·Q]   (L, Q: the ideal state's Z and ZZ parts).
 * `ideal` is the noiseless state in logical qubit order.
 */
export function depolarizingEstimate(c: PhysicalCircuit, op: IsingOperator, ideal: StateVector, a: DeviceAssumptions): DepolarizingEstimate {
  const fidelity = circuitFidelity(circuitResources(c), a);
  const { linear, quadratic } = parts(op);
  const f = 1 - 2 * a.readoutError;
  const energy = op.offset + fidelity * (f * expectationOfDiagonal(ideal, isingDiagonal(linear)) + f * f * expectationOfDiagonal(ideal, isingDiagonal(quadratic)));
  return { model: 'depolarizing', fidelity, energy };
}

/** The physical state permuted back into logical qubit order (routing moves qubits). */
export function toLogicalOrder(s: StateVector, finalPlacement: Int32Array): StateVector {
  const n = s.numQubits;
  if (finalPlacement.every((p, j) => p === j)) return s;
  const out = createZeroState(n);
  out.amps[0] = 0;
  for (let y = 0; y < 1 << n; y++) {
    let x = 0;
    for (let j = 0; j < n; j++) if ((y >> finalPlacement[j]) & 1) x |= 1 << j;
    out.amps[2 * x] = s.amps[2 * y];
    out.amps[2 * x + 1] = s.amps[2 * y + 1];
  }
  return out;
}

export interface TrajectoryOptions {
  trajectories: number;
  /** Read-out shots per trajectory (for the sampled best answer under noise). */
  shotsPerTrajectory: number;
  rng: Rng;
  /**
   * 'local' (default): after each gate, with probability ε, a uniformly random Pauli of the 4ᵏ on
   * the gate's k qubits (identity included) — the k-qubit depolarizing channel with parameter ε.
   * 'global': the same on ALL qubits — the global depolarizing channel (tests compare it with
   * the estimate, which it then equals in expectation).
   */
  model?: 'local' | 'global';
  /** Checked between trajectories (after the second): stop early, keeping what was simulated. */
  shouldStop?: () => boolean;
}

export interface TrajectoryResult {
  model: 'trajectories';
  trajectories: number;
  /** Mean ⟨H⟩ over trajectories (read-out flips averaged exactly) and its standard error. */
  energy: number;
  stdError: number;
  /** The same for a second operator when given (the business value), else null. */
  value: { mean: number; stdError: number } | null;
  /** Best decoded read-out sample over all trajectories, read-out flips applied; null without an encoding. */
  best: DecodedSample | null;
  shots: number;
}

/**
 * Noisy simulation by Pauli-error trajectories on the statevector (≤ 20 qubits): each trajectory
 * runs the routed circuit with random Pauli errors (see TrajectoryOptions.model); its ⟨H⟩ with
 * read-out flips is exact for that state, and shots are sampled with each bit flipped with
 * probability ε_ro. The mean over trajectories is an unbiased estimate of the noisy ⟨H⟩.
 */
export function trajectoryNoise(c: PhysicalCircuit, params: ArrayLike<number>, op: IsingOperator, a: DeviceAssumptions, opts: TrajectoryOptions, encoding?: Encoding, valueOperator?: IsingOperator): TrajectoryResult {
  const n = c.numQubits;
  if (n > TRAJECTORY_MAX_QUBITS) throw new RangeError(`trajectory noise simulation takes at most ${TRAJECTORY_MAX_QUBITS} qubits (this circuit has ${n}); use the depolarizing estimate`);
  const global = opts.model === 'global';
  const energies: number[] = [];
  const values: number[] = [];
  const decoded = new Map<number, DecodedSample>();
  let shots = 0;
  for (let t = 0; t < opts.trajectories; t++) {
    if (t >= 2 && opts.shouldStop?.()) break;
    const s = createZeroState(n);
    for (const g of c.gates) {
      applyGate(s, g, params);
      const eps = g.qubits.length === 1 ? a.oneQubitError : a.twoQubitError;
      if (eps <= 0 || opts.rng.next() >= eps) continue;
      const on = global ? Array.from({ length: n }, (_, q) => q) : g.qubits;
      for (const q of on) applyPauli(s, q, Math.floor(opts.rng.next() * 4));
    }
    const logical = toLogicalOrder(s, c.finalPlacement);
    energies.push(readoutExpectation(logical, op, a.readoutError));
    if (valueOperator) values.push(readoutExpectation(logical, valueOperator, a.readoutError));
    if (!encoding || opts.shotsPerTrajectory <= 0) continue;
    for (const x of sampleBasisIndices(logical, opts.shotsPerTrajectory, opts.rng)) {
      let y = x;
      for (let q = 0; q < n; q++) if (opts.rng.next() < a.readoutError) y ^= 1 << q;
      shots++;
      const seen = decoded.get(y);
      if (seen) { seen.count++; continue; }
      const assignment = Array.from(encoding.decode(y));
      decoded.set(y, { state: y, assignment, count: 1, value: encoding.valueOf(assignment), feasible: encoding.feasible(assignment) });
    }
  }
  const energy = meanAndError(energies);
  return {
    model: 'trajectories',
    trajectories: energies.length,
    energy: energy.mean,
    stdError: energy.stdError,
    value: valueOperator ? meanAndError(values) : null,
    best: encoding && decoded.size > 0 ? bestSample(encoding.kind, [...decoded.values()]) : null,
    shots,
  };
}

function meanAndError(xs: number[]): { mean: number; stdError: number } {
  const mean = xs.reduce((x, y) => x + y, 0) / xs.length;
  const variance = xs.length > 1 ? xs.reduce((x, y) => x + (y - mean) ** 2, 0) / (xs.length - 1) : 0;
  return { mean, stdError: Math.sqrt(variance / xs.length) };
}
