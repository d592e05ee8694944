import type { CompactNetwork } from '../network/types';
import type { Rng } from '../random';
import { createFlipState, flipDepot } from './flip-state';
import { GainBuckets } from './gain-buckets';

/**
 * The single-flip neighbourhood of max-cut tabu search: flips, tabu status and the two move
 * choices the search needs (steepest ascent, best admissible move). Two implementations with
 * the same answers up to tie-breaking: gain buckets when every lane weight is an integer (the
 * G-set and most networks), a scan of the gain array otherwise.
 */
export interface MaxcutMoves {
  readonly side: Int8Array;
  cut(): number;
  /** Flips v without tabu bookkeeping. */
  flip(v: number): void;
  /** v is tabu while the iteration count is below `until` (> the current one). */
  hold(v: number, until: number): void;
  /** The iteration count has become `iter`: depots held until `iter` are admissible again. */
  release(iter: number): void;
  releaseAll(): void;
  /** A depot whose flip gains most if that gain is positive (tabu ignored), else −1. */
  ascent(): number;
  /**
   * A best admissible flip (even a losing one); a tabu depot is admissible when its flip beats
   * `best`. −1 when nothing is admissible.
   */
  directed(best: number): number;
}

const OPEN = 0, HELD = 1;
const eps = 1e-9;
/** Above this weighted degree buckets would cost more memory than they save. */
const maxBucketGain = 4e6;

/** Bucketed moves when all lanes are integer and degrees bounded, else the scan. */
export function createMaxcutMoves(net: CompactNetwork, start: Int8Array, free: Int32Array, maxTenure: number, rng: Rng): MaxcutMoves {
  let maxDegree = 0;
  for (let i = 0; i < net.n; i++) {
    let d = 0;
    for (let p = net.adjStart[i]; p < net.adjStart[i + 1]; p++) {
      if (!Number.isInteger(net.adjWeight[p])) return new ScanMoves(net, start, free, rng);
      d += Math.abs(net.adjWeight[p]);
    }
    maxDegree = Math.max(maxDegree, d);
  }
  if (maxDegree > maxBucketGain) return new ScanMoves(net, start, free, rng);
  return new BucketMoves(net, start, free, maxDegree, maxTenure, rng);
}

/**
 * Integer lanes. Admissible depots live in the OPEN class of the buckets, tabu ones in HELD;
 * a ring of expiry lists (slot = release iteration mod ring length, ring longer than any
 * tenure) moves them back, so no move ever scans past tabu depots.
 */
export class BucketMoves implements MaxcutMoves {
  readonly side: Int8Array;
  private readonly buckets: GainBuckets;
  private readonly weight2: Int32Array; // 2 × lane weight per adjacency entry
  private readonly ring: Int32Array; // head of each expiry slot, −1 = empty
  private readonly ringNext: Int32Array;
  private readonly ringPrev: Int32Array;
  private readonly ringSlot: Int32Array; // per depot, −1 = not held
  private readonly draw: (count: number) => number;
  private cutValue: number;

  constructor(private readonly net: CompactNetwork, start: Int8Array, private readonly free: Int32Array, maxGain: number, maxTenure: number, rng: Rng) {
    const st = createFlipState(net, start);
    const n = net.n;
    this.side = st.side;
    this.cutValue = st.cut;
    this.buckets = new GainBuckets(n, maxGain, 2);
    for (let i = 0; i < n; i++) this.buckets.key[i] = st.delta[i];
    for (let t = 0; t < free.length; t++) this.buckets.insert(free[t], OPEN);
    this.weight2 = new Int32Array(net.adjWeight.length);
    for (let p = 0; p < this.weight2.length; p++) this.weight2[p] = 2 * net.adjWeight[p];
    this.ring = new Int32Array(maxTenure + 2).fill(-1);
    this.ringNext = new Int32Array(n);
    this.ringPrev = new Int32Array(n);
    this.ringSlot = new Int32Array(n).fill(-1);
    this.draw = (count) => (count === 1 ? 0 : rng.int(count));
  }

  cut(): number {
    return this.cutValue;
  }

  flip(v: number): void {
    const { adjStart, adjIndex } = this.net;
    const side = this.side, w2 = this.weight2, b = this.buckets;
    // The hot loop: GainBuckets.setKey written out over local arrays (same steps; bucket lists
    // are circular through a sentinel per bucket, so no end-of-list branches).
    const key = b.key, cls = b.cls, next = b.next, prev = b.prev, bound = b.bound;
    const g = b.maxGain, span = b.span, n = b.n;
    const sv = side[v];
    this.cutValue += key[v];
    for (let p = adjStart[v], e = adjStart[v + 1]; p < e; p++) {
      const j = adjIndex[p];
      // +w2 when j is on the other side, −w2 on the same side (no branch: the sides are random).
      const k = key[j] + (((side[j] ^ sv) << 1) - 1) * w2[p];
      const c = cls[j];
      if (c >= 0) {
        const pj = prev[j], qj = next[j];
        next[pj] = qj;
        prev[qj] = pj;
        const at = k + g, s = n + c * span + at, h = next[s];
        next[j] = h;
        prev[j] = s;
        prev[h] = j;
        next[s] = j;
        if (at > bound[c]) bound[c] = at;
      }
      key[j] = k;
    }
    b.setKey(v, -key[v]);
    side[v] = 1 - sv;
  }

  hold(v: number, until: number): void {
    this.unring(v);
    const s = until % this.ring.length;
    const h = this.ring[s];
    this.ringNext[v] = h;
    this.ringPrev[v] = -1;
    if (h >= 0) this.ringPrev[h] = v;
    this.ring[s] = v;
    this.ringSlot[v] = s;
    this.buckets.setClass(v, HELD);
  }

  private unring(v: number): void {
    const s = this.ringSlot[v];
    if (s < 0) return;
    const p = this.ringPrev[v], q = this.ringNext[v];
    if (p >= 0) this.ringNext[p] = q;
    else this.ring[s] = q;
    if (q >= 0) this.ringPrev[q] = p;
    this.ringSlot[v] = -1;
  }

  release(iter: number): void {
    const s = iter % this.ring.length;
    for (let v = this.ring[s]; v >= 0; ) {
      const q = this.ringNext[v];
      this.ringSlot[v] = -1;
      // Last in its bucket: a depot just set free must not be the first pick (it would flip
      // straight back, a cycle the tenure is there to break).
      this.buckets.setClass(v, OPEN, true);
      v = q;
    }
    this.ring[s] = -1;
  }

  releaseAll(): void {
    for (let s = 0; s < this.ring.length; s++) this.release(s);
  }

  ascent(): number {
    const a = this.buckets.topKey(OPEN), h = this.buckets.topKey(HELD);
    if (Math.max(a, h) <= 0) return -1;
    return this.buckets.pickTop(a >= h ? OPEN : HELD, 4, this.draw);
  }

  directed(best: number): number {
    const a = this.buckets.topKey(OPEN), h = this.buckets.topKey(HELD);
    if (h > a && this.cutValue + h > best + eps) return this.buckets.pickTop(HELD, 8, this.draw);
    return this.buckets.pickTop(OPEN, 8, this.draw);
  }
}

/** Real lane weights: every choice scans the free depots' gains. */
export class ScanMoves implements MaxcutMoves {
  readonly side: Int8Array;
  private readonly st;
  private readonly tabuUntil: Float64Array;
  private iter = 0;

  constructor(private readonly net: CompactNetwork, start: Int8Array, private readonly free: Int32Array, private readonly rng: Rng) {
    this.st = createFlipState(net, start);
    this.side = this.st.side;
    this.tabuUntil = new Float64Array(net.n);
  }

  cut(): number {
    return this.st.cut;
  }

  flip(v: number): void {
    flipDepot(this.net, this.st, v);
  }

  hold(v: number, until: number): void {
    this.tabuUntil[v] = until;
  }

  release(iter: number): void {
    this.iter = iter;
  }

  releaseAll(): void {
    this.tabuUntil.fill(0);
  }

  ascent(): number {
    const { free, rng } = this;
    const delta = this.st.delta;
    let bv = -1, bd = eps, ties = 0;
    for (let t = 0; t < free.length; t++) {
      const v = free[t];
      const d = delta[v];
      if (d > bd + eps) { bd = d; bv = v; ties = 1; }
      else if (bv >= 0 && d > bd - eps && rng.int(++ties) === 0) bv = v;
    }
    return bv;
  }

  directed(best: number): number {
    const { free, rng, tabuUntil, iter } = this;
    const delta = this.st.delta, cut = this.st.cut;
    let bv = -1, bd = -Infinity, ties = 0;
    for (let t = 0; t < free.length; t++) {
      const v = free[t];
      const d = delta[v];
      if (tabuUntil[v] > iter && cut + d <= best + eps) continue;
      if (d > bd + eps) { bd = d; bv = v; ties = 1; }
      else if (d > bd - eps && rng.int(++ties) === 0) bv = v;
    }
    return bv;
  }
}
