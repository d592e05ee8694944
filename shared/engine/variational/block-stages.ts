/**
 * `qaoa-blocks` as stages (the method is in decompose.ts): plan → block solves → merge →
 * improvement rounds → refinement. Every stage that does heavy work hands back independent
 * block tasks (block-task.ts) and a plain-JSON state; `resumeBlocks` takes the answers and goes
 * on. The in-process solve (`decomposeByBlocks`) runs the tasks itself, one after another; the
 * solve worker spreads them over all workers through the job queue and resumes anywhere — the
 * same code either way, so both give the same answer for the same seed.
 *
 * Improvement rounds (max-cut): every block is solved again with its surroundings fixed at the
 * round's starting sides (so the blocks of one round are independent), then the proposals are
 * applied block by block in order, each kept when the whole cut does not fall with the blocks
 * already changed in this round (applyProposals: equal-cut proposals move along plateaus); then the round's blocks are re-oriented as whole spins over
 * their block graph (block-merge.ts: here, or on a dense block graph as blocks of blocks — a
 * further stage of sub-block tasks, like the first merge's).
 */
import { createFlipState } from '../classical/flip-state';
import { polishBisection, polishMaxcut, repairBalance } from '../classical/local-search';
import { balanceWindow } from '../classical/balance';
import { freeDepots } from '../classical/result';
import { crossingChange, crossingWeight, isBalanced } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createRng, deriveSeed } from '../random';
import type { LayerBackend } from '../statevector/backend';
import { runBlockTask, flatLanes, type BlockAnswer, type BlockTask } from './block-task';
import {
  blockCouplings, blockInContext, exactSmallMaxcut, blockMembers, blockProblem, orientForBisection, wholeBlockMoves,
  type BlockReport, type DecomposeControl, type DecomposeOptions, type DecomposeOutcome,
} from './decompose';
import type { VariationalTracePoint } from './qaoa-run';
import { mergeRoute, orientationProblem, orientHere } from './block-merge';
import { encodeMaxCut } from '../encodings/maxcut';
import { bitsOfSpins, defaultBatchFraction, RQAOA_MAX_REMAINDER, runRqaoa } from './rqaoa';

/**
 * Default block QAOA settings (the qaoa-blocks settings' defaults, and rqaoa's descent rounds):
 * blocks of 14 depots, 2 layers, exact expectations, best of 1,024 read-out shots, 8 simplex
 * iterations per block (solvers/qaoa-blocks.ts says why), up to 1,000 descent rounds (the time
 * limit and descentStalled end them sooner; 100 cut G18's plateau walk short, which still rose at round 70).
 */
export const BLOCK_QAOA_DEFAULTS = { blockSize: 14, layers: 2, shots: 0, readoutShots: 1024, restarts: 1, maxIterations: 8, mergeExactLimit: 16, rounds: 1000 } as const;

/** Most trace points kept from the block solves (evenly thinned above; the chart needs no more). */
export const MAX_BLOCK_TRACE = 2000;

/** Between stages: everything the next stage needs, as plain JSON (depot-indexed arrays of n). */
export interface BlocksState {
  kind: 'maxcut' | 'bisection';
  /**
   * blocks: the first block solves are out; merge: the block graph's sub-blocks (blocks of blocks);
   * round: an improvement round's blocks; orient: the round's block graph's sub-blocks (the round
   * re-oriented as blocks of blocks, from the sides after its proposals).
   */
  phase: 'blocks' | 'merge' | 'round' | 'orient';
  round: number;
  blockOf: number[];
  /** Sides per depot the round's tasks (phase 'round') or the block graph (phases 'merge', 'orient') were built on. */
  sides: number[];
  /** Block id per depot of the round's own blocking (phase 'round'; redrawn each round after the first). */
  roundBlockOf: number[];
  /** Rounds in a row that raised nothing (the descent stops after PLATEAU_ROUNDS_TO_STOP of them; descentStalled). */
  idleRounds: number;
  /** Rounds in a row that moved no depot at all (the descent stops after IDLE_ROUNDS_TO_STOP of them). */
  stillRounds: number;
  /** Phases 'merge' and 'orient': the sub-block of each block (the block graph's split). */
  mergeBlockOf?: number[];
  /** Cut right after the first block solves, before the merge. */
  blocksValue: number;
  roundStart: number;
  blocks: BlockReport[];
  merge: DecomposeOutcome['merge'];
  mergedValue: number;
  roundsGain: number;
  refineFlips: number;
  evaluations: number;
  shots: number;
  stopped: boolean;
  trace: VariationalTracePoint[];
}

export type BlocksStep =
  /** Solve these tasks (in any order, anywhere), then call resumeBlocks with their answers. `progress` is the share of the run the stage spans. */
  | { kind: 'spread'; state: BlocksState; tasks: BlockTask[]; progress: { from: number; to: number } }
  | { kind: 'done'; outcome: DecomposeOutcome };

/** Progress share of the first block solves and the merge; the rounds share the rest. */
const BLOCKS_SHARE = 0.6;
/** Seed part of the merge's sub-block split and tasks (the stages use 0 and the round numbers 1…rounds). */
const MERGE_SEED_PART = 1000;
/** Seed stream of the rounds' re-orientation sub-blocks (then the round number; apart from the streams above). */
const ROUND_ORIENT_STREAM = 0x0e1a7;

const roundProgress = (opts: DecomposeOptions, round: number) => ({
  from: BLOCKS_SHARE + ((1 - BLOCKS_SHARE) * round) / Math.max(1, opts.rounds),
  to: BLOCKS_SHARE + ((1 - BLOCKS_SHARE) * (round + 1)) / Math.max(1, opts.rounds),
});

function membersOf(blockOf: ArrayLike<number>): number[][] {
  let count = 0;
  for (let i = 0; i < blockOf.length; i++) count = Math.max(count, blockOf[i] + 1);
  const members: number[][] = Array.from({ length: count }, () => []);
  for (let i = 0; i < blockOf.length; i++) members[blockOf[i]].push(i);
  return members;
}

function taskOf(sub: Problem, block: number, seed: number, opts: DecomposeOptions, first: boolean): BlockTask {
  return {
    block, kind: sub.kind === 'bisection' ? 'bisection' : 'maxcut', n: sub.network.n, lanes: flatLanes(sub), pins: Array.from(sub.pins),
    ...(sub.kind === 'bisection' ? { depotWeight: Array.from(sub.network.depotWeight) } : {}),
    tolerance: sub.tolerance, seed, layers: opts.layers, shots: opts.shots, readoutShots: opts.readoutShots,
    restarts: first ? opts.restarts : 1, maxIterations: opts.maxIterations, qubitLimit: opts.blockSize + 5, trace: first,
  };
}

/** Stage 0: split into blocks (seeded) and one task per block. */
export function planBlocks(problem: Problem, opts: DecomposeOptions, seed: number): BlocksStep {
  if (problem.kind !== 'maxcut' && problem.kind !== 'bisection') throw new Error(`qaoa-blocks answers max-cut and bisection, not ${problem.kind}`);
  const { blockOf, members } = blockMembers(problem.network, opts.blockSize, createRng(seed));
  const tasks = members.map((list, b) => taskOf(blockProblem(problem, list, problem.kind === 'bisection' ? 'bisection' : 'maxcut'), b, deriveSeed(seed, 0, b), opts, true));
  const state: BlocksState = {
    kind: problem.kind, phase: 'blocks', round: 0, blockOf: Array.from(blockOf), sides: [], roundBlockOf: [], idleRounds: 0, stillRounds: 0, roundStart: 0, blocks: [],
    merge: { method: 'single', blocks: members.length, gain: 0 }, blocksValue: 0, mergedValue: 0, roundsGain: 0, refineFlips: 0, evaluations: 0, shots: 0, stopped: false, trace: [],
  };
  return { kind: 'spread', state, tasks, progress: { from: 0, to: BLOCKS_SHARE } };
}

/** Answers by block (any order in, a check that each planned block answered once). */
function byBlock(answers: BlockAnswer[], blocks: number): (BlockAnswer | undefined)[] {
  const out: (BlockAnswer | undefined)[] = new Array(blocks);
  for (const a of answers) {
    if (!(a.block >= 0 && a.block < blocks) || out[a.block]) throw new Error(`block answer ${a.block} is unknown or repeated (${blocks} blocks planned)`);
    out[a.block] = a;
  }
  return out;
}

function thin(trace: VariationalTracePoint[]): VariationalTracePoint[] {
  if (trace.length <= MAX_BLOCK_TRACE) return trace;
  const step = Math.ceil(trace.length / MAX_BLOCK_TRACE);
  const kept = trace.filter((_, i) => i % step === 0);
  if (kept[kept.length - 1] !== trace[trace.length - 1]) kept.push(trace[trace.length - 1]);
  return kept;
}

/** The first block answers into one assignment; reports, counters and the trace into the state. */
function collectBlocks(problem: Problem, state: BlocksState, members: number[][], answers: BlockAnswer[]): Int32Array {
  const assignment = Int32Array.from(problem.pins, (p) => (p >= 0 ? p : 0));
  const trace: VariationalTracePoint[] = [];
  // Iterations and seconds run on across blocks (seconds: block solving time summed over blocks).
  let base = 0, seconds = 0;
  byBlock(answers, members.length).forEach((a, b) => {
    if (!a) return; // a block that never ran (cancelled before it started) keeps its starting sides
    members[b].forEach((v, i) => (assignment[v] = a.sides[i]));
    state.blocks.push({ depots: members[b].length, qubits: a.qubits, value: a.value, evaluations: a.evaluations });
    state.evaluations += a.evaluations;
    state.shots += a.shots;
    if (a.stopped) state.stopped = true;
    for (const p of a.trace ?? []) trace.push({ ...p, iteration: base + p.iteration, seconds: seconds + p.seconds });
    if (trace.length > 0) ({ iteration: base, seconds } = trace[trace.length - 1]);
  });
  if (answers.length < members.length) state.stopped = true;
  state.trace = thin(trace);
  return assignment;
}

/**
 * Blocks of blocks, first half: the block graph `mp` split into sub-blocks of ≤ blockSize blocks
 * (seeded by `parts`), one ordinary QAOA task per sub-block (seed parts…, sub-block). Used by the
 * first merge and by every round's re-orientation when the block graph is dense (block-merge.ts).
 */
function subBlockTasks(mp: Problem, opts: DecomposeOptions, seed: number, parts: number[]): { subOf: number[]; tasks: BlockTask[] } {
  const { blockOf, members } = blockMembers(mp.network, opts.blockSize, createRng(deriveSeed(seed, ...parts)));
  return { subOf: Array.from(blockOf), tasks: members.map((list, b) => taskOf(blockProblem(mp, list), b, deriveSeed(seed, ...parts, b), opts, false)) };
}

/**
 * Blocks of blocks, second half, from the sub-block answers: the block graph's own assignment
 * (each sub-block as its QAOA answered), the sub-blocks' orientations on it (`orientTop`: exact
 * or recursive QAOA), then 0/1 per block (1 = flip). A sub-block without an answer (cancelled)
 * keeps its blocks as they are. Counters go into the state.
 */
function flipsFromSubBlocks(
  mp: Problem, subOf: number[], answers: BlockAnswer[], state: BlocksState,
  orientTop: (top: Problem) => { flip: ArrayLike<number>; evaluations: number },
): Int32Array {
  const subMembers = membersOf(subOf);
  const flip = Int32Array.from(mp.pins, (p) => (p >= 0 ? p : 0));
  for (const a of byBlock(answers, subMembers.length)) {
    if (!a) continue;
    state.evaluations += a.evaluations;
    state.shots += a.shots;
    if (a.solved) subMembers[a.block].forEach((b, i) => (flip[b] = a.sides[i]));
  }
  const top = orientTop(orientationProblem(mp, subOf, subMembers.length, flip));
  state.evaluations += top.evaluations;
  for (let b = 0; b < flip.length; b++) if (top.flip[subOf[b]] === 1) flip[b] ^= 1;
  return flip;
}

/**
 * Max-cut block orientations (block-merge.ts): exact or recursive QAOA here, or — a dense block
 * graph — blocks of blocks: the block graph's sub-blocks as a further stage of tasks.
 */
function mergeMaxcut(problem: Problem, opts: DecomposeOptions, seed: number, state: BlocksState, blockCount: number, assignment: Int32Array, control: DecomposeControl): BlocksStep | null {
  const mp = orientationProblem(problem, state.blockOf, blockCount, assignment);
  if (mergeRoute(mp, opts.mergeExactLimit, opts.mergeRqaoaWork) === 'blocks' && !control.shouldStop()) {
    const { subOf, tasks } = subBlockTasks(mp, opts, seed, [MERGE_SEED_PART]);
    state.phase = 'merge';
    state.sides = Array.from(assignment);
    state.mergeBlockOf = subOf;
    return { kind: 'spread', state, tasks, progress: { from: BLOCKS_SHARE, to: BLOCKS_SHARE } };
  }
  const { flip, method, evaluations } = orientHere(mp, opts.mergeExactLimit, () => control.shouldStop());
  state.merge.method = method;
  state.evaluations += evaluations;
  for (let i = 0; i < assignment.length; i++) if (flip[state.blockOf[i]] === 1) assignment[i] ^= 1;
  return null;
}

/** The first merge as blocks of blocks, from the sub-block answers: each block flipped by its side. */
function finishMergeBlocks(problem: Problem, opts: DecomposeOptions, state: BlocksState, blockCount: number, answers: BlockAnswer[], control: DecomposeControl): Int32Array {
  const assignment = Int32Array.from(state.sides);
  const mp = orientationProblem(problem, state.blockOf, blockCount, assignment);
  const flip = flipsFromSubBlocks(mp, state.mergeBlockOf!, answers, state, (top) => orientHere(top, opts.mergeExactLimit, () => control.shouldStop()));
  for (let i = 0; i < assignment.length; i++) if (flip[state.blockOf[i]] === 1) assignment[i] ^= 1;
  state.merge.method = 'blocks';
  state.phase = 'blocks';
  state.mergeBlockOf = undefined;
  return assignment;
}

/**
 * The blocking of improvement round `round`: the plan's own blocks first, then a fresh split
 * per round (its own seed), so the next descent step moves depots across the last round's
 * block borders (a block-coordinate descent over changing blocks; Zhou et al. 2022 solve the
 * blocks of one split once, we repeat with redrawn splits).
 */
export function roundBlocking(problem: Problem, opts: DecomposeOptions, seed: number, planned: ArrayLike<number>, round: number): Int32Array {
  if (round === 0) return Int32Array.from(planned);
  return blockMembers(problem.network, opts.blockSize, createRng(deriveSeed(seed, ROUND_SPLIT_STREAM, round))).blockOf;
}

/** Seed stream of the redrawn splits (apart from the block tasks' streams 0…rounds). */
const ROUND_SPLIT_STREAM = 0x5b10c;

/** A redrawn split can raise the cut after one that did not: stop after this many rounds in a row that moved no depot. */
export const IDLE_ROUNDS_TO_STOP = 3;

/**
 * Rounds in a row that moved depots along a plateau (equal cut) without raising it, after which
 * the descent stops all the same. On G18 (±1 weights, 800 depots) the plateau walk raised the cut
 * from 939 to 955 over rounds 12–70, with up to 10 rounds between rises; 20 leaves room for that.
 */
export const PLATEAU_ROUNDS_TO_STOP = 20;

/** The descent has stalled: nothing moved for IDLE_ROUNDS_TO_STOP rounds, or nothing rose for PLATEAU_ROUNDS_TO_STOP. */
export function descentStalled(state: Pick<BlocksState, 'idleRounds' | 'stillRounds'>): boolean {
  return state.stillRounds >= IDLE_ROUNDS_TO_STOP || state.idleRounds >= PLATEAU_ROUNDS_TO_STOP;
}

/**
 * A round's proposals, all made on the snapshot `sides`, applied in block order: each is kept
 * when the whole cut, with the blocks already changed in this round, does not fall. Equal cuts
 * are kept on purpose: with ±1 weights a block with fixed surroundings has many optima of the
 * same cut and its QAOA read-out names one of them; keeping only rises froze the descent on a
 * plateau (G18: 3 idle rounds after round 10 at cut 921, every block at its own optimum in the
 * last round, 7.2 % under the best known; keeping equal cuts: 955 at round 70).
 */
export function applyProposals(problem: Problem, sides: ArrayLike<number>, members: number[][], answers: (BlockAnswer | undefined)[], startValue: number): { assignment: Int32Array; value: number } {
  const current = Int32Array.from(sides);
  let value = startValue;
  for (const a of answers) {
    if (!a || !a.solved) continue;
    // The cut change from the block's changed depots only (a full recount per proposal was
    // O(blocks × lanes) per round in the job's own thread); a kept proposal writes its block only.
    const block = members[a.block];
    const trialValue = value + crossingChange(problem, current, block, a.sides);
    if (trialValue >= value - 1e-12) {
      for (let i = 0; i < block.length; i++) current[block[i]] = a.sides[i];
      value = Math.max(value, trialValue);
    }
  }
  return { assignment: current, value };
}

/**
 * Re-orienting a round's blocks here (a block graph below the merge's work limit, or the
 * sub-blocks' graph of a dense one): recursive QAOA takes at least this share of the blocks per
 * round and hurries after ROUND_ORIENT_HURRY_SECONDS (one pass after twice that), so no round's
 * bookkeeping can eat the rounds' time in the job's own thread. A dense block graph (G22's:
 * one-per-round 12–23 s) goes to sub-block tasks instead, which the time box never touches.
 */
export const ROUND_ORIENT_BATCH = 0.05;
export const ROUND_ORIENT_HURRY_SECONDS = 1.5;

/** Orientations of a round's block graph here: exact, or recursive QAOA time-boxed as above. */
function orientRoundHere(mp: Problem, opts: DecomposeOptions, control: DecomposeControl): { flip: ArrayLike<number>; evaluations: number } {
  if (freeDepots(mp.pins).length <= opts.mergeExactLimit) return { flip: exactSmallMaxcut(mp), evaluations: 0 };
  const started = performance.now();
  const seconds = () => (performance.now() - started) / 1000;
  const encoding = encodeMaxCut(mp);
  const out = runRqaoa(encoding.operator, {
    stopAt: Math.min(opts.mergeExactLimit, RQAOA_MAX_REMAINDER), batchFraction: Math.max(ROUND_ORIENT_BATCH, defaultBatchFraction(encoding.numQubits)),
    hurry: () => control.shouldStop() || seconds() >= ROUND_ORIENT_HURRY_SECONDS, overdue: () => control.shouldStop() || seconds() >= 2 * ROUND_ORIENT_HURRY_SECONDS,
  });
  return { flip: encoding.decode(bitsOfSpins(out.spins)), evaluations: out.evaluations };
}

/** `current` with the round's blocks flipped by `flip`, kept when the cut rises above `value`. */
function keepIfHigher(problem: Problem, roundBlockOf: number[], flip: ArrayLike<number>, current: Int32Array, value: number): { current: Int32Array; value: number } {
  const trial = current.map((side, i) => (flip[roundBlockOf[i]] === 1 ? side ^ 1 : side));
  const trialValue = crossingWeight(problem, trial);
  return trialValue > value + 1e-12 ? { current: trial, value: trialValue } : { current, value };
}

/** Close improvement round `state.round` at `current` (cut `value`) and start the next. */
function finishRound(problem: Problem, opts: DecomposeOptions, seed: number, state: BlocksState, current: Int32Array, value: number, control: DecomposeControl): BlocksStep {
  state.roundsGain += value - state.roundStart;
  control.onStep?.(roundProgress(opts, state.round).to, value);
  state.idleRounds = value > state.roundStart + 1e-12 ? 0 : state.idleRounds + 1;
  // The proposals counted their moves (stillRounds); a rise from the re-orientation is a move too.
  if (value > state.roundStart + 1e-12) state.stillRounds = 0;
  state.round++;
  state.phase = 'round';
  state.mergeBlockOf = undefined;
  return nextRound(problem, opts, seed, state, current, control);
}

/** Start improvement round `round` from `current`, or finish when no round is due. */
function nextRound(problem: Problem, opts: DecomposeOptions, seed: number, state: BlocksState, current: Int32Array, control: DecomposeControl): BlocksStep {
  const free = freeDepots(problem.pins);
  if (state.round < opts.rounds && !descentStalled(state) && free.length > 0 && !control.shouldStop()) {
    const blockOf = roundBlocking(problem, opts, seed, state.blockOf, state.round);
    const members = membersOf(blockOf);
    const tasks = members.length > 1
      ? members.flatMap((list, b) => (list.some((v) => problem.pins[v] < 0) ? [taskOf(blockInContext(problem, list, current).sub, b, deriveSeed(seed, state.round + 1, b), opts, false)] : []))
      : [];
    if (tasks.length > 0) {
      state.phase = 'round';
      state.sides = Array.from(current);
      state.roundBlockOf = Array.from(blockOf);
      state.roundStart = crossingWeight(problem, current);
      return { kind: 'spread', state, tasks, progress: roundProgress(opts, state.round) };
    }
  }
  // The variational answer is complete here (the merge and the QAOA rounds); the 1-flip
  // refinement runs once, after it, on the whole network (free depots only).
  const unrefinedValue = crossingWeight(problem, current);
  const st = createFlipState(problem.network, current);
  if (opts.refine) state.refineFlips += polishMaxcut(problem, st, free);
  return { kind: 'done', outcome: outcomeOf(state, Int32Array.from(st.side), unrefinedValue, true) };
}

function outcomeOf(state: BlocksState, assignment: Int32Array, unrefinedValue: number, unrefinedFeasible: boolean): DecomposeOutcome {
  return {
    assignment, blocks: state.blocks, blockOf: Int32Array.from(state.blockOf), merge: state.merge, mergedValue: state.mergedValue,
    roundsGain: state.roundsGain, rounds: state.round, refineFlips: state.refineFlips, unrefinedValue, unrefinedFeasible,
    evaluations: state.evaluations, shots: state.shots, trace: state.trace, stopped: state.stopped,
  };
}

/** The next stage, from the answers to the tasks of the last one (the state is not reused by the caller). */
export function resumeBlocks(problem: Problem, opts: DecomposeOptions, seed: number, state: BlocksState, answers: BlockAnswer[], control: DecomposeControl): BlocksStep {
  const members = membersOf(state.blockOf);
  const blockCount = members.length;
  if (state.phase === 'round') {
    // Proposals from one snapshot, applied in block order; each kept unless the cut falls.
    const roundMembers = membersOf(state.roundBlockOf);
    const ordered = byBlock(answers, roundMembers.length);
    for (const a of ordered) {
      if (!a) continue;
      state.evaluations += a.evaluations;
      state.shots += a.shots;
    }
    const proposed = applyProposals(problem, state.sides, roundMembers, ordered, state.roundStart);
    let current: Int32Array = proposed.assignment;
    let value = proposed.value;
    state.stillRounds = current.some((side, i) => side !== state.sides[i]) ? 0 : state.stillRounds + 1;
    // Then the round's blocks as whole spins, re-oriented on the current sides (moves a whole
    // block where single blocks are stuck); kept when the cut rises. A dense block graph goes
    // to sub-block tasks (phase 'orient', finished below), as the first merge does.
    if (roundMembers.length > 1 && !control.shouldStop()) {
      const mp = orientationProblem(problem, state.roundBlockOf, roundMembers.length, current);
      if (mergeRoute(mp, opts.mergeExactLimit, opts.mergeRqaoaWork) === 'blocks') {
        const { subOf, tasks } = subBlockTasks(mp, opts, seed, [ROUND_ORIENT_STREAM, state.round]);
        state.phase = 'orient';
        state.sides = Array.from(current);
        state.mergeBlockOf = subOf;
        const at = roundProgress(opts, state.round).to;
        return { kind: 'spread', state, tasks, progress: { from: at, to: at } };
      }
      const { flip, evaluations } = orientRoundHere(mp, opts, control);
      state.evaluations += evaluations;
      ({ current, value } = keepIfHigher(problem, state.roundBlockOf, flip, current, value));
    }
    return finishRound(problem, opts, seed, state, current, value, control);
  }
  if (state.phase === 'orient') {
    const start = Int32Array.from(state.sides);
    const mp = orientationProblem(problem, state.roundBlockOf, membersOf(state.roundBlockOf).length, start);
    const flip = flipsFromSubBlocks(mp, state.mergeBlockOf!, answers, state, (top) => orientRoundHere(top, opts, control));
    const { current, value } = keepIfHigher(problem, state.roundBlockOf, flip, start, crossingWeight(problem, start));
    return finishRound(problem, opts, seed, state, current, value, control);
  }

  let assignment: Int32Array;
  if (state.phase === 'merge') {
    assignment = finishMergeBlocks(problem, opts, state, blockCount, answers, control);
  } else {
    assignment = collectBlocks(problem, state, members, answers);
    if (problem.kind === 'bisection') return finishBisection(problem, opts, state, members, assignment, control);
    state.blocksValue = crossingWeight(problem, assignment);
    if (blockCount > 1) {
      const spread = mergeMaxcut(problem, opts, seed, state, blockCount, assignment, control);
      if (spread) return spread;
    }
  }
  state.mergedValue = crossingWeight(problem, assignment);
  state.merge.gain = state.mergedValue - state.blocksValue;
  control.onStep?.(BLOCKS_SHARE, state.mergedValue);
  return nextRound(problem, opts, seed, state, assignment, control);
}

/** Bisection: block orientations under the global window, whole-block moves, balance repair and polish. */
function finishBisection(problem: Problem, opts: DecomposeOptions, state: BlocksState, members: number[][], assignment: Int32Array, control: DecomposeControl): BlocksStep {
  const { network } = problem;
  const blockCount = members.length;
  const beforeMerge = crossingWeight(problem, assignment);
  let blockFixed = new Uint8Array(blockCount);
  if (blockCount > 1) {
    const couplings = blockCouplings(network, Int32Array.from(state.blockOf), blockCount, assignment);
    const imbalance = new Float64Array(blockCount);
    const fixed = new Uint8Array(blockCount);
    let total = 0;
    for (let i = 0; i < network.n; i++) {
      imbalance[state.blockOf[i]] += assignment[i] === 1 ? network.depotWeight[i] : -network.depotWeight[i];
      total += network.depotWeight[i];
      if (problem.pins[i] >= 0) fixed[state.blockOf[i]] = 1;
    }
    if (fixed.every((f) => f === 0)) fixed[0] = 1; // the global flip changes nothing
    const { flip, method } = orientForBisection(couplings, imbalance, total, balanceWindow(problem), fixed, opts.mergeExactLimit);
    state.merge.method = method;
    for (let i = 0; i < network.n; i++) if (flip[state.blockOf[i]] === 1) assignment[i] ^= 1;
    blockFixed = fixed;
  }
  const unrefinedValue = crossingWeight(problem, assignment);
  const unrefinedFeasible = isBalanced(problem, assignment);
  // The split found few lanes between blocks, so a block kept whole on one side is often
  // cheaper than its own bisection: whole-block pair moves inside the window (decompose.ts).
  if (opts.refine && blockCount > 1) state.refineFlips += wholeBlockMoves(problem, members, blockFixed, assignment, () => control.shouldStop());
  state.mergedValue = crossingWeight(problem, assignment);
  state.merge.gain = beforeMerge - state.mergedValue;
  control.onStep?.(BLOCKS_SHARE, state.mergedValue);
  const free = freeDepots(problem.pins);
  const st = createFlipState(network, assignment);
  if (opts.refine) {
    if (!isBalanced(problem, st.side)) state.refineFlips += repairBalance(problem, st, free);
    state.refineFlips += polishBisection(problem, st, free);
  }
  return { kind: 'done', outcome: outcomeOf(state, Int32Array.from(st.side), unrefinedValue, unrefinedFeasible) };
}

/** Every stage's tasks run here, in order (the solve worker spreads them over the queue instead). */
function runStages(problem: Problem, opts: DecomposeOptions, seed: number, first: BlocksStep, control: DecomposeControl, stateKernels?: LayerBackend): DecomposeOutcome {
  let step = first;
  let iterationBase = 0;
  while (step.kind === 'spread') {
    const { tasks, progress } = step;
    const answers = tasks.map((task, i) => {
      const answer = runBlockTask(task, {
        shouldStop: () => control.shouldStop(), stateKernels,
        onIteration: task.trace ? (p) => control.onIteration?.({ ...p, iteration: iterationBase + p.iteration }) : undefined,
      });
      if (answer.trace && answer.trace.length > 0) iterationBase += answer.trace[answer.trace.length - 1].iteration;
      control.onStep?.(progress.from + ((progress.to - progress.from) * (i + 1)) / tasks.length, undefined);
      return answer;
    });
    step = resumeBlocks(problem, opts, seed, step.state, answers, control);
  }
  return step.outcome;
}

/** The whole method in this process. */
export function decomposeByBlocks(problem: Problem, opts: DecomposeOptions, seed: number, control: DecomposeControl, stateKernels?: LayerBackend): DecomposeOutcome {
  return runStages(problem, opts, seed, planBlocks(problem, opts, seed), control, stateKernels);
}

/**
 * The descent rounds alone, from a given max-cut answer (rqaoa's, solvers/rqaoa.ts): blocks of
 * a fresh split re-solved by QAOA with their surroundings fixed, kept unless the cut falls, on a
 * redrawn split each round, then the 1-flip refinement when `opts.refine`. `unrefinedValue` of
 * the outcome is the cut after the rounds, before that refinement.
 */
export function descendByBlocks(problem: Problem, start: ArrayLike<number>, opts: DecomposeOptions, seed: number, control: DecomposeControl, stateKernels?: LayerBackend): DecomposeOutcome {
  if (problem.kind !== 'maxcut') throw new Error(`the block descent answers max-cut, not ${problem.kind}`);
  const current = Int32Array.from(start);
  const { blockOf, members } = blockMembers(problem.network, opts.blockSize, createRng(seed));
  const value = crossingWeight(problem, current);
  const state: BlocksState = {
    kind: 'maxcut', phase: 'round', round: 0, blockOf: Array.from(blockOf), sides: [], roundBlockOf: [], idleRounds: 0, stillRounds: 0, roundStart: value, blocks: [],
    merge: { method: 'single', blocks: members.length, gain: 0 }, blocksValue: value, mergedValue: value, roundsGain: 0, refineFlips: 0, evaluations: 0, shots: 0, stopped: false, trace: [],
  };
  return runStages(problem, opts, seed, nextRound(problem, opts, seed, state, current, control), control, stateKernels);
}
