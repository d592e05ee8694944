/**
 * The merge of `qaoa-blocks` (max-cut): each block's orientation t_b ∈ {±1} is itself a max-cut
 * over the blocks — the block graph (decompose.ts blockCouplings; Zhou et al. 2022). Three ways:
 *  - few free blocks: exact enumeration;
 *  - a sparse block graph: recursive QAOA on it (level 1, closed form; rqaoa.ts);
 *  - a dense block graph (e.g. a random network, where almost every pair of blocks shares a lane):
 *    blocks of blocks. Recursive QAOA there takes one elimination per round, each round a pass
 *    over every triangle of the block graph — on G22's graph (2,000 depots, 167 blocks) 18 s of
 *    the run's 55 s CPU, all in one thread while every other worker waits. Instead the block
 *    graph is split again into sub-blocks of ≤ blockSize blocks, each solved by QAOA as an
 *    ordinary block task (so the solve worker spreads them like the first stage), and only the
 *    sub-blocks' orientations — a block graph of ~1/blockSize the size — are solved here, by the
 *    same three rules (exact for 2,000 depots).
 *
 * The descent rounds re-orient their own blocks the same way (block-stages.ts, phase 'orient').
 *
 * Which one: `rqaoaPassWork` counts the closed form's work per angle pass (couplings plus
 * triangles, level1.ts) times the rounds one-per-round elimination takes; above
 * MERGE_RQAOA_WORK the block graph goes to sub-blocks.
 */
import { compactFromEdges } from '../network/build';
import { encodeMaxCut } from '../encodings/maxcut';
import { freeDepots } from '../classical/result';
import type { Problem } from '../problem/types';
import { blockCouplings, exactSmallMaxcut } from './decompose';
import { level1Graph } from './level1-graph';
import { bitsOfSpins, defaultBatchFraction, RQAOA_MAX_REMAINDER, runRqaoa } from './rqaoa';

/**
 * Closed-form work (couplings + triangles per pass, times rounds) above which the merge goes to
 * blocks of blocks. Measured (scratch profile, one thread): G33's block graph (165 blocks, sparse)
 * ≈ 2·10⁵ → recursive QAOA in 0.35 s; G22's (167 blocks, dense) ≈ 3·10⁸ → 18 s. 10⁷ ≈ half a
 * second at the measured ≈ 5·10⁻⁸ s per unit.
 */
export const MERGE_RQAOA_WORK = 1e7;

/** The orientation problem: max-cut over blocks; a block holding a pinned depot keeps its orientation. */
export function orientationProblem(problem: Problem, blockOf: ArrayLike<number>, blockCount: number, sides: ArrayLike<number>): Problem {
  const edges = blockCouplings(problem.network, Int32Array.from(blockOf), blockCount, sides);
  const pins = new Int32Array(blockCount).fill(-1);
  for (let i = 0; i < problem.network.n; i++) if (problem.pins[i] >= 0) pins[blockOf[i]] = 0;
  if (pins.every((p) => p < 0) && blockCount > 0) pins[0] = 0; // the global flip changes nothing
  return { kind: 'maxcut', k: 2, network: compactFromEdges(blockCount, edges), pins, tolerance: 0 };
}

/**
 * Work of recursive QAOA with one elimination per round on `mp`: (couplings + triangles) of the
 * first pass times the rounds (free blocks above the exact remainder). Eliminating spins merges
 * their couplings, so later passes are smaller on dense graphs and not much larger on sparse ones.
 */
export function rqaoaPassWork(mp: Problem, stopAt: number): number {
  const free = freeDepots(mp.pins).length;
  if (free <= stopAt) return 0;
  const g = level1Graph(encodeMaxCut(mp).operator);
  return (g.op.quadCoeff.length + g.triA.length) * (free - stopAt);
}

export type MergeRoute = 'exact' | 'rqaoa' | 'blocks';

/** How to orient the blocks of `mp` (see the file comment). */
export function mergeRoute(mp: Problem, exactLimit: number, workLimit: number = MERGE_RQAOA_WORK): MergeRoute {
  if (freeDepots(mp.pins).length <= exactLimit) return 'exact';
  return rqaoaPassWork(mp, Math.min(exactLimit, RQAOA_MAX_REMAINDER)) > workLimit ? 'blocks' : 'rqaoa';
}

/**
 * Orientations of `mp` here (exact or recursive QAOA; never a circuit wider than the exact
 * remainder): 0/1 per block (1 = flip), the method and the closed-form passes it took.
 */
export function orientHere(mp: Problem, exactLimit: number, shouldStop: () => boolean): { flip: ArrayLike<number>; method: 'exact' | 'rqaoa'; evaluations: number } {
  if (freeDepots(mp.pins).length <= exactLimit) return { flip: exactSmallMaxcut(mp), method: 'exact', evaluations: 0 };
  const encoding = encodeMaxCut(mp);
  const out = runRqaoa(encoding.operator, { stopAt: Math.min(exactLimit, RQAOA_MAX_REMAINDER), batchFraction: defaultBatchFraction(encoding.numQubits), hurry: shouldStop, overdue: shouldStop });
  return { flip: encoding.decode(bitsOfSpins(out.spins)), method: 'rqaoa', evaluations: out.evaluations };
}
