/**
 * The elite pool keeps the best distinct solutions (a cut and its mirror count as one) and its
 * children keep what both parents agree on — after mirroring the second parent when that makes
 * them agree more, unless depots are pinned (then sides are not interchangeable).
 */
import { createElitePool } from '../../../shared/engine/classical/elite-pool';
import { createRng } from '../../../shared/engine/random';
import { tabuMaxcut, tabuMaxcutDefaults } from '../../../shared/engine/classical/tabu-maxcut';
import type { RunControl } from '../../../shared/engine/classical/run-control';
import { randomSides } from '../../../shared/engine/classical/balance';
import { exactSolver } from '../../../shared/engine/solvers/exact';
import { crossingWeight, respectsPins } from '../../../shared/engine/problem/evaluate';
import { ctx, pinsOf, problemOf, randomGraph } from './helpers';

const sides = (bits: string) => Int8Array.from(bits, (c) => Number(c));
const allFree = (n: number) => Int32Array.from({ length: n }, (_, i) => i);

describe('elite pool', () => {
  test('refuses duplicates and mirror images, keeps the best when full', () => {
    const pool = createElitePool(2, 6);
    pool.admit(sides('000111'), 5);
    pool.admit(sides('000111'), 5);
    pool.admit(sides('111000'), 5); // the same cut, sides swapped
    expect(pool.size).toBe(1);
    pool.admit(sides('010101'), 3);
    expect(pool.size).toBe(2);
    pool.admit(sides('001011'), 2); // worse than both: not kept
    pool.admit(sides('001101'), 7); // replaces the 3
    // Children now only come from the 5 and the 7 (no 3 left): depots 0, 1, 3, 5, where 000111
    // and 001101 agree (they differ on 2 of 6, so no mirroring), are fixed in every child.
    const rng = createRng(4);
    const out = new Int8Array(6);
    for (let k = 0; k < 20; k++) {
      expect(pool.child(rng, allFree(6), true, out)).toBe(true);
      expect([out[0], out[1], out[3], out[5]]).toEqual([0, 0, 1, 1]);
    }
  });

  test('mirrors the second parent when that makes the parents agree more', () => {
    const pool = createElitePool(2, 8);
    pool.admit(sides('00001111'), 10);
    pool.admit(sides('11110001'), 9); // the mirror of 00001110: one depot from the first
    const out = new Int8Array(8);
    const rng = createRng(1);
    const seen = new Set<string>();
    for (let k = 0; k < 40; k++) {
      pool.child(rng, allFree(8), true, out);
      seen.add(Array.from(out).join(''));
      // Depots 0…6 agree after mirroring; only depot 7 is drawn — in one labelling or the other.
      const s = Array.from(out).join('');
      expect(['0000111', '1111000'].includes(s.slice(0, 7))).toBe(true);
    }
    expect(seen.size).toBeGreaterThan(1);
    // With pinned depots no mirroring: the parents disagree on seven depots, which are drawn.
    const pinnedOut = new Int8Array(8);
    const draws = new Set<string>();
    for (let k = 0; k < 40; k++) {
      pool.child(rng, Int32Array.of(0, 1, 2, 3, 4, 5, 6, 7), false, pinnedOut);
      draws.add(Array.from(pinnedOut).slice(0, 7).join(''));
      expect(pinnedOut[7]).toBe(1); // both parents have depot 7 on side 1
    }
    expect(draws.size).toBeGreaterThan(10);
  });

  test('needs two members for a child', () => {
    const pool = createElitePool(4, 3);
    expect(pool.child(createRng(1), allFree(3), true, new Int8Array(3))).toBe(false);
    pool.admit(sides('011'), 2);
    expect(pool.child(createRng(1), allFree(3), true, new Int8Array(3))).toBe(false);
  });
});

describe('tabu max-cut with recombination and restarts switched on', () => {
  // Kicks and restarts forced often (stagnation limits of a few moves), on ±1, real and unit
  // lanes with and without pins: the cut it reports is the cut of the sides it returns (the gain
  // buckets stay true through the recombination flips and restarts) and reaches the optimum.
  test.each([
    [14, 0.4, 'pm1', 31], [15, 0.6, 'real', 32], [16, 0.3, 'unit', 33],
  ] as const)('n=%i p=%f %s seed %i', async (n, p, w, seed) => {
    const edges = randomGraph(n, p, seed, w);
    for (const pinned of [false, true]) {
      const problem = problemOf(n, edges, pinned ? { pins: pinsOf({ 1: 1, 5: 0 }) } : {});
      const opt = (await exactSolver.solve(problem, exactSolver.parseSettings({}), ctx(5))).value;
      const rng = createRng(seed);
      let ticks = 0;
      const control: RunControl = { elapsed: () => 0, shouldStop: () => ticks > 30, fraction: () => 0, tick: async () => ++ticks > 30 };
      const opts = { ...tabuMaxcutDefaults, eliteSize: 4, combineShare: 1, restartStagnation: 20, walkStagnation: 2, stagnation: 5, epochMoves: 5 };
      const r = await tabuMaxcut(problem, randomSides(problem, rng), opts, rng, control);
      expect(r.cut).toBeCloseTo(crossingWeight(problem, r.side), 9);
      expect(r.cut).toBeCloseTo(opt, 9);
      expect(respectsPins(problem, r.side)).toBe(true);
    }
  });
});
