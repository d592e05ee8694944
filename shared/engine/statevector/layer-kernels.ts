/**
 * Inner loops of the fused layers (gates.ts). Each kernel updates, for every base in
 * bStart, bStart+bStep, … < bEnd and every x in base … base+run−1, either the amplitude pair
 * (x, x+h) with the gate of qubit q (h = 2^q), or the quadruple (x, x+h, x+2h, x+3h) with the
 * gates of qubits q and q+1 held in locals — one load and one store per amplitude for two
 * qubits, which halves the memory traffic that dominates these loops in JS.
 * amps: Float64Array // 2·2ⁿ interleaved re,im
 *
 * Also the two sweeps of a fused layer over a range of blocks or tiles (so the worker-thread
 * runner can split them). Everything here is self-contained — no imports, no module state — so
 * parallel-layers.ts can ship these functions' source text to its worker threads.
 */

// Plain top-level functions (not closures): V8 keeps one optimised copy and its type feedback
// across calls, where fresh closures per layer would start cold every time.

/** Every qubit gets [[c, −is], [−is, c]] (R_X(2β) with c = cos β, s = sin β); coef = [c, s]. */
export function pairRx(a: Float64Array, bStart: number, bEnd: number, bStep: number, h: number, run: number, coef: Float64Array): void {
      const c = coef[0], s = coef[1];
      const d = 2 * h;
      for (let base = bStart; base < bEnd; base += bStep) {
        const end = 2 * (base + run);
        for (let i0 = 2 * base; i0 < end; i0 += 2) {
          const i1 = i0 + d;
          const ar = a[i0], ai = a[i0 + 1], br = a[i1], bi = a[i1 + 1];
          a[i0] = c * ar + s * bi;
          a[i0 + 1] = c * ai - s * br;
          a[i1] = c * br + s * ai;
          a[i1 + 1] = c * bi - s * ar;
        }
      }
}

export function quadRx(a: Float64Array, bStart: number, bEnd: number, bStep: number, h: number, run: number, coef: Float64Array): void {
      const c = coef[0], s = coef[1];
      const cc = c * c, cs = c * s, ss = s * s;
      const d = 2 * h;
      for (let base = bStart; base < bEnd; base += bStep) {
        const end = 2 * (base + run);
        for (let i0 = 2 * base; i0 < end; i0 += 2) {
          const i1 = i0 + d, i2 = i1 + d, i3 = i2 + d;
          const ar = a[i0], ai = a[i0 + 1], br = a[i1], bi = a[i1 + 1];
          const er = a[i2], ei = a[i2 + 1], fr = a[i3], fi = a[i3 + 1];
          // R_X⊗R_X: out_x = c²·amp_x − ics·(two one-flip partners) − s²·(the two-flip partner).
          const be_r = br + er, be_i = bi + ei, af_r = ar + fr, af_i = ai + fi;
          a[i0] = cc * ar + cs * be_i - ss * fr;
          a[i0 + 1] = cc * ai - cs * be_r - ss * fi;
          a[i1] = cc * br + cs * af_i - ss * er;
          a[i1 + 1] = cc * bi - cs * af_r - ss * ei;
          a[i2] = cc * er + cs * af_i - ss * br;
          a[i2 + 1] = cc * ei - cs * af_r - ss * bi;
          a[i3] = cc * fr + cs * be_i - ss * ar;
          a[i3 + 1] = cc * fi - cs * be_r - ss * ai;
        }
      }
}

/** Qubit q gets the 2×2 complex gate mats[8q … 8q+7] (row-major interleaved). */
export function pairGeneral(a: Float64Array, bStart: number, bEnd: number, bStep: number, h: number, run: number, mats: Float64Array, q: number): void {
      const o = 8 * q, d = 2 * h;
      const m0r = mats[o], m0i = mats[o + 1], m1r = mats[o + 2], m1i = mats[o + 3];
      const m2r = mats[o + 4], m2i = mats[o + 5], m3r = mats[o + 6], m3i = mats[o + 7];
      for (let base = bStart; base < bEnd; base += bStep) {
        const end = 2 * (base + run);
        for (let i0 = 2 * base; i0 < end; i0 += 2) {
          const i1 = i0 + d;
          const ar = a[i0], ai = a[i0 + 1], br = a[i1], bi = a[i1 + 1];
          a[i0] = m0r * ar - m0i * ai + m1r * br - m1i * bi;
          a[i0 + 1] = m0r * ai + m0i * ar + m1r * bi + m1i * br;
          a[i1] = m2r * ar - m2i * ai + m3r * br - m3i * bi;
          a[i1 + 1] = m2r * ai + m2i * ar + m3r * bi + m3i * br;
        }
      }
}

export function quadGeneral(a: Float64Array, bStart: number, bEnd: number, bStep: number, h: number, run: number, mats: Float64Array, q: number): void {
      const o = 8 * q, p = o + 8, d = 2 * h;
      const u0r = mats[o], u0i = mats[o + 1], u1r = mats[o + 2], u1i = mats[o + 3];
      const u2r = mats[o + 4], u2i = mats[o + 5], u3r = mats[o + 6], u3i = mats[o + 7];
      const v0r = mats[p], v0i = mats[p + 1], v1r = mats[p + 2], v1i = mats[p + 3];
      const v2r = mats[p + 4], v2i = mats[p + 5], v3r = mats[p + 6], v3i = mats[p + 7];
      for (let base = bStart; base < bEnd; base += bStep) {
        const end = 2 * (base + run);
        for (let i0 = 2 * base; i0 < end; i0 += 2) {
          const i1 = i0 + d, i2 = i1 + d, i3 = i2 + d;
          const ar = a[i0], ai = a[i0 + 1], br = a[i1], bi = a[i1 + 1];
          const er = a[i2], ei = a[i2 + 1], fr = a[i3], fi = a[i3 + 1];
          // Qubit q on (a,b) and (e,f).
          const a1r = u0r * ar - u0i * ai + u1r * br - u1i * bi, a1i = u0r * ai + u0i * ar + u1r * bi + u1i * br;
          const b1r = u2r * ar - u2i * ai + u3r * br - u3i * bi, b1i = u2r * ai + u2i * ar + u3r * bi + u3i * br;
          const e1r = u0r * er - u0i * ei + u1r * fr - u1i * fi, e1i = u0r * ei + u0i * er + u1r * fi + u1i * fr;
          const f1r = u2r * er - u2i * ei + u3r * fr - u3i * fi, f1i = u2r * ei + u2i * er + u3r * fi + u3i * fr;
          // Qubit q+1 on (a,e) and (b,f).
          a[i0] = v0r * a1r - v0i * a1i + v1r * e1r - v1i * e1i;
          a[i0 + 1] = v0r * a1i + v0i * a1r + v1r * e1i + v1i * e1r;
          a[i2] = v2r * a1r - v2i * a1i + v3r * e1r - v3i * e1i;
          a[i2 + 1] = v2r * a1i + v2i * a1r + v3r * e1i + v3i * e1r;
          a[i1] = v0r * b1r - v0i * b1i + v1r * f1r - v1i * f1i;
          a[i1 + 1] = v0r * b1i + v0i * b1r + v1r * f1i + v1i * f1r;
          a[i3] = v2r * b1r - v2i * b1i + v3r * f1r - v3i * f1i;
          a[i3 + 1] = v2r * b1i + v2i * b1r + v3r * f1i + v3i * f1r;
        }
      }
}

/**
 * A cost diagonal compressed to its distinct values: diag[x] = levels[index[x]]. Max-cut and
 * partition diagonals with integer weights have few levels, so the phase needs one cos/sin per
 * level instead of per amplitude (the trig otherwise dominates a QAOA layer).
 */
export interface DiagonalLevels {
  levels: Float64Array;
  /** Length 2ⁿ. */
  index: Uint16Array | Uint32Array;
}

/** Phase amp_x *= exp(−iγ·diag[x]) on basis states start…end−1. */
export function phaseRange(a: Float64Array, diag: Float64Array | DiagonalLevels, gamma: number, start: number, end: number, table: Float64Array | null): void {
  if (table && !(diag instanceof Float64Array)) {
    const idx = diag.index;
    for (let x = start; x < end; x++) {
      const k = 2 * idx[x], c = table[k], s = table[k + 1], i = 2 * x;
      const re = a[i], im = a[i + 1];
      a[i] = c * re + s * im;
      a[i + 1] = c * im - s * re;
    }
    return;
  }
  const d = diag as Float64Array;
  for (let x = start; x < end; x++) {
    const t = gamma * d[x], c = Math.cos(t), s = Math.sin(t), i = 2 * x;
    const re = a[i], im = a[i + 1];
    a[i] = c * re + s * im;
    a[i + 1] = c * im - s * re;
  }
}


/**
 * Sweep 1 over blocks blockFrom…blockTo−1 of 2^low amplitudes: the phase (when diag is given;
 * table = interleaved cos/sin per level for DiagonalLevels), then qubits 0…low−1 in the block.
 * rx: coef = [cos β, sin β] for the mixer; otherwise coef holds 8 numbers per qubit.
 */
export function lowSweep(
  a: Float64Array, low: number, rx: boolean, coef: Float64Array,
  diag: Float64Array | DiagonalLevels | null, gamma: number, table: Float64Array | null,
  blockFrom: number, blockTo: number,
): void {
  const blockLen = 2 ** low;
  for (let b = blockFrom; b < blockTo; b++) {
    const start = b * blockLen, end = start + blockLen;
    if (diag) phaseRange(a, diag, gamma, start, end, table);
    let q = 0;
    for (; q + 1 < low; q += 2) {
      if (rx) quadRx(a, start, end, 4 << q, 1 << q, 1 << q, coef);
      else quadGeneral(a, start, end, 4 << q, 1 << q, 1 << q, coef, q);
    }
    if (q < low) {
      if (rx) pairRx(a, start, end, 2 << q, 1 << q, 1 << q, coef);
      else pairGeneral(a, start, end, 2 << q, 1 << q, 1 << q, coef, q);
    }
  }
}

/** Tiles in the sweep over high qubits lo…hi−1 (2^run contiguous amplitudes per row). */
export function tileCount(n: number, lo: number, hi: number, run: number): number {
  return 2 ** (n - hi) * 2 ** (lo - run);
}

/**
 * A sweep over high qubits lo…hi−1, tiles tileFrom…tileTo−1. Each tile (2^run contiguous
 * amplitudes from each of 2^(hi−lo) rows 2^lo apart) is copied into the contiguous scratch block
 * first: rows at a power-of-two stride all fall into the same cache sets, so working on them in
 * place thrashes L1/L2, while the copy is conflict-free and the state is still read and written
 * once. scratch: ≥ 2·2^(run + hi − lo) numbers.
 */
export function highSweep(
  a: Float64Array, n: number, lo: number, hi: number, run: number, rx: boolean, coef: Float64Array,
  scratch: Float64Array, tileFrom: number, tileTo: number,
): void {
  const runLen = 2 ** run, runDoubles = 2 * runLen;
  const rows = 2 ** (hi - lo), rowStride = 2 ** lo, tileSpan = 2 ** hi;
  const tileLen = rows * runLen;
  const midCount = 2 ** (lo - run);
  for (let tile = tileFrom; tile < tileTo; tile++) {
    const outer = Math.floor(tile / midCount), mid = tile - outer * midCount;
    const base = outer * tileSpan + mid * runLen;
    // TypedArray.set copies each row at memcpy speed (an element loop here is ~4× slower).
    for (let j = 0, src = 2 * base, dst = 0; j < rows; j++, src += 2 * rowStride, dst += runDoubles) {
      scratch.set(a.subarray(src, src + runDoubles), dst);
    }
    // In the scratch block qubit lo+t is bit run+t.
    let t = 0;
    for (; t + 1 < hi - lo; t += 2) {
      const h = runLen * 2 ** t;
      if (rx) quadRx(scratch, 0, tileLen, 4 * h, h, h, coef);
      else quadGeneral(scratch, 0, tileLen, 4 * h, h, h, coef, lo + t);
    }
    if (t < hi - lo) {
      const h = runLen * 2 ** t;
      if (rx) pairRx(scratch, 0, tileLen, 2 * h, h, h, coef);
      else pairGeneral(scratch, 0, tileLen, 2 * h, h, h, coef, lo + t);
    }
    for (let j = 0, dst = 2 * base, src = 0; j < rows; j++, dst += 2 * rowStride, src += runDoubles) {
      a.set(scratch.subarray(src, src + runDoubles), dst);
    }
  }
}
