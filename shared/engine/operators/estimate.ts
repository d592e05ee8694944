/**
 * Energy from shots, as a device would measure it. For each qubit-wise commuting group: rotate a
 * copy of the state into the group's basis (X: H, Y: S†H i.e. the gate H·S†), draw shots, and read
 * every term as ±1 = (−1)^{popcount(outcome & support)}.
 *
 * Error model (textbook, references.md "Shot noise"): within a group the per-shot value
 * G = Σ_{k∈g} c_k z_k is one sample, so its sample variance already holds the covariances of the
 * group's terms; groups are independent: Var(Ê) = Σ_g Var(G_g)/s_g. When every shot of a group
 * gave the same value (sample variance 0) a finite sample cannot prove zero variance, so we do not
 * report a zero error: the chance that a reading differs is taken as the add-half (binomial)
 * estimate q = ½/(s + 1), and the deviation as at most the range 2Σ|c_k| of G, giving
 * Var(G) ≈ (2Σ|c_k|)²·q(1 − q). Per term the same rule gives σ² = 4q(1 − q) when all its ±1
 * readings agree.
 */
import type { Rng } from '../random';
import type { StateVector } from '../statevector/state';
import { copyState } from '../statevector/state';
import { applyProductLayer, H_MATRIX } from '../statevector/gates';
import { sampleBasisStates } from '../statevector/sample';
import { groupQubitWise, type QubitWiseGroups } from './grouping';
import { parity } from './pauli';
import type { PauliSum } from './types';

export interface ShotEstimate {
  mean: number;
  stdError: number;
  /** Shots spent in total (Σ over groups). */
  shots: number;
  /** Per term of p.terms: mean of its ±1 readings and the standard error of that mean. */
  terms: { mean: number; stdError: number }[];
  /** Number of measurement groups used. */
  groups: number;
}

/** H·S†: takes the Y eigenbasis to the Z eigenbasis (row-major interleaved 2×2). */
const R = Math.SQRT1_2;
const Y_TO_Z = Float64Array.of(R, 0, 0, -R, R, 0, 0, R);
const IDENTITY = Float64Array.of(1, 0, 0, 0, 0, 0, 1, 0);

/** Copy of s rotated so that measuring Z on every qubit measures `basis` (letters per qubit). */
export function rotateToBasis(s: StateVector, basis: string): StateVector {
  const rotated = copyState(s);
  if (/^[IZ]*$/.test(basis)) return rotated;
  const mats = new Float64Array(8 * s.numQubits);
  for (let q = 0; q < s.numQubits; q++) mats.set(basis[q] === 'X' ? H_MATRIX : basis[q] === 'Y' ? Y_TO_Z : IDENTITY, 8 * q);
  applyProductLayer(rotated, mats);
  return rotated;
}

/** Support mask (non-I qubits) of a Pauli string. */
export function supportMask(letters: string): number {
  let m = 0;
  for (let q = 0; q < letters.length; q++) if (letters[q] !== 'I') m |= 1 << q;
  return m;
}

export function estimateByShots(
  s: StateVector,
  p: PauliSum,
  opts: { shotsPerGroup: number | number[]; rng: Rng; grouping?: QubitWiseGroups },
): ShotEstimate {
  if (p.numQubits !== s.numQubits) throw new RangeError(`operator has ${p.numQubits} qubits, state has ${s.numQubits}`);
  const grouping = opts.grouping ?? groupQubitWise(p);
  const G = grouping.groups.length;
  const shotsFor = (g: number): number => {
    const v = Array.isArray(opts.shotsPerGroup) ? opts.shotsPerGroup[g] : opts.shotsPerGroup;
    if (!Number.isInteger(v) || v < 2) throw new RangeError(`group ${g} needs an integer number of shots ≥ 2, got ${v}`);
    return v;
  };
  if (Array.isArray(opts.shotsPerGroup) && opts.shotsPerGroup.length !== G) {
    throw new RangeError(`shotsPerGroup lists ${opts.shotsPerGroup.length} groups, the operator has ${G}`);
  }
  const terms = p.terms.map(() => ({ mean: 0, stdError: 0 }));
  let mean = p.offset, variance = 0, shots = 0;
  for (let g = 0; g < G; g++) {
    const members = grouping.groups[g];
    const m = shotsFor(g);
    const counts = sampleBasisStates(rotateToBasis(s, grouping.basis[g]), m, opts.rng);
    const masks = members.map((k) => supportMask(p.terms[k].letters));
    const coeffs = members.map((k) => p.terms[k].coeff);
    const plus = new Float64Array(members.length); // shots reading +1, per member
    let sumG = 0, sumG2 = 0;
    for (const [x, c] of counts) {
      let value = 0;
      for (let j = 0; j < members.length; j++) {
        const z = parity(x & masks[j]) ? -1 : 1;
        if (z > 0) plus[j] += c;
        value += coeffs[j] * z;
      }
      sumG += c * value;
      sumG2 += c * value * value;
    }
    const meanG = sumG / m;
    let varG = Math.max(0, (sumG2 - m * meanG * meanG) / (m - 1));
    const q = 0.5 / (m + 1); // add-half chance of a reading unlike all seen so far
    let range = 0;
    for (let j = 0; j < members.length; j++) {
      const pPlus = plus[j] / m;
      let termVar = (4 * m * pPlus * (1 - pPlus)) / (m - 1); // sample variance of ±1 readings
      if (termVar === 0) termVar = 4 * q * (1 - q);
      terms[members[j]] = { mean: 2 * pPlus - 1, stdError: Math.sqrt(termVar / m) };
      range += 2 * Math.abs(coeffs[j]);
    }
    if (varG <= 1e-15 * Math.max(1, meanG * meanG)) varG = range * range * q * (1 - q);
    mean += meanG;
    variance += varG / m;
    shots += m;
  }
  return { mean, stdError: Math.sqrt(variance), shots, terms, groups: G };
}
