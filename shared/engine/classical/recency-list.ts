/**
 * Depots ordered by when they last moved (least recent first), O(1) per move: the
 * recency-based perturbation of breakout local search takes the depot left alone the longest.
 * Shapes: `next` / `prev` per depot (−1 at the ends); only the depots given at creation are listed.
 */
export class RecencyList {
  private readonly next: Int32Array;
  private readonly prev: Int32Array;
  private first = -1;
  private last = -1;

  /** `order`: the listed depots, oldest first (ties broken in this order). */
  constructor(n: number, order: ArrayLike<number>) {
    this.next = new Int32Array(n).fill(-1);
    this.prev = new Int32Array(n).fill(-1);
    for (let t = 0; t < order.length; t++) this.append(order[t]);
  }

  private append(v: number): void {
    this.prev[v] = this.last;
    this.next[v] = -1;
    if (this.last >= 0) this.next[this.last] = v;
    else this.first = v;
    this.last = v;
  }

  /** The least recently moved depot (−1 when empty). */
  oldest(): number {
    return this.first;
  }

  /** Marks v (a listed depot) as moved just now. */
  touch(v: number): void {
    if (v === this.last) return;
    const p = this.prev[v], q = this.next[v];
    if (p >= 0) this.next[p] = q;
    else this.first = q;
    if (q >= 0) this.prev[q] = p;
    this.append(v);
  }
}
