/**
 * Weighted sums of Pauli strings (types.ts): simplification, conversion from the Ising cost
 * operator, and their action on interleaved complex vectors.
 *
 * A string P acts on a basis state as P|x⟩ = i^{#Y} (−1)^{popcount(x & zyMask)} |x ⊕ flipMask⟩
 * (X flips, Z signs, Y = iXZ does both; X|b⟩ = |1−b⟩, Y|b⟩ = i(−1)^b|1−b⟩, Z|b⟩ = (−1)^b|b⟩).
 * Terms sharing a flip mask are applied together; the flip-free (diagonal) part is tabulated once.
 */
import type { IsingOperator, PauliSum, PauliTerm } from './types';
import type { StateVector } from '../statevector/state';

/** Bit masks of one Pauli string (bit q = qubit q). */
export interface PauliMasks {
  /** Qubits carrying X or Y (flipped). */
  flip: number;
  /** Qubits carrying Z or Y (signed by the bit value). */
  zy: number;
  /** Number of Y letters (the string's phase is i^{#Y}). */
  yCount: number;
}

const VALID = /^[IXYZ]*$/;

export function checkLetters(letters: string, numQubits: number): void {
  if (letters.length !== numQubits || !VALID.test(letters)) {
    throw new RangeError(`Pauli string "${letters}" must have exactly ${numQubits} letters from I, X, Y, Z`);
  }
}

export function pauliMasks(letters: string): PauliMasks {
  let flip = 0, zy = 0, yCount = 0;
  for (let q = 0; q < letters.length; q++) {
    const l = letters.charCodeAt(q);
    if (l === 88 /* X */) flip |= 1 << q;
    else if (l === 89 /* Y */) { flip |= 1 << q; zy |= 1 << q; yCount++; }
    else if (l === 90 /* Z */) zy |= 1 << q;
  }
  return { flip, zy, yCount };
}

/** Parity (0/1) of the set bits of a 31-bit non-negative integer. */
export function parity(v: number): number {
  v ^= v >>> 16;
  v ^= v >>> 8;
  v ^= v >>> 4;
  v ^= v >>> 2;
  v ^= v >>> 1;
  return v & 1;
}

/** Z_i and Z_iZ_j strings of the cost operator, same energies. */
export function isingToPauliSum(op: IsingOperator): PauliSum {
  const n = op.numQubits;
  const terms: PauliTerm[] = [];
  const base = 'I'.repeat(n);
  const put = (qs: number[]): string => {
    const chars = base.split('');
    for (const q of qs) chars[q] = 'Z';
    return chars.join('');
  };
  for (let i = 0; i < n; i++) if (op.linear[i] !== 0) terms.push({ letters: put([i]), coeff: op.linear[i] });
  for (let t = 0; t < op.quadCoeff.length; t++) {
    if (op.quadCoeff[t] !== 0) terms.push({ letters: put([op.quadI[t], op.quadJ[t]]), coeff: op.quadCoeff[t] });
  }
  return simplifyPauliSum({ numQubits: n, offset: op.offset, terms });
}

/** Merge equal strings (first-appearance order), move identities into the offset, drop |c| < tol. */
export function simplifyPauliSum(p: PauliSum, tol = 1e-12): PauliSum {
  const identity = 'I'.repeat(p.numQubits);
  const sums = new Map<string, number>();
  let offset = p.offset;
  for (const t of p.terms) {
    checkLetters(t.letters, p.numQubits);
    if (!Number.isFinite(t.coeff)) throw new RangeError(`coefficient of "${t.letters}" is ${t.coeff}; need a finite real number`);
    if (t.letters === identity) offset += t.coeff;
    else sums.set(t.letters, (sums.get(t.letters) ?? 0) + t.coeff);
  }
  const terms: PauliTerm[] = [];
  for (const [letters, coeff] of sums) if (Math.abs(coeff) >= tol) terms.push({ letters, coeff });
  return { numQubits: p.numQubits, offset, terms };
}

/**
 * A PauliSum ready to apply: the diagonal part as a table (2ⁿ reals, offset included) and the
 * off-diagonal terms grouped by flip mask, each with its phase i^{#Y}·coeff split into re/im.
 */
export interface CompiledPauliSum {
  numQubits: number;
  /** Length 2ⁿ: offset + Σ_{diagonal terms} c·(−1)^{popcount(x & zy)}. */
  diagonal: Float64Array;
  flipGroups: { flip: number; zy: Int32Array; re: Float64Array; im: Float64Array }[];
  /** True when every coefficient of the matrix is real (every string has an even number of Y). */
  real: boolean;
}

export function compilePauliSum(p: PauliSum): CompiledPauliSum {
  const n = p.numQubits;
  if (n > 30) throw new RangeError(`${n} qubits is beyond what a statevector can hold`);
  const dim = 2 ** n;
  const diagonal = new Float64Array(dim).fill(p.offset);
  const byFlip = new Map<number, { zy: number[]; re: number[]; im: number[] }>();
  let real = true;
  for (const t of p.terms) {
    checkLetters(t.letters, n);
    const m = pauliMasks(t.letters);
    if (m.flip === 0) {
      for (let x = 0; x < dim; x++) diagonal[x] += parity(x & m.zy) ? -t.coeff : t.coeff;
      continue;
    }
    // i^{#Y}: 1, i, −1, −i.
    const k = m.yCount & 3;
    const re = k === 0 ? t.coeff : k === 2 ? -t.coeff : 0;
    const im = k === 1 ? t.coeff : k === 3 ? -t.coeff : 0;
    if (im !== 0) real = false;
    let g = byFlip.get(m.flip);
    if (!g) byFlip.set(m.flip, (g = { zy: [], re: [], im: [] }));
    g.zy.push(m.zy);
    g.re.push(re);
    g.im.push(im);
  }
  const flipGroups = [...byFlip].map(([flip, g]) => ({ flip, zy: Int32Array.from(g.zy), re: Float64Array.from(g.re), im: Float64Array.from(g.im) }));
  return { numQubits: n, diagonal, flipGroups, real };
}

/**
 * output = H·input (both 2·2ⁿ interleaved re,im; output is overwritten, must not alias input).
 * Accepts a PauliSum (compiled on the fly) or a CompiledPauliSum to reuse across many calls.
 */
export function applyPauliSum(p: PauliSum | CompiledPauliSum, input: Float64Array, output: Float64Array): void {
  const c = 'diagonal' in p ? p : compilePauliSum(p);
  const dim = c.diagonal.length;
  if (input.length !== 2 * dim || output.length !== 2 * dim) {
    throw new RangeError(`vectors must have 2·2^${c.numQubits} = ${2 * dim} numbers`);
  }
  if (input === output) throw new RangeError('applyPauliSum needs separate input and output arrays');
  const d = c.diagonal;
  for (let x = 0; x < dim; x++) {
    output[2 * x] = d[x] * input[2 * x];
    output[2 * x + 1] = d[x] * input[2 * x + 1];
  }
  for (const g of c.flipGroups) {
    const { flip, zy, re, im } = g;
    const T = zy.length;
    for (let x = 0; x < dim; x++) {
      let pr = 0, pi = 0;
      for (let t = 0; t < T; t++) {
        if (parity(x & zy[t])) { pr -= re[t]; pi -= im[t]; }
        else { pr += re[t]; pi += im[t]; }
      }
      const ar = input[2 * x], ai = input[2 * x + 1], y = 2 * (x ^ flip);
      output[y] += pr * ar - pi * ai;
      output[y + 1] += pr * ai + pi * ar;
    }
  }
}

/** ⟨ψ|H|ψ⟩ without building H·ψ (the imaginary part vanishes for Hermitian H). */
export function exactExpectation(s: StateVector, p: PauliSum | CompiledPauliSum): number {
  const c = 'diagonal' in p ? p : compilePauliSum(p);
  const a = s.amps, d = c.diagonal, dim = d.length;
  if (a.length !== 2 * dim) throw new RangeError(`operator has ${c.numQubits} qubits, state has ${s.numQubits}`);
  let e = 0;
  for (let x = 0; x < dim; x++) e += d[x] * (a[2 * x] * a[2 * x] + a[2 * x + 1] * a[2 * x + 1]);
  for (const g of c.flipGroups) {
    const { flip, zy, re, im } = g;
    const T = zy.length;
    for (let x = 0; x < dim; x++) {
      let pr = 0, pi = 0;
      for (let t = 0; t < T; t++) {
        if (parity(x & zy[t])) { pr -= re[t]; pi -= im[t]; }
        else { pr += re[t]; pi += im[t]; }
      }
      // Re[ conj(ψ_{x⊕f}) · phase · ψ_x ]
      const ar = a[2 * x], ai = a[2 * x + 1], y = 2 * (x ^ flip), br = a[y], bi = a[y + 1];
      const vr = pr * ar - pi * ai, vi = pr * ai + pi * ar;
      e += br * vr + bi * vi;
    }
  }
  return e;
}

/**
 * output = H·input for a real operator (c.real) on real vectors of length 2ⁿ — half the memory
 * and arithmetic of the complex form (Lanczos on real symmetric spin models).
 */
export function applyCompiledReal(c: CompiledPauliSum, input: Float64Array, output: Float64Array): void {
  if (!c.real) throw new RangeError('applyCompiledReal needs a real operator (an even number of Y in every string)');
  const d = c.diagonal, dim = d.length;
  if (input.length !== dim || output.length !== dim) throw new RangeError(`vectors must have 2^${c.numQubits} = ${dim} numbers`);
  for (let x = 0; x < dim; x++) output[x] = d[x] * input[x];
  for (const g of c.flipGroups) {
    const { flip, zy, re } = g;
    const T = zy.length;
    if (T === 1 && zy[0] === 0) {
      // A bare X-type string: no signs at all.
      const c0 = re[0];
      for (let x = 0; x < dim; x++) output[x ^ flip] += c0 * input[x];
      continue;
    }
    for (let x = 0; x < dim; x++) {
      let pr = 0;
      for (let t = 0; t < T; t++) pr += parity(x & zy[t]) ? -re[t] : re[t];
      output[x ^ flip] += pr * input[x];
    }
  }
}
