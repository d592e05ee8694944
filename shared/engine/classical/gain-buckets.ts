/**
 * Integer gains in buckets (one doubly linked list per gain value, as in Fiduccia &
 * Mattheyses 1982), split into a few classes (tabu search keeps admissible and tabu depots
 * apart, so the best admissible move is the head of the top bucket of its class, O(1) amortised).
 *
 * Shapes: bucket of class c and gain g is index c·(2·maxGain + 1) + g + maxGain (of classes ×
 * (2·maxGain + 1)); `next`, `prev` are n + buckets long (depots, then one sentinel per bucket);
 * `key`, `cls` are per depot.
 * Depots not stored (cls −1) still carry a key, so callers can keep every gain in one array.
 */
export class GainBuckets {
  /**
   * Links of depots (0…n−1) and of one sentinel per bucket (n + bucket index): each bucket is a
   * circular list through its sentinel, so linking and unlinking need no branch for the ends
   * (the branches of a −1-terminated list mispredicted often in the tabu move loop).
   */
  readonly next: Int32Array;
  readonly prev: Int32Array;
  /** Current gain of each depot (stored or not). */
  readonly key: Int32Array;
  /** Class of each depot, −1 = not stored. */
  readonly cls: Int8Array;
  /** Per class: no bucket above this index (relative to the class) is non-empty. */
  readonly bound: Int32Array;
  /** Buckets per class. */
  readonly span: number;
  /** Buckets in all (classes × span). */
  readonly buckets: number;

  constructor(readonly n: number, readonly maxGain: number, classes: number) {
    this.span = 2 * maxGain + 1;
    this.buckets = classes * this.span;
    this.next = new Int32Array(n + this.buckets);
    this.prev = new Int32Array(n + this.buckets);
    for (let s = n; s < n + this.buckets; s++) this.next[s] = this.prev[s] = s;
    this.key = new Int32Array(n);
    this.cls = new Int8Array(n).fill(-1);
    this.bound = new Int32Array(classes).fill(-1);
  }

  /** First depot of bucket `at` (class · span + gain + maxGain), −1 when empty. */
  first(at: number): number {
    const v = this.next[this.n + at];
    return v < this.n ? v : -1;
  }

  /** Last depot of bucket `at`, −1 when empty. */
  last(at: number): number {
    const v = this.prev[this.n + at];
    return v < this.n ? v : -1;
  }

  /** The depot after u in its bucket, −1 at the end. */
  after(u: number): number {
    const v = this.next[u];
    return v < this.n ? v : -1;
  }

  /** Stores v (with its current key) in class c, first in its bucket or, with `last`, last. */
  insert(v: number, c: number, last = false): void {
    const b = this.key[v] + this.maxGain;
    const s = this.n + c * this.span + b;
    const next = this.next, prev = this.prev;
    if (last) {
      const t = prev[s];
      prev[v] = t;
      next[v] = s;
      next[t] = v;
      prev[s] = v;
    } else {
      const h = next[s];
      next[v] = h;
      prev[v] = s;
      prev[h] = v;
      next[s] = v;
    }
    this.cls[v] = c;
    if (b > this.bound[c]) this.bound[c] = b;
  }

  remove(v: number): void {
    if (this.cls[v] < 0) return;
    const p = this.prev[v], q = this.next[v];
    this.next[p] = q;
    this.prev[q] = p;
    this.cls[v] = -1;
  }

  /** Sets v's gain, keeping its class. */
  setKey(v: number, k: number): void {
    const c = this.cls[v];
    if (c < 0) {
      this.key[v] = k;
      return;
    }
    this.remove(v);
    this.key[v] = k;
    this.insert(v, c);
  }

  /** Moves v to class c (v must be stored), first in its bucket or, with `last`, last. */
  setClass(v: number, c: number, last = false): void {
    if (this.cls[v] === c) return;
    this.remove(v);
    this.insert(v, c, last);
  }

  /** Highest gain stored in class c, or −Infinity when the class is empty. */
  topKey(c: number): number {
    const base = this.n + c * this.span;
    let b = this.bound[c];
    while (b >= 0 && this.next[base + b] === base + b) b--;
    this.bound[c] = b;
    return b < 0 ? -Infinity : b - this.maxGain;
  }

  /**
   * One of the first `among` depots of class c's top bucket, chosen by `draw(count)` (an index
   * below count); −1 when the class is empty. With unit lanes many depots share a gain, and
   * always taking the list head sends every search down the same path.
   */
  pickTop(c: number, among: number, draw: (count: number) => number): number {
    const k = this.topKey(c);
    if (k === -Infinity) return -1;
    const n = this.n, next = this.next;
    const first = next[n + c * this.span + k + this.maxGain];
    let count = 1;
    for (let v = next[first]; v < n && count < among; v = next[v]) count++;
    let v = first;
    for (let i = draw(count); i > 0; i--) v = next[v];
    return v;
  }
}
