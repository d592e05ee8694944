/**
 * A pure n-qubit state on one typed array.
 *
 * amps: Float64Array of length 2·2ⁿ, interleaved re,im; amplitude of basis state x sits at
 * [2x, 2x+1]; qubit q is bit q of x (qubit 0 = least significant), bit 0 ⇔ Z = +1.
 * The memory cost (16·2ⁿ bytes) is checked against a qubit limit BEFORE anything is allocated,
 * so an oversized request fails fast with a message instead of exhausting the machine.
 */
import type { LayerBackend } from './backend';

export interface StateVector {
  numQubits: number;
  /** 2·2ⁿ interleaved re,im. */
  amps: Float64Array;
}

export const DEFAULT_MAX_QUBITS = 26;

export interface StateOptions {
  /** Refuse states above this many qubits (default DEFAULT_MAX_QUBITS = 26, i.e. 1 GiB). */
  maxQubits?: number;
  /** Allocate on a SharedArrayBuffer (needed by the worker-thread runner, parallel-layers.ts). */
  shared?: boolean;
  /** Faster layer kernels (backend.ts); states are allocated through them when they can. */
  kernels?: LayerBackend;
}

/** Bytes a state of n qubits needs: 2ⁿ complex doubles. */
export const stateBytes = (numQubits: number): number => 16 * 2 ** numQubits;

const formatBytes = (bytes: number): string => {
  const units = ['B', 'KiB', 'MiB', 'GiB', 'TiB', 'PiB'];
  let v = bytes;
  let u = 0;
  while (v >= 1024 && u < units.length - 1) {
    v /= 1024;
    u++;
  }
  return `${v >= 100 ? v.toFixed(0) : v.toFixed(1)} ${units[u]}`;
};

export class QubitLimitError extends Error {
  readonly numQubits: number;
  readonly bytesNeeded: number;
  readonly maxQubits: number;
  constructor(numQubits: number, maxQubits: number) {
    const bytes = stateBytes(numQubits);
    super(
      `a ${numQubits}-qubit state needs ${formatBytes(bytes)} (16·2^${numQubits} bytes), above the ` +
        `limit of ${maxQubits} qubits (${formatBytes(stateBytes(maxQubits))}); use fewer depots per ` +
        `variational run (decompose the network or pick a classical solver), or raise maxQubits if ` +
        `the machine has the memory`,
    );
    this.name = 'QubitLimitError';
    this.numQubits = numQubits;
    this.bytesNeeded = bytes;
    this.maxQubits = maxQubits;
  }
}

/** Throws QubitLimitError (or RangeError for a non-integer count) before any allocation. */
export function checkQubitCount(numQubits: number, opts?: StateOptions): void {
  if (!Number.isInteger(numQubits) || numQubits < 0) {
    throw new RangeError(`qubit count must be a non-negative integer, got ${numQubits}`);
  }
  const limit = opts?.maxQubits ?? DEFAULT_MAX_QUBITS;
  // 2^30 complex doubles already exceed typed-array limits in V8; never go past that.
  if (numQubits > limit || numQubits > 30) throw new QubitLimitError(numQubits, Math.min(limit, 30));
}

function allocate(numQubits: number, opts?: StateOptions): Float64Array {
  checkQubitCount(numQubits, opts);
  try {
    const length = 2 * 2 ** numQubits;
    const own = opts?.kernels?.allocate(numQubits);
    if (own) return own;
    return opts?.shared ? new Float64Array(new SharedArrayBuffer(8 * length)) : new Float64Array(length);
  } catch {
    // The engine cannot see free memory (no process/os reads); report the failure in the same words.
    throw new QubitLimitError(numQubits, numQubits - 1);
  }
}

/** |0…0⟩. */
export function createZeroState(numQubits: number, opts?: StateOptions): StateVector {
  const amps = allocate(numQubits, opts);
  amps[0] = 1;
  return { numQubits, amps };
}

/** |+⟩ⁿ: every amplitude 2^(−n/2). */
export function createPlusState(numQubits: number, opts?: StateOptions): StateVector {
  const amps = allocate(numQubits, opts);
  const a = 1 / Math.sqrt(2 ** numQubits);
  for (let i = 0; i < amps.length; i += 2) amps[i] = a;
  return { numQubits, amps };
}

/** A state from given interleaved amplitudes (copied), e.g. a Ritz vector or test fixture. */
export function stateFromAmplitudes(numQubits: number, amps: ArrayLike<number>, opts?: StateOptions): StateVector {
  const out = allocate(numQubits, opts);
  if (amps.length !== out.length) {
    throw new RangeError(`expected ${out.length} numbers (2·2^${numQubits} interleaved re,im), got ${amps.length}`);
  }
  for (let i = 0; i < out.length; i++) out[i] = amps[i];
  return { numQubits, amps: out };
}

export function copyState(s: StateVector): StateVector {
  return { numQubits: s.numQubits, amps: s.amps.slice() };
}

/** |amp_x|², length 2ⁿ. */
export function probabilities(s: StateVector): Float64Array {
  const a = s.amps;
  const p = new Float64Array(a.length >> 1);
  for (let x = 0, i = 0; x < p.length; x++, i += 2) p[x] = a[i] * a[i] + a[i + 1] * a[i + 1];
  return p;
}

/** ⟨ψ|ψ⟩ (1 up to round-off for every unitary evolution). */
export function normSquared(s: StateVector): number {
  const a = s.amps;
  let t = 0;
  for (let i = 0; i < a.length; i++) t += a[i] * a[i];
  return t;
}

/** ⟨a|b⟩ as [re, im]. */
export function innerProduct(a: StateVector, b: StateVector): [number, number] {
  const x = a.amps;
  const y = b.amps;
  let re = 0;
  let im = 0;
  for (let i = 0; i < x.length; i += 2) {
    re += x[i] * y[i] + x[i + 1] * y[i + 1];
    im += x[i] * y[i + 1] - x[i + 1] * y[i];
  }
  return [re, im];
}
