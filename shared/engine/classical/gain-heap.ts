/**
 * Indexed binary max-heap of depots keyed by a real gain (FM with real lane weights, where
 * integer gain buckets do not apply). Update and removal by depot id are O(log n).
 */
export interface GainHeap {
  size(): number;
  has(v: number): boolean;
  top(): number; // −1 when empty
  topKey(): number;
  insert(v: number, key: number): void;
  update(v: number, key: number): void;
  remove(v: number): void;
  clear(): void;
}

export function createGainHeap(capacity: number): GainHeap {
  const heap = new Int32Array(capacity);
  const pos = new Int32Array(capacity).fill(-1);
  const key = new Float64Array(capacity);
  let size = 0;
  const swap = (a: number, b: number): void => {
    const va = heap[a], vb = heap[b];
    heap[a] = vb; heap[b] = va;
    pos[vb] = a; pos[va] = b;
  };
  const up = (i: number): void => {
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (key[heap[p]] >= key[heap[i]]) return;
      swap(i, p);
      i = p;
    }
  };
  const down = (i: number): void => {
    for (;;) {
      const l = 2 * i + 1, r = l + 1;
      let m = i;
      if (l < size && key[heap[l]] > key[heap[m]]) m = l;
      if (r < size && key[heap[r]] > key[heap[m]]) m = r;
      if (m === i) return;
      swap(i, m);
      i = m;
    }
  };
  return {
    size: () => size,
    has: (v) => pos[v] >= 0,
    top: () => (size > 0 ? heap[0] : -1),
    topKey: () => (size > 0 ? key[heap[0]] : -Infinity),
    insert(v, k) {
      key[v] = k;
      heap[size] = v;
      pos[v] = size++;
      up(size - 1);
    },
    update(v, k) {
      const i = pos[v];
      if (i < 0) return;
      const old = key[v];
      key[v] = k;
      if (k > old) up(i);
      else down(i);
    },
    remove(v) {
      const i = pos[v];
      if (i < 0) return;
      const last = size - 1;
      if (i !== last) {
        swap(i, last);
        size--;
        pos[v] = -1;
        up(i);
        down(i);
      } else {
        size--;
        pos[v] = -1;
      }
    },
    clear() {
      for (let i = 0; i < size; i++) pos[heap[i]] = -1;
      size = 0;
    },
  };
}
