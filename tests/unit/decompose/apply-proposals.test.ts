/**
 * applyProposals (variational/block-stages.ts) takes each proposal's cut change from the block's
 * changed depots (problem/evaluate.ts crossingChange) and writes only the block. The rule it
 * replaced recounted the whole cut on a copy per proposal; it is kept here as the oracle, and
 * both must keep the same proposals: same assignment, same value.
 */
import { crossingWeight } from '../../../shared/engine/problem/evaluate';
import type { Problem } from '../../../shared/engine/problem/types';
import { createRng, type Rng } from '../../../shared/engine/random';
import { readInstance } from '../../data/load';
import { applyProposals } from '../../../shared/engine/variational/block-stages';
import type { BlockAnswer } from '../../../shared/engine/variational/block-task';
import { blockMembers } from '../../../shared/engine/variational/decompose';
import { pinsOf, problemOf, type Edge } from '../classical/helpers';

/** What each kept or refused proposal did to the cut, as the oracle saw it. */
interface Tally { raised: number; equalMoved: number; refused: number }

/** The previous rule: every proposal tried on a copy, the whole cut recounted. */
function recountingRule(problem: Problem, sides: ArrayLike<number>, members: number[][], answers: (BlockAnswer | undefined)[], startValue: number, tally: Tally) {
  let current = Int32Array.from(sides);
  let value = startValue;
  for (const a of answers) {
    if (!a || !a.solved) continue;
    const trial = current.slice();
    members[a.block].forEach((v, i) => (trial[v] = a.sides[i]));
    const trialValue = crossingWeight(problem, trial);
    if (trialValue >= value - 1e-12) {
      if (trialValue > value + 1e-12) tally.raised++;
      else if (trial.some((s, i) => s !== current[i])) tally.equalMoved++;
      current = trial;
      value = Math.max(value, trialValue);
    } else tally.refused++;
  }
  return { assignment: current, value };
}

const answer = (block: number, sides: number[], solved = true): BlockAnswer => ({ block, sides, qubits: sides.length, value: 0, evaluations: 0, shots: 0, stopped: false, solved });

/** The best sides of `block` with the rest at `sides` (enumeration; pinned depots kept), a random one among ties. */
function bestForBlock(problem: Problem, sides: Int32Array, block: number[], rng: Rng): number[] {
  const trial = sides.slice();
  let best = -Infinity;
  let found: number[][] = [];
  for (let code = 0; code < 2 ** block.length; code++) {
    if (block.some((v, i) => problem.pins[v] >= 0 && ((code >> i) & 1) !== problem.pins[v])) continue;
    block.forEach((v, i) => (trial[v] = (code >> i) & 1));
    const value = crossingWeight(problem, trial);
    if (value > best + 1e-9) [best, found] = [value, []];
    if (value >= best - 1e-9) found.push(block.map((v) => trial[v]));
  }
  return found[rng.int(found.length)];
}

/** One round's proposals, all from the snapshot `sides`, of every kind the descent can meet. */
function proposals(problem: Problem, sides: Int32Array, members: number[][], rng: Rng): (BlockAnswer | undefined)[] {
  return members.map((block, b) => {
    const keepPins = (s: number[]) => s.map((side, i) => (problem.pins[block[i]] >= 0 ? problem.pins[block[i]] : side));
    const own = block.map((v) => sides[v]);
    const kind = rng.int(10);
    // Task answers also carry the sides of the depots around the block (ignored here).
    const around = Array.from({ length: rng.int(4) }, () => rng.int(2));
    if (kind === 0) return undefined; // never ran
    if (kind === 1) return answer(b, own, false); // no read-out answer
    if (kind === 2) return answer(b, own); // the snapshot's own sides
    if (kind === 3) return answer(b, keepPins(own.map((s) => s ^ 1))); // the whole block flipped
    if (kind <= 5) return answer(b, keepPins(block.map(() => rng.int(2))).concat(around)); // any sides
    return answer(b, bestForBlock(problem, sides, block, rng).concat(around)); // best on the snapshot
  });
}

function compareRules(problem: Problem, blockSize: number, seed: number, exact: boolean, tally: Tally): void {
  const rng = createRng(seed);
  const { members } = blockMembers(problem.network, blockSize, rng);
  const sides = Int32Array.from(problem.pins, (p) => (p >= 0 ? p : rng.int(2)));
  // Each round from where the last ended, as the descent does.
  for (let round = 0; round < 4; round++) {
    const answers = proposals(problem, sides, members, rng);
    const snapshot = sides.slice();
    const oracle = recountingRule(problem, sides, members, answers, crossingWeight(problem, sides), tally);
    const got = applyProposals(problem, sides, members, answers, crossingWeight(problem, sides));
    expect(Array.from(got.assignment)).toEqual(Array.from(oracle.assignment));
    if (exact) expect(got.value).toBe(oracle.value);
    else expect(Math.abs(got.value - oracle.value)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(oracle.value)));
    expect(Array.from(sides)).toEqual(Array.from(snapshot)); // the snapshot itself is not written
    sides.set(got.assignment);
  }
}

/** Seeded G(n, p), each lane's weight drawn by `draw`. */
function randomEdges(n: number, p: number, seed: number, draw: (rng: Rng) => number): Edge[] {
  const rng = createRng(seed);
  const edges: Edge[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) if (rng.next() < p) edges.push([i, j, draw(rng)]);
  return edges;
}
const sign = (rng: Rng) => (rng.next() < 0.5 ? -1 : 1);

describe('applyProposals from the changed depots = the whole-cut recount', () => {
  test.each([
    ['unit', () => 1, true],
    ['±1', sign, true],
    ['integer ±1…±5', (rng: Rng) => sign(rng) * (1 + rng.int(5)), true],
    ['quarter-step (sums exact)', (rng: Rng) => sign(rng) * (1 + rng.int(20)) / 4, true],
    ['real', (rng: Rng) => sign(rng) * (0.1 + 9.9 * rng.next()), false],
  ] as const)('%s weights: same assignment and value, round after round', (name, draw, exact) => {
    const tally: Tally = { raised: 0, equalMoved: 0, refused: 0 };
    for (let seed = 1; seed <= 10; seed++) {
      const n = 30 + 4 * seed;
      const edges = randomEdges(n, 0.15, 50 + seed, draw);
      const pins = seed % 3 === 0 ? pinsOf({ 0: 1, 5: 0, 7: 1 }) : {};
      compareRules(problemOf(n, edges, { pins }), 3 + (seed % 6), seed, exact, tally);
    }
    // The cases this file is about all happened: kept rises, kept moves of equal cut, refusals.
    expect(tally.raised).toBeGreaterThan(0);
    if (name !== 'real') expect(tally.equalMoved).toBeGreaterThan(0);
    expect(tally.refused).toBeGreaterThan(0);
  });

  test('G11 (800 depots, ±1 toroidal grid; Helmberg & Rendl 2000) in blocks of 14: same assignment and value', () => {
    const { n, edges } = readInstance('gset', 'G11');
    const problem = problemOf(n, edges);
    const tally: Tally = { raised: 0, equalMoved: 0, refused: 0 };
    const rng = createRng(11);
    const { members } = blockMembers(problem.network, 14, rng);
    const sides = Int32Array.from({ length: n }, () => rng.int(2));
    // Block proposals from 1-flip moves on the snapshot (gain ≥ 0, some ties taken): cheap on 14-depot blocks.
    for (let round = 0; round < 3; round++) {
      const answers = members.map((block, b) => {
        const trial = sides.slice();
        for (const v of block) {
          const flipped = trial.slice();
          flipped[v] ^= 1;
          const gain = crossingWeight(problem, flipped) - crossingWeight(problem, trial);
          if (gain > 0 || (gain === 0 && rng.int(2) === 0) || rng.int(8) === 0) trial[v] ^= 1;
        }
        return answer(b, block.map((v) => trial[v]));
      });
      const oracle = recountingRule(problem, sides, members, answers, crossingWeight(problem, sides), tally);
      const got = applyProposals(problem, sides, members, answers, crossingWeight(problem, sides));
      expect(Array.from(got.assignment)).toEqual(Array.from(oracle.assignment));
      expect(got.value).toBe(oracle.value);
      sides.set(got.assignment);
    }
    expect(tally.raised).toBeGreaterThan(0);
    expect(tally.equalMoved).toBeGreaterThan(0);
    expect(tally.refused).toBeGreaterThan(0);
  });
});
