/**
 * Max-cut on networks larger than a statevector can hold, by decomposition (Zhou, Du, Tian,
 * Tao, "QAOA-in-QAOA: solving large-scale MaxCut problems on small quantum machines",
 * arXiv:2205.11762 (2022)):
 *  1. split the depots into blocks of ≤ blockSize with the classical k-way partitioner (few
 *     lanes between blocks, so each block keeps most of its structure);
 *  2. solve each block's own max-cut with QAOA (pins enter as fixed spins);
 *  3. choose each block's orientation t_b ∈ {±1}: with block spins s_u, the lanes between
 *     blocks contribute Σ_{a<b} w'_ab (1 − t_a t_b)/2 + const, w'_ab = Σ_{u∈a, v∈b} w_uv s_u s_v —
 *     itself a max-cut over the blocks, solved exactly when small, else by recursive QAOA
 *     (variational/rqaoa.ts), which needs no wide circuit at any number of blocks;
 *  4. improve: re-solve each block by QAOA with its surroundings fixed (our addition), and
 *     refine with 1-flip local search.
 * The steps run as stages in block-stages.ts (the in-process solve and the solve worker, which
 * spreads the block solves over the job queue, share them); this file keeps their helpers.
 * A heuristic: no optimality guarantee (the caller shows it next to the classical best and the bound).
 */
import { compactFromEdges } from '../network/build';
import type { CompactNetwork } from '../network/types';
import { encodeMaxCut } from '../encodings/maxcut';
import { sizeLimitedBlocks } from '../classical/kway';
import type { PartGraph } from '../classical/fm-bisection';
import { createFlipState, flipDepot } from '../classical/flip-state';
import { polishBisection, polishMaxcut, repairBalance } from '../classical/local-search';
import { balanceWindow, randomBalancedSides } from '../classical/balance';
import { encodeBisection } from '../encodings/bisection';
import { isBalanced } from '../problem/evaluate';
import { freeDepots } from '../classical/result';
import { crossingWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { runQaoa, type VariationalTracePoint } from './qaoa-run';
import { bitsOfSpins, defaultBatchFraction, RQAOA_MAX_REMAINDER, runRqaoa } from './rqaoa';

export interface DecomposeOptions {
  /** Most depots per block (= qubits simulated at once). */
  blockSize: number;
  layers: number;
  /** Shots per energy estimate (0 = exact expectation). */
  shots: number;
  readoutShots: number;
  restarts: number;
  maxIterations: number;
  /** Merge by exact enumeration when at most this many blocks are free, else by recursive QAOA (rqaoa.ts). */
  mergeExactLimit: number;
  /**
   * Improvement rounds after the merge (a block-coordinate descent): each block is solved again
   * by QAOA with the depots around it fixed at their current sides (lanes to them become
   * fields), kept unless the cut falls (block-stages.ts applyProposals); every round after the first on a freshly drawn split.
   */
  rounds: number;
  /**
   * Classical local search on the answer (max-cut: 1-flip between and after the rounds;
   * bisection: whole-block pair moves, balance repair, flips and swaps). Off: the answer is the
   * blocks' QAOA, the merge and the QAOA rounds alone (a bisection may then miss the balance).
   */
  refine: boolean;
  /** Recursive QAOA work above which a max-cut merge goes to blocks of blocks (block-merge.ts; not a setting: tests lower it). */
  mergeRqaoaWork?: number;
}

export interface BlockReport {
  depots: number;
  qubits: number;
  /** Cut inside the block from its QAOA read-out, before any refinement. */
  value: number;
  evaluations: number;
}

export interface DecomposeOutcome {
  assignment: Int32Array;
  blocks: BlockReport[];
  /** Block id per depot (the split). */
  blockOf: Int32Array;
  merge: { method: 'single' | 'exact' | 'rqaoa' | 'blocks' | 'local'; blocks: number; gain: number };
  /** Cut after merging, before the 1-flip refinement; and flips the refinement made. */
  mergedValue: number;
  /** Cut gained by the improvement rounds (block re-solves with fixed surroundings), and how many ran. */
  roundsGain: number;
  rounds: number;
  refineFlips: number;
  /** Value before any classical local search: after the merge (refine on) or the final one (off). */
  unrefinedValue: number;
  unrefinedFeasible: boolean;
  evaluations: number;
  shots: number;
  trace: VariationalTracePoint[];
  stopped: boolean;
}

export interface DecomposeControl {
  shouldStop(): boolean;
  /** Called after each block and after the merge (fraction of blocks done, best value so far). */
  onStep?(fraction: number, bestValue: number | undefined): void;
  onIteration?(point: VariationalTracePoint): void;
}

/**
 * Split into blocks of at most `blockSize` depots by recursive multilevel bisection on |w|
 * (classical/kway.ts sizeLimitedBlocks): few lanes between blocks, any number of blocks.
 */
export function splitIntoBlocks(network: CompactNetwork, blockSize: number, rng: Rng): Int32Array {
  const { n } = network;
  if (n <= blockSize) return new Int32Array(n);
  const g: PartGraph = {
    n,
    adjStart: network.adjStart,
    adjIndex: network.adjIndex,
    // Heavy lanes inside blocks is what we want, whatever their sign: partition on |w|.
    adjWeight: Float64Array.from(network.adjWeight, Math.abs),
    vw: new Float64Array(n).fill(1),
    pin: new Int8Array(n).fill(-1),
  };
  return sizeLimitedBlocks(g, blockSize, rng);
}

/** The sub-problem of one block: its depots, the lanes among them, and the problem's pins. */
export function blockProblem(problem: Problem, members: number[], kind: 'maxcut' | 'bisection' = 'maxcut'): Problem {
  const local = new Map(members.map((v, i) => [v, i]));
  const { adjStart, adjIndex, adjWeight } = problem.network;
  const edges: [number, number, number][] = [];
  members.forEach((v, i) => {
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
      const j = local.get(adjIndex[p]);
      if (j !== undefined && j > i) edges.push([i, j, adjWeight[p]]);
    }
  });
  const network = { ...compactFromEdges(members.length, edges), depotWeight: Float64Array.from(members, (v) => problem.network.depotWeight[v]) };
  const pins = Int32Array.from(members, (v) => problem.pins[v]);
  return { kind, k: 2, network, pins, tolerance: kind === 'bisection' ? problem.tolerance : 0 };
}

/**
 * One block with its surroundings fixed: the block's depots are free (unless pinned), every
 * depot outside the block that shares a lane with it is pinned to its current side. The first
 * `members.length` depots of the sub-problem are the block's.
 */
export function blockInContext(problem: Problem, members: number[], sides: ArrayLike<number>): { sub: Problem; around: number[] } {
  const local = new Map(members.map((v, i) => [v, i]));
  const around: number[] = [];
  const { adjStart, adjIndex } = problem.network;
  for (const v of members) {
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
      const u = adjIndex[p];
      if (!local.has(u)) {
        local.set(u, members.length + around.length);
        around.push(u);
      }
    }
  }
  const all = [...members, ...around];
  const { adjWeight } = problem.network;
  const edges: [number, number, number][] = [];
  members.forEach((v, i) => {
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) {
      const j = local.get(adjIndex[p])!;
      if (j > i) edges.push([i, j, adjWeight[p]]);
    }
  });
  const pins = Int32Array.from(all, (v, i) => (i < members.length ? problem.pins[v] : sides[v]));
  return { sub: { kind: 'maxcut', k: 2, network: compactFromEdges(all.length, edges), pins, tolerance: 0 }, around };
}

/** Exact max-cut over ≤ ~20 free vertices by enumeration (Gray code, O(2^f · deg)). */
export function exactSmallMaxcut(problem: Problem): Int32Array {
  const { adjStart, adjIndex, adjWeight } = problem.network;
  const side = Int32Array.from(problem.pins, (p) => (p >= 0 ? p : 0));
  const free = freeDepots(problem.pins);
  let value = crossingWeight(problem, side);
  let best = value;
  let bestSide = side.slice();
  const f = free.length;
  for (let step = 1; step < 2 ** f; step++) {
    // Gray code: flip the vertex of the lowest set bit of step.
    const bit = 31 - Math.clz32(step & -step);
    const v = free[bit];
    let delta = 0;
    for (let p = adjStart[v]; p < adjStart[v + 1]; p++) delta += side[adjIndex[p]] === side[v] ? adjWeight[p] : -adjWeight[p];
    side[v] ^= 1;
    value += delta;
    if (value > best + 1e-12) {
      best = value;
      bestSide = side.slice();
    }
  }
  return bestSide;
}

/**
 * The lanes of the orientation problem: w'_ab = Σ_{u∈a, v∈b} w_uv s_u s_v over lanes between
 * blocks a < b (spin s = +1 on side 0), zero couplings dropped. Flipping blocks by t ∈ {±1}
 * then gives cut = const + Σ_{a<b} w'_ab (1 − t_a t_b)/2 (Zhou et al. 2022).
 */
export function blockCouplings(network: CompactNetwork, blockOf: Int32Array, blockCount: number, sides: ArrayLike<number>): [number, number, number][] {
  const spin = (v: number) => (sides[v] === 0 ? 1 : -1);
  const between = new Map<number, number>();
  const { m, laneFrom, laneTo, laneWeight } = network;
  for (let e = 0; e < m; e++) {
    const a = blockOf[laneFrom[e]], b = blockOf[laneTo[e]];
    if (a === b) continue;
    const key = a < b ? a * blockCount + b : b * blockCount + a;
    between.set(key, (between.get(key) ?? 0) + laneWeight[e] * spin(laneFrom[e]) * spin(laneTo[e]));
  }
  const edges: [number, number, number][] = [];
  for (const [key, w] of between) if (w !== 0) edges.push([Math.floor(key / blockCount), key % blockCount, w]);
  return edges;
}

/** Blocks of at most `blockSize` depots: each depot's block, and each block's depots in order. */
export function blockMembers(network: CompactNetwork, blockSize: number, rng: Rng): { blockOf: Int32Array; members: number[][] } {
  const blockOf = splitIntoBlocks(network, blockSize, rng);
  let blockCount = 0;
  for (let i = 0; i < network.n; i++) blockCount = Math.max(blockCount, blockOf[i] + 1);
  const members: number[][] = Array.from({ length: blockCount }, () => []);
  for (let i = 0; i < network.n; i++) members[blockOf[i]].push(i);
  return { blockOf, members };
}

/**
 * Block orientations for balanced bisection: minimise the crossing weight between blocks,
 * Σ_{a<b} (W_ab − w′_ab t_a t_b)/2, subject to the global balance window on side-1 weight
 * W₁ = (W + Σ t_b D_b)/2 (D_b = side-1 minus side-0 weight of block b). Exact over all
 * orientations of ≤ exactLimit free blocks (Gray code), else greedy flips. Returns t as 0/1
 * (1 = flip) per block and the method.
 */
export function orientForBisection(
  couplings: [number, number, number][], imbalance: Float64Array, total: number, window: { lo: number; hi: number }, fixed: Uint8Array, exactLimit: number,
): { flip: Uint8Array; method: 'exact' | 'local' } {
  const B = imbalance.length;
  const adj: [number, number][][] = Array.from({ length: B }, () => []);
  for (const [a, b, w] of couplings) { adj[a].push([b, w]); adj[b].push([a, w]); }
  const t = new Int8Array(B).fill(1);
  let D = 0;
  for (let b = 0; b < B; b++) D += imbalance[b];
  // cost = −Σ w′ t_a t_b / 2 (the W_ab part is constant)
  let cost = 0;
  for (const [a, b, w] of couplings) cost -= (w * t[a] * t[b]) / 2;
  const violation = (d: number) => { const w1 = (total + d) / 2; return w1 > window.hi ? w1 - window.hi : w1 < window.lo ? window.lo - w1 : 0; };
  const flipCost = (b: number) => { let c = 0; for (const [j, w] of adj[b]) c += w * t[b] * t[j]; return c; }; // change of cost when b flips
  const free: number[] = [];
  for (let b = 0; b < B; b++) if (!fixed[b]) free.push(b);
  if (free.length <= exactLimit) {
    let best = { v: violation(D), cost, t: t.slice() };
    for (let step = 1; step < 2 ** free.length; step++) {
      const b = free[31 - Math.clz32(step & -step)];
      cost += flipCost(b);
      D -= 2 * t[b] * imbalance[b];
      t[b] = -t[b] as 1 | -1;
      const v = violation(D);
      if (v < best.v - 1e-9 || (Math.abs(v - best.v) <= 1e-9 && cost < best.cost - 1e-12)) best = { v, cost, t: t.slice() };
    }
    return { flip: Uint8Array.from(best.t, (x) => (x < 0 ? 1 : 0)), method: 'exact' };
  }
  for (let improved = true; improved; ) {
    improved = false;
    for (const b of free) {
      const nd = D - 2 * t[b] * imbalance[b];
      const dv = violation(nd) - violation(D), dc = flipCost(b);
      if (dv < -1e-9 || (Math.abs(dv) <= 1e-9 && dc < -1e-12)) {
        cost += dc;
        D = nd;
        t[b] = -t[b] as 1 | -1;
        improved = true;
      }
    }
  }
  return { flip: Uint8Array.from(t, (x) => (x < 0 ? 1 : 0)), method: 'local' };
}

/**
 * Pair moves over blocks: put block a wholly on side 0 and block b wholly on side 1 (each either
 * bisected or whole before) when that lowers the crossing weight and keeps the balance window;
 * repeated until no pair helps. Each try flips the depots of a and b on a flip state and undoes
 * them when the move does not help: O(lanes of a and b) per pair, O(B²·block lanes) per sweep,
 * checked against `shouldStop` between blocks.
 */
export function wholeBlockMoves(problem: Problem, members: number[][], fixed: Uint8Array, assignment: Int32Array, shouldStop: () => boolean): number {
  const { lo, hi } = balanceWindow(problem);
  const net = problem.network;
  const st = createFlipState(net, assignment);
  let moves = 0;
  const flipped: number[] = [];
  for (let improved = true, sweeps = 0; improved && sweeps < 20 && !shouldStop(); sweeps++) {
    improved = false;
    for (let a = 0; a < members.length && !shouldStop(); a++) {
      if (fixed[a]) continue;
      for (let b = 0; b < members.length; b++) {
        if (b === a || fixed[b]) continue;
        const before = st.cut;
        flipped.length = 0;
        for (const v of members[a]) if (st.side[v] === 1) { flipDepot(net, st, v); flipped.push(v); }
        for (const v of members[b]) if (st.side[v] === 0) { flipDepot(net, st, v); flipped.push(v); }
        if (flipped.length > 0 && st.cut < before - 1e-12 && st.weight1 >= lo - 1e-9 && st.weight1 <= hi + 1e-9) {
          moves++;
          improved = true;
        } else for (let i = flipped.length - 1; i >= 0; i--) flipDepot(net, st, flipped[i]);
      }
    }
  }
  for (let i = 0; i < assignment.length; i++) assignment[i] = st.side[i];
  return moves;
}
