/**
 * Integer gains in buckets (one doubly linked list per gain value, as in Fiduccia &
 * Mattheyses 1982), split into a few classes (tabu search keeps admissible and tabu depots
 * apart, so the best admissible move is the head of the top bucket of its class, O(1) amortised).
 *
 * Shapes: `head` is classes × (2·maxGain + 1), bucket of class c and gain g at
 * c·(2·maxGain + 1) + g + maxGain, −1 when empty, `tail` the same for the last depot of each
 * bucket; `next`, `prev`, `key`, `cls` are per depot.
 * Depots not stored (cls −1) still carry a key, so callers can keep every gain in one array.
 */
export class GainBuckets {
  readonly head: Int32Array;
  readonly tail: Int32Array;
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

  constructor(n: number, readonly maxGain: number, classes: number) {
    this.span = 2 * maxGain + 1;
    this.head = new Int32Array(classes * this.span).fill(-1);
    this.tail = new Int32Array(classes * this.span).fill(-1);
    this.next = new Int32Array(n);
    this.prev = new Int32Array(n);
    this.key = new Int32Array(n);
    this.cls = new Int8Array(n).fill(-1);
    this.bound = new Int32Array(classes).fill(-1);
  }

  /** Stores v (with its current key) in class c, first in its bucket or, with `last`, last. */
  insert(v: number, c: number, last = false): void {
    const b = this.key[v] + this.maxGain;
    const at = c * this.span + b;
    if (last) {
      const t = this.tail[at];
      this.prev[v] = t;
      this.next[v] = -1;
      if (t >= 0) this.next[t] = v;
      else this.head[at] = v;
      this.tail[at] = v;
    } else {
      const h = this.head[at];
      this.next[v] = h;
      this.prev[v] = -1;
      if (h >= 0) this.prev[h] = v;
      else this.tail[at] = v;
      this.head[at] = v;
    }
    this.cls[v] = c;
    if (b > this.bound[c]) this.bound[c] = b;
  }

  remove(v: number): void {
    const c = this.cls[v];
    if (c < 0) return;
    const p = this.prev[v], q = this.next[v], at = c * this.span + this.key[v] + this.maxGain;
    if (p >= 0) this.next[p] = q;
    else this.head[at] = q;
    if (q >= 0) this.prev[q] = p;
    else this.tail[at] = p;
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
    const base = c * this.span;
    let b = this.bound[c];
    while (b >= 0 && this.head[base + b] < 0) b--;
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
    const first = this.head[c * this.span + k + this.maxGain];
    let count = 1;
    for (let v = this.next[first]; v >= 0 && count < among; v = this.next[v]) count++;
    let v = first;
    for (let i = draw(count); i > 0; i--) v = this.next[v];
    return v;
  }
}
