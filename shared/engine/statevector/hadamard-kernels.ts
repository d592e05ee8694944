/**
 * Inner loops of the transverse mixer in the Hadamard basis (hadamard-mixer.ts):
 *   exp(−iβ Σ_j X_j) = H^{⊗n} · exp(−iβ Σ_j Z_j) · H^{⊗n}     (H Z H = X, common practice)
 * and Σ_j Z_j is diagonal with value n − 2·w(y) on basis state y (w = Hamming weight; bit 0 ⇔
 * Z = +1, see state.ts), so the middle factor multiplies amplitude y by e^{−iβ(n−2w(y))}.
 * H^{⊗n} is done as an unnormalised fast Walsh–Hadamard transform (butterflies (u+v, u−v) only);
 * the two transforms' factor 2^{−n} is folded into the weight phase table.
 *
 * H is real, so the real and imaginary parts transform independently: the butterflies work on
 * the interleaved doubles directly, partner distance 2·2^q doubles for qubit q.
 * amps: Float64Array // 2·2ⁿ interleaved re,im
 *
 * Self-contained (no imports, no module state) so parallel-layers.ts can ship the source text
 * of these functions to its worker threads, like layer-kernels.ts.
 */

/**
 * Walsh–Hadamard butterflies on `bits` consecutive qubits whose lowest has partner distance d
 * (in doubles), for the doubles start…end−1 (end − start a multiple of d·2^bits). Three qubits
 * at a time in registers (8 loads, 24 adds, 8 stores), then two or one: the loads and stores,
 * not the adds, are what scalar JS pays for.
 */
export function whtRange(a: Float64Array, start: number, end: number, d: number, bits: number): void {
  let t = 0;
  for (; t + 2 < bits; t += 3) {
    const h = d << t, span = 8 * h;
    for (let base = start; base < end; base += span) {
      const stop = base + h;
      for (let i = base; i < stop; i++) {
        const x0 = a[i], x1 = a[i + h], x2 = a[i + 2 * h], x3 = a[i + 3 * h];
        const x4 = a[i + 4 * h], x5 = a[i + 5 * h], x6 = a[i + 6 * h], x7 = a[i + 7 * h];
        const s01 = x0 + x1, d01 = x0 - x1, s23 = x2 + x3, d23 = x2 - x3;
        const s45 = x4 + x5, d45 = x4 - x5, s67 = x6 + x7, d67 = x6 - x7;
        const p0 = s01 + s23, p1 = d01 + d23, p2 = s01 - s23, p3 = d01 - d23;
        const q0 = s45 + s67, q1 = d45 + d67, q2 = s45 - s67, q3 = d45 - d67;
        a[i] = p0 + q0; a[i + h] = p1 + q1; a[i + 2 * h] = p2 + q2; a[i + 3 * h] = p3 + q3;
        a[i + 4 * h] = p0 - q0; a[i + 5 * h] = p1 - q1; a[i + 6 * h] = p2 - q2; a[i + 7 * h] = p3 - q3;
      }
    }
  }
  if (t + 1 < bits) {
    const h = d << t, span = 4 * h;
    for (let base = start; base < end; base += span) {
      const stop = base + h;
      for (let i = base; i < stop; i++) {
        const x0 = a[i], x1 = a[i + h], x2 = a[i + 2 * h], x3 = a[i + 3 * h];
        const s01 = x0 + x1, d01 = x0 - x1, s23 = x2 + x3, d23 = x2 - x3;
        a[i] = s01 + s23; a[i + h] = d01 + d23; a[i + 2 * h] = s01 - s23; a[i + 3 * h] = d01 - d23;
      }
    }
  } else if (t < bits) {
    const h = d << t, span = 2 * h;
    for (let base = start; base < end; base += span) {
      const stop = base + h;
      for (let i = base; i < stop; i++) {
        const x0 = a[i], x1 = a[i + h];
        a[i] = x0 + x1; a[i + h] = x0 - x1;
      }
    }
  }
}

/** Number of set bits of a non-negative integer < 2^53. */
export function popcount(x: number): number {
  let c = 0;
  while (x > 0) {
    const lo = x % 4294967296;
    let v = lo >>> 0;
    v = v - ((v >>> 1) & 0x55555555);
    v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
    c += (Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24);
    x = (x - lo) / 4294967296;
  }
  return c;
}

/**
 * The weight phase on `count` contiguous amplitudes from doubles offset `at`, whose basis
 * indices are baseIndex + k (k < count, k's bits disjoint from baseIndex's, so w = w(base) + w(k)).
 * wtab[2w], wtab[2w+1] = 2^{−n}·cos(β(n−2w)), 2^{−n}·sin(β(n−2w)); amp *= cos − i·sin.
 */
export function weightPhaseRun(a: Float64Array, at: number, count: number, baseWeight: number, wtab: Float64Array): void {
  for (let k = 0, i = at; k < count; k++, i += 2) {
    let v = k;
    v = v - ((v >>> 1) & 0x55555555);
    v = (v & 0x33333333) + ((v >>> 2) & 0x33333333);
    const w = baseWeight + (Math.imul((v + (v >>> 4)) & 0x0f0f0f0f, 0x01010101) >>> 24);
    const c = wtab[2 * w], s = wtab[2 * w + 1];
    const re = a[i], im = a[i + 1];
    a[i] = c * re + s * im;
    a[i + 1] = c * im - s * re;
  }
}

/**
 * Low sweep over blocks blockFrom…blockTo−1 of 2^low amplitudes: `pre` (the cost phase, when
 * given: called on the block's basis range), then the transform on qubits 0…low−1; when wtab is
 * given (the whole state fits one block's qubits, low = n) also the weight phase and the second
 * transform, i.e. the complete mixer in one pass.
 */
export function whtLowSweep(
  a: Float64Array, low: number, wtab: Float64Array | null,
  pre: ((start: number, end: number) => void) | null, blockFrom: number, blockTo: number,
): void {
  const blockLen = 2 ** low;
  for (let b = blockFrom; b < blockTo; b++) {
    const start = b * blockLen, end = start + blockLen;
    if (pre) pre(start, end);
    whtRange(a, 2 * start, 2 * end, 2, low);
    if (wtab) {
      weightPhaseRun(a, 2 * start, blockLen, popcount(start), wtab);
      whtRange(a, 2 * start, 2 * end, 2, low);
    }
  }
}

/**
 * A sweep over high qubits lo…hi−1, tiles tileFrom…tileTo−1 (same tiling as layer-kernels
 * highSweep: 2^(hi−lo) rows 2^lo apart × 2^run contiguous amplitudes, copied to scratch so the
 * power-of-two strides do not thrash the cache). When wtab is given this is the middle of the
 * mixer: transform, weight phase, transform again, all on the tile while it is in cache — valid
 * because every other qubit's first transform is already done and its second not yet started.
 */
export function whtHighSweep(
  a: Float64Array, n: number, lo: number, hi: number, run: number, wtab: Float64Array | null,
  scratch: Float64Array, tileFrom: number, tileTo: number,
): void {
  const runLen = 2 ** run, runDoubles = 2 * runLen;
  const rows = 2 ** (hi - lo), rowStride = 2 ** lo, tileSpan = 2 ** hi;
  const tileDoubles = rows * runDoubles;
  const midCount = 2 ** (lo - run);
  for (let tile = tileFrom; tile < tileTo; tile++) {
    const outer = Math.floor(tile / midCount), mid = tile - outer * midCount;
    const base = outer * tileSpan + mid * runLen;
    for (let j = 0, src = 2 * base, dst = 0; j < rows; j++, src += 2 * rowStride, dst += runDoubles) {
      scratch.set(a.subarray(src, src + runDoubles), dst);
    }
    // In the scratch block qubit lo+t is bit run+t: partner distance runDoubles·2^t.
    whtRange(scratch, 0, tileDoubles, runDoubles, hi - lo);
    if (wtab) {
      const w0 = popcount(base);
      for (let j = 0; j < rows; j++) weightPhaseRun(scratch, j * runDoubles, runLen, w0 + popcount(j), wtab);
      whtRange(scratch, 0, tileDoubles, runDoubles, hi - lo);
    }
    for (let j = 0, dst = 2 * base, src = 0; j < rows; j++, dst += 2 * rowStride, src += runDoubles) {
      a.set(scratch.subarray(src, src + runDoubles), dst);
    }
  }
}
