/**
 * The move structures of max-cut tabu search against brute force on random states: gain
 * buckets (integer lanes) and the scan (real lanes) must name a best move by recomputing every
 * gain from scratch, tabu status must follow the hold/release calls, and the recency list must
 * name the depot moved longest ago.
 */
import { GainBuckets } from '../../../shared/engine/classical/gain-buckets';
import { BucketMoves, ScanMoves, createMaxcutMoves, type MaxcutMoves } from '../../../shared/engine/classical/maxcut-moves';
import { RecencyList } from '../../../shared/engine/classical/recency-list';
import { createRng } from '../../../shared/engine/random';
import type { CompactNetwork } from '../../../shared/engine/network/types';
import { problemOf, randomGraph } from './helpers';

/** Cut and every depot's flip gain, recomputed from the lanes. */
function bruteForce(net: CompactNetwork, side: Int8Array): { cut: number; gain: number[] } {
  let cut = 0;
  const gain = new Array<number>(net.n).fill(0);
  for (let e = 0; e < net.m; e++) {
    const a = net.laneFrom[e], b = net.laneTo[e], w = net.laneWeight[e];
    const crossing = side[a] !== side[b];
    if (crossing) cut += w;
    gain[a] += crossing ? -w : w;
    gain[b] += crossing ? -w : w;
  }
  return { cut, gain };
}

describe('gain buckets', () => {
  test('the top of each class is the highest stored key after random inserts, key changes, class changes and removals', () => {
    const rng = createRng(5);
    const n = 60, maxGain = 9;
    const b = new GainBuckets(n, maxGain, 2);
    for (let v = 0; v < n; v++) {
      b.key[v] = rng.int(2 * maxGain + 1) - maxGain;
      b.insert(v, rng.int(2));
    }
    for (let step = 0; step < 5000; step++) {
      const v = rng.int(n), r = rng.next();
      const last = rng.next() < 0.5;
      const placed = (u: number) => { const at = b.cls[u] * (2 * maxGain + 1) + b.key[u] + maxGain; return last ? b.last(at) : b.first(at); };
      if (b.cls[v] < 0) {
        b.insert(v, rng.int(2), last);
        expect(placed(v)).toBe(v);
      } else if (r < 0.6) b.setKey(v, rng.int(2 * maxGain + 1) - maxGain);
      else if (r < 0.9) {
        b.setClass(v, 1 - b.cls[v], last);
        expect(placed(v)).toBe(v);
      } else b.remove(v);
      // Every bucket's list runs from its head to its tail through exactly its depots.
      const wrong: number[] = [];
      for (let at = 0; at < b.buckets; at++) {
        let lastListed = -1;
        for (let u = b.first(at); u >= 0; u = b.after(u)) {
          if (b.cls[u] * (2 * maxGain + 1) + b.key[u] + maxGain !== at) wrong.push(u);
          lastListed = u;
        }
        if (b.last(at) !== lastListed) wrong.push(at);
      }
      expect(wrong).toEqual([]);
      for (const c of [0, 1]) {
        let top = -Infinity;
        for (let u = 0; u < n; u++) if (b.cls[u] === c) top = Math.max(top, b.key[u]);
        expect(b.topKey(c)).toBe(top);
        const picked = b.pickTop(c, 4, (count) => rng.int(count));
        if (top === -Infinity) expect(picked).toBe(-1);
        else expect([b.cls[picked], b.key[picked]]).toEqual([c, top]);
      }
    }
  });
});

describe.each([
  ['integer lanes (buckets)', 'pm1', BucketMoves],
  ['real lanes (scan)', 'real', ScanMoves],
] as const)('max-cut moves on %s', (_, weights, kind) => {
  test('cut, ascent and best admissible move equal brute force along a random tabu walk with pins', () => {
    const n = 40;
    const problem = problemOf(n, randomGraph(n, 0.2, 17, weights));
    const net = problem.network;
    const rng = createRng(9);
    const free = Int32Array.from({ length: n - 4 }, (_, i) => i + 2); // depots 0, 1, 38, 39 stay put
    const start = Int8Array.from({ length: n }, () => rng.int(2));
    const moves: MaxcutMoves = createMaxcutMoves(net, start, free, 7, rng);
    expect(moves).toBeInstanceOf(kind);
    const tabuUntil = new Array<number>(n).fill(0);
    let best = moves.cut();
    for (let iter = 1; iter <= 3000; iter++) {
      const { cut, gain } = bruteForce(net, moves.side);
      expect(moves.cut()).toBeCloseTo(cut, 9);
      const freeGains = Array.from(free, (v) => gain[v]);
      const up = moves.ascent();
      if (Math.max(...freeGains) > 1e-9) expect(gain[up]).toBeCloseTo(Math.max(...freeGains), 9);
      else expect(up).toBe(-1);
      const admissible = Array.from(free).filter((v) => tabuUntil[v] <= iter - 1 || cut + gain[v] > best + 1e-9);
      const v = moves.directed(best);
      if (admissible.length === 0) expect(v).toBe(-1);
      else {
        expect(admissible).toContain(v);
        expect(gain[v]).toBeCloseTo(Math.max(...admissible.map((u) => gain[u])), 9);
      }
      const chosen = v >= 0 && rng.next() < 0.8 ? v : free[rng.int(free.length)];
      moves.flip(chosen);
      moves.release(iter);
      tabuUntil[chosen] = iter + 1 + rng.int(7);
      moves.hold(chosen, tabuUntil[chosen]);
      best = Math.max(best, moves.cut());
    }
    expect(Array.from(moves.side.slice(0, 2))).toEqual(Array.from(start.slice(0, 2)));
    moves.releaseAll();
    const { gain } = bruteForce(net, moves.side);
    expect(gain[moves.directed(Infinity)]).toBeCloseTo(Math.max(...Array.from(free, (u) => gain[u])), 9);
  });
});

describe('recency list', () => {
  test('names the depot moved longest ago (ties in the given order), as a scan of move times does', () => {
    const rng = createRng(3);
    const order = [4, 0, 7, 2, 9, 5];
    const list = new RecencyList(10, order);
    const lastMoved = new Map(order.map((v) => [v, 0]));
    for (let t = 1; t <= 500; t++) {
      let oldest = order[0];
      for (const v of order) if (lastMoved.get(v)! < lastMoved.get(oldest)!) oldest = v;
      expect(list.oldest()).toBe(oldest);
      const v = rng.next() < 0.3 ? list.oldest() : order[rng.int(order.length)];
      list.touch(v);
      lastMoved.set(v, t);
    }
  });
});
