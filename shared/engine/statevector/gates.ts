/**
 * Gates applied in place to a StateVector (see state.ts for the layout).
 *
 * Single gates sweep the state once per gate. Layers (transverse mixer, rotation layers, the
 * QAOA layer) are fused and cache-blocked instead (Häner & Steiger, SC17, arXiv:1704.01127):
 *  - sweep 1 walks the state in contiguous blocks of 2^lowBits amplitudes (64 KiB) and applies
 *    the diagonal phase plus every rotation on qubits 0…lowBits−1 while the block is hot;
 *  - each further sweep takes g = tileBits − runBits high qubits: a tile of 2^g rows (2^lo apart)
 *    × 2^runBits contiguous amplitudes is copied into a contiguous scratch block (256 KiB, in L2),
 *    rotated there, and copied back.
 * Qubits are processed two at a time in registers (layer-kernels.ts). With the defaults a layer
 * is 1 + ⌈(n − 12)/6⌉ sweeps (2 up to n = 18, 3 up to 24, 4 at 26) instead of n + 1. In JS the
 * arithmetic (~0.5 ns per qubit·amplitude in cache) rather than memory is then the limit — see
 * docs/benchmarks.md "## Simulator" for measured ratios.
 *
 * Rotation convention: R_σ(θ) = exp(−iθσ/2); the mixer exp(−iβ Σ_j X_j) = ⊗_j R_X(2β).
 */
import type { StateVector } from './state';
import { highSweep, lowSweep, phaseRange, tileCount, type DiagonalLevels } from './layer-kernels';

/** 2×2 complex matrix, row-major interleaved: [re00,im00,re01,im01,re10,im10,re11,im11]. */
export type Gate2 = Float64Array;

/** Block and tile sizes (in qubits) of the fused layers; exported for the benchmark and tests. */
export interface LayerBlocking {
  lowBits: number;
  runBits: number;
  tileBits: number;
}
export const DEFAULT_BLOCKING: LayerBlocking = { lowBits: 12, runBits: 8, tileBits: 14 };

// ---------------------------------------------------------------- matrices

export function rxMatrix(theta: number): Gate2 {
  const c = Math.cos(theta / 2), s = Math.sin(theta / 2);
  return Float64Array.of(c, 0, 0, -s, 0, -s, c, 0);
}
export function ryMatrix(theta: number): Gate2 {
  const c = Math.cos(theta / 2), s = Math.sin(theta / 2);
  return Float64Array.of(c, 0, -s, 0, s, 0, c, 0);
}
export function rzMatrix(theta: number): Gate2 {
  const c = Math.cos(theta / 2), s = Math.sin(theta / 2);
  return Float64Array.of(c, -s, 0, 0, 0, 0, c, s);
}
const R = Math.SQRT1_2;
export const H_MATRIX: Gate2 = Float64Array.of(R, 0, R, 0, R, 0, -R, 0);

// ---------------------------------------------------------------- kernels

/** Apply gate m (8 numbers at m[mo…]) to `len` amplitude pairs starting at complex offsets x0, x1. */
function pairsGeneral(a: Float64Array, x0: number, x1: number, len: number, m: Float64Array, mo: number): void {
  const m0r = m[mo], m0i = m[mo + 1], m1r = m[mo + 2], m1i = m[mo + 3];
  const m2r = m[mo + 4], m2i = m[mo + 5], m3r = m[mo + 6], m3i = m[mo + 7];
  let i0 = 2 * x0, i1 = 2 * x1;
  const end = i0 + 2 * len;
  for (; i0 < end; i0 += 2, i1 += 2) {
    const ar = a[i0], ai = a[i0 + 1], br = a[i1], bi = a[i1 + 1];
    a[i0] = m0r * ar - m0i * ai + m1r * br - m1i * bi;
    a[i0 + 1] = m0r * ai + m0i * ar + m1r * bi + m1i * br;
    a[i1] = m2r * ar - m2i * ai + m3r * br - m3i * bi;
    a[i1 + 1] = m2r * ai + m2i * ar + m3r * bi + m3i * br;
  }
}

/** Gate on qubit q for basis states start…end−1 (start, end multiples of 2^(q+1)). */
function qubitInRange(a: Float64Array, q: number, start: number, end: number, m: Float64Array, mo: number): void {
  const half = 1 << q;
  for (let base = start; base < end; base += 2 * half) pairsGeneral(a, base, base + half, half, m, mo);
}

// ---------------------------------------------------------------- single gates

export function applySingleQubit(s: StateVector, q: number, m: Gate2): void {
  checkQubit(s, q);
  qubitInRange(s.amps, q, 0, s.amps.length >> 1, m, 0);
}
export const applyRx = (s: StateVector, q: number, theta: number): void => applySingleQubit(s, q, rxMatrix(theta));
export const applyRy = (s: StateVector, q: number, theta: number): void => applySingleQubit(s, q, ryMatrix(theta));
export const applyRz = (s: StateVector, q: number, theta: number): void => applySingleQubit(s, q, rzMatrix(theta));
export const applyH = (s: StateVector, q: number): void => applySingleQubit(s, q, H_MATRIX);
export function applyX(s: StateVector, q: number): void {
  checkQubit(s, q);
  const a = s.amps, half = 1 << q, dim = a.length >> 1;
  for (let base = 0; base < dim; base += 2 * half) {
    for (let x = base; x < base + half; x++) {
      const i0 = 2 * x, i1 = 2 * (x + half);
      const r = a[i0], im = a[i0 + 1];
      a[i0] = a[i1]; a[i0 + 1] = a[i1 + 1];
      a[i1] = r; a[i1 + 1] = im;
    }
  }
}

export function applyCz(s: StateVector, qa: number, qb: number): void {
  checkQubit(s, qa);
  checkQubit(s, qb);
  if (qa === qb) throw new RangeError(`CZ needs two different qubits, got ${qa} twice`);
  const a = s.amps, dim = a.length >> 1, mask = (1 << qa) | (1 << qb);
  // Next x with both bits set: increment the free bits only.
  for (let x = mask; x < dim; x = ((x + 1) & ~mask) | mask) {
    a[2 * x] = -a[2 * x];
    a[2 * x + 1] = -a[2 * x + 1];
  }
}

export function applyCnot(s: StateVector, control: number, target: number): void {
  checkQubit(s, control);
  checkQubit(s, target);
  if (control === target) throw new RangeError(`CNOT needs two different qubits, got ${control} twice`);
  const a = s.amps, dim = a.length >> 1, cm = 1 << control, tm = 1 << target;
  // Visit each x with control = 1, target = 0 once (x = next integer having bit c set, bit t clear).
  for (let x = cm; x < dim; x = (((x | tm) + 1) | cm) & ~tm) {
    const i0 = 2 * x, i1 = 2 * (x | tm);
    const r = a[i0], im = a[i0 + 1];
    a[i0] = a[i1]; a[i0 + 1] = a[i1 + 1];
    a[i1] = r; a[i1 + 1] = im;
  }
}

/** All CZ gates of an entangling layer in one diagonal pass; pairs = flat [a0,b0,a1,b1,…]. */
export function applyCzChain(s: StateVector, pairs: Int32Array): void {
  const masks = new Int32Array(pairs.length >> 1);
  for (let k = 0; k < masks.length; k++) {
    checkQubit(s, pairs[2 * k]);
    checkQubit(s, pairs[2 * k + 1]);
    if (pairs[2 * k] === pairs[2 * k + 1]) throw new RangeError(`CZ pair ${k} uses qubit ${pairs[2 * k]} twice`);
    masks[k] = (1 << pairs[2 * k]) | (1 << pairs[2 * k + 1]);
  }
  // sign(x) = (−1)^{#pairs fully set in x}; split into a low-bits table and a high-bits table
  // plus the pairs that straddle the split, so most of the work is two lookups per amplitude.
  const a = s.amps, dim = a.length >> 1, n = s.numQubits;
  const lowBits = Math.min(n, 12), lowMask = (1 << lowBits) - 1;
  const lowPairs: number[] = [], highPairs: number[] = [], mixedPairs: number[] = [];
  for (const m of masks) {
    if ((m & ~lowMask) === 0) lowPairs.push(m);
    else if ((m & lowMask) === 0) highPairs.push(m >>> lowBits);
    else mixedPairs.push(m);
  }
  const lowSign = parityTable(1 << lowBits, lowPairs);
  const highSign = parityTable(dim >>> lowBits, highPairs);
  for (let x = 0; x < dim; x++) {
    let odd = lowSign[x & lowMask] ^ highSign[x >>> lowBits];
    for (let k = 0; k < mixedPairs.length; k++) if ((x & mixedPairs[k]) === mixedPairs[k]) odd ^= 1;
    if (odd) {
      a[2 * x] = -a[2 * x];
      a[2 * x + 1] = -a[2 * x + 1];
    }
  }
}

function parityTable(size: number, masks: number[]): Uint8Array {
  const t = new Uint8Array(size);
  for (let x = 0; x < size; x++) {
    let odd = 0;
    for (const m of masks) if ((x & m) === m) odd ^= 1;
    t[x] = odd;
  }
  return t;
}

// ---------------------------------------------------------------- diagonal phase

export type { DiagonalLevels } from './layer-kernels';

/** Compress diag; null when it has more than maxLevels distinct values (default 65536). */
export function diagonalLevels(diag: Float64Array, maxLevels = 65536): DiagonalLevels | null {
  const seen = new Map<number, number>();
  const index = maxLevels <= 65536 ? new Uint16Array(diag.length) : new Uint32Array(diag.length);
  const values: number[] = [];
  for (let x = 0; x < diag.length; x++) {
    const v = diag[x];
    let k = seen.get(v);
    if (k === undefined) {
      if (values.length >= maxLevels) return null;
      k = values.length;
      seen.set(v, k);
      values.push(v);
    }
    index[x] = k;
  }
  return { levels: Float64Array.from(values), index };
}

export type Diagonal = Float64Array | DiagonalLevels;

/** Interleaved [cos γE_k, sin γE_k] per level (one cache line serves both lookups). */
export function phaseTables(diag: Diagonal, gamma: number): Float64Array | null {
  if (diag instanceof Float64Array) return null;
  const L = diag.levels;
  const t = new Float64Array(2 * L.length);
  for (let k = 0; k < L.length; k++) {
    t[2 * k] = Math.cos(gamma * L[k]);
    t[2 * k + 1] = Math.sin(gamma * L[k]);
  }
  return t;
}

export function checkDiagonal(s: StateVector, diag: Diagonal): void {
  const len = diag instanceof Float64Array ? diag.length : diag.index.length;
  if (len !== s.amps.length >> 1) {
    throw new RangeError(`diagonal has ${len} entries, the ${s.numQubits}-qubit state needs ${s.amps.length >> 1}`);
  }
}

/** amp_x *= exp(−iγ·diag[x]) in one pass (diag: 2ⁿ energies, or their DiagonalLevels). */
export function applyDiagonalPhase(s: StateVector, diag: Diagonal, gamma: number): void {
  checkDiagonal(s, diag);
  phaseRange(s.amps, diag, gamma, 0, s.amps.length >> 1, phaseTables(diag, gamma));
}

// ---------------------------------------------------------------- fused layers

/**
 * The fused, blocked product layer: optional diagonal phase, then one gate on every qubit
 * (kernels from layer-kernels.ts, two qubits per pass over a block or tile).
 */
function productLayer(
  s: StateVector,
  /** R_X mixer: coef = [cos β, sin β]; otherwise 8 numbers per qubit. */
  rx: boolean,
  coef: Float64Array,
  phase: { diag: Diagonal; gamma: number } | null,
  blocking: LayerBlocking,
): void {
  const a = s.amps, n = s.numQubits, dim = a.length >> 1;
  const low = Math.min(n, blocking.lowBits);
  const table = phase ? phaseTables(phase.diag, phase.gamma) : null;
  lowSweep(a, low, rx, coef, phase ? phase.diag : null, phase ? phase.gamma : 0, table, 0, dim >>> low);
  const run = Math.min(blocking.runBits, low);
  const g = Math.max(1, blocking.tileBits - run);
  // Scratch sized to the largest tile actually used (allocating more would cost a pass at small n).
  const scratch = low < n ? new Float64Array(2 * 2 ** run * 2 ** Math.min(g, n - low)) : null;
  for (let lo = low; lo < n && scratch; lo += g) {
    const hi = Math.min(n, lo + g);
    highSweep(a, n, lo, hi, run, rx, coef, scratch, 0, tileCount(n, lo, hi, run));
  }
}

/** exp(−iβ Σ_j X_j), fused and cache-blocked (1 + ⌈(n − 12)/6⌉ sweeps with the default blocking). */
export function applyTransverseMixer(s: StateVector, beta: number, blocking: LayerBlocking = DEFAULT_BLOCKING): void {
  productLayer(s, true, Float64Array.of(Math.cos(beta), Math.sin(beta)), null, blocking);
}

/**
 * One QAOA layer e^{−iβΣX} e^{−iγ·diag} with the phase fused into the mixer's first sweep:
 * the whole layer costs the same sweeps over memory as the mixer alone.
 */
export function applyQaoaLayer(
  s: StateVector,
  diag: Float64Array | DiagonalLevels,
  gamma: number,
  beta: number,
  blocking: LayerBlocking = DEFAULT_BLOCKING,
): void {
  checkDiagonal(s, diag);
  productLayer(s, true, Float64Array.of(Math.cos(beta), Math.sin(beta)), { diag, gamma }, blocking);
}

/** Any product of single-qubit gates ⊗_q mats[q] (mats: 8·n numbers, Gate2 per qubit), fused. */
export function applyProductLayer(s: StateVector, mats: Float64Array, blocking: LayerBlocking = DEFAULT_BLOCKING): void {
  if (mats.length !== 8 * s.numQubits) {
    throw new RangeError(`product layer needs 8 numbers per qubit (${8 * s.numQubits}), got ${mats.length}`);
  }
  productLayer(s, false, mats, null, blocking);
}

/** R_axis(angles[q]) on every qubit q, fused/blocked; R(θ) = exp(−iθσ/2). */
export function applyRotationLayer(
  s: StateVector,
  axis: 'x' | 'y' | 'z',
  angles: Float64Array,
  blocking: LayerBlocking = DEFAULT_BLOCKING,
): void {
  const n = s.numQubits;
  if (angles.length !== n) throw new RangeError(`rotation layer needs ${n} angles, got ${angles.length}`);
  if (axis === 'z') return rzLayer(s, angles);
  const mats = new Float64Array(8 * n);
  const make = axis === 'x' ? rxMatrix : ryMatrix;
  for (let q = 0; q < n; q++) mats.set(make(angles[q]), 8 * q);
  productLayer(s, false, mats, null, blocking);
}

/** ⊗ R_Z is diagonal: phase(x) = low-bits table × high-bits table, one pass. */
function rzLayer(s: StateVector, angles: Float64Array): void {
  const a = s.amps, n = s.numQubits, dim = a.length >> 1;
  const lowBits = n >> 1, lowMask = (1 << lowBits) - 1;
  const low = phaseProductTable(angles, 0, lowBits);
  const high = phaseProductTable(angles, lowBits, n);
  for (let x = 0; x < dim; x++) {
    const l = 2 * (x & lowMask), h = 2 * (x >>> lowBits);
    const pr = low[l] * high[h] - low[l + 1] * high[h + 1];
    const pi = low[l] * high[h + 1] + low[l + 1] * high[h];
    const i = 2 * x, re = a[i], im = a[i + 1];
    a[i] = pr * re - pi * im;
    a[i + 1] = pr * im + pi * re;
  }
}

/** Interleaved table over bits from…to−1 of ∏ e^{∓iθ_q/2} (− for bit 0, + for bit 1). */
function phaseProductTable(angles: Float64Array, from: number, to: number): Float64Array {
  const size = 1 << (to - from);
  const t = new Float64Array(2 * size);
  for (let y = 0; y < size; y++) {
    let phi = 0;
    for (let q = from; q < to; q++) phi += (((y >>> (q - from)) & 1) ? 0.5 : -0.5) * angles[q];
    t[2 * y] = Math.cos(phi);
    t[2 * y + 1] = Math.sin(phi);
  }
  return t;
}

function checkQubit(s: StateVector, q: number): void {
  if (!Number.isInteger(q) || q < 0 || q >= s.numQubits) {
    throw new RangeError(`qubit ${q} is outside 0…${s.numQubits - 1}`);
  }
}
