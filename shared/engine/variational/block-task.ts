/**
 * One block solve of `qaoa-blocks` as a self-contained task: the block's sub-problem in plain
 * JSON (lanes, pins, depot weights), the QAOA settings and its own seed. Independent of every
 * other block, so a host may run the tasks of one stage in any order, in any process (the
 * solve worker spreads them over the job queue) and the answer stays the same.
 *
 *   task.lanes: number[]   // 3·lanes, flattened [i, j, w] over the sub-problem's depots 0…n−1
 *   answer.sides: number[] // n, side 0/1 per sub-problem depot
 */
import { compactFromEdges } from '../network/build';
import { encodeBisection } from '../encodings/bisection';
import { encodeMaxCut } from '../encodings/maxcut';
import { randomBalancedSides } from '../classical/balance';
import { crossingWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createRng } from '../random';
import type { LayerBackend } from '../statevector/backend';
import { runQaoa, type VariationalTracePoint } from './qaoa-run';

export interface BlockTask {
  /** Which block of the plan (answers are matched back by it, never by order). */
  block: number;
  kind: 'maxcut' | 'bisection';
  n: number;
  lanes: number[];
  pins: number[];
  /** Bisection only: depot weights and the balance tolerance of the block's own rule. */
  depotWeight?: number[];
  tolerance: number;
  seed: number;
  layers: number;
  shots: number;
  readoutShots: number;
  restarts: number;
  maxIterations: number;
  /** Bisection: widest encoding (depots + slack) still simulated; wider blocks keep their random balanced sides. */
  qubitLimit: number;
  /** Keep the optimiser's trace (first stage) or not (improvement rounds). */
  trace: boolean;
}

export interface BlockAnswer {
  block: number;
  sides: number[];
  qubits: number;
  /** Cut (max-cut) or crossing weight (bisection) inside the sub-problem, from the QAOA read-out. */
  value: number;
  evaluations: number;
  shots: number;
  /** The time limit or a cancel stopped it (the answer is the best found until then). */
  stopped: boolean;
  /** False when the QAOA read-out found no answer and the starting sides were kept. */
  solved: boolean;
  trace?: VariationalTracePoint[];
}

export interface BlockTaskControl {
  shouldStop(): boolean;
  stateKernels?: LayerBackend;
  onIteration?(point: VariationalTracePoint): void;
}

/** A task's sub-problem as an engine Problem. */
export function taskProblem(task: BlockTask): Problem {
  const edges: [number, number, number][] = [];
  for (let e = 0; e + 2 < task.lanes.length; e += 3) edges.push([task.lanes[e], task.lanes[e + 1], task.lanes[e + 2]]);
  const base = compactFromEdges(task.n, edges);
  const network = task.depotWeight ? { ...base, depotWeight: Float64Array.from(task.depotWeight) } : base;
  return { kind: task.kind, k: 2, network, pins: Int32Array.from(task.pins), tolerance: task.tolerance };
}

/** A sub-problem's lanes flattened for a task (compact networks list each lane once). */
export function flatLanes(problem: Problem): number[] {
  const { m, laneFrom, laneTo, laneWeight } = problem.network;
  const out = new Array<number>(3 * m);
  for (let e = 0; e < m; e++) {
    out[3 * e] = laneFrom[e];
    out[3 * e + 1] = laneTo[e];
    out[3 * e + 2] = laneWeight[e];
  }
  return out;
}

const pinnedSides = (problem: Problem) => Array.from(problem.pins, (p) => (p >= 0 ? p : 0));

/** Solve one block by QAOA (max-cut, or bisection under its own balance rule). Pure apart from the clock. */
export function runBlockTask(task: BlockTask, control: BlockTaskControl): BlockAnswer {
  const sub = taskProblem(task);
  const rng = createRng(task.seed);
  const trace: VariationalTracePoint[] = [];
  const answer = (sides: ArrayLike<number>, qubits: number, extra: Partial<BlockAnswer> = {}): BlockAnswer => ({
    block: task.block, sides: Array.from(sides), qubits, value: crossingWeight(sub, sides), evaluations: 0, shots: 0, stopped: false, solved: false,
    ...(task.trace ? { trace } : {}), ...extra,
  });
  const encoding = task.kind === 'bisection'
    ? (task.n >= 2 && !sub.pins.every((p) => p >= 0) ? encodeBisection(sub) : null)
    : encodeMaxCut(sub);
  // A bisection block's fallback is a random balanced split (its own seed), as before any QAOA.
  const start = task.kind === 'bisection' ? Array.from(randomBalancedSides(sub, rng)) : pinnedSides(sub);
  if (!encoding || encoding.numQubits === 0) return answer(start, 0);
  if (task.kind === 'bisection' && encoding.numQubits > task.qubitLimit) return answer(start, encoding.numQubits);
  if (control.shouldStop()) return answer(start, task.kind === 'bisection' ? encoding.numQubits : encoding.numQubits, { stopped: true });
  const out = runQaoa({
    encoding, layers: task.layers, optimizer: task.shots > 0 ? 'spsa' : 'nelder-mead', shots: task.shots, readoutShots: task.readoutShots,
    restarts: task.restarts, maxIterations: task.maxIterations, rng, shouldStop: () => control.shouldStop(),
    stateOptions: control.stateKernels ? { kernels: control.stateKernels } : undefined,
    onIteration: (p) => {
      if (task.trace) trace.push(p);
      control.onIteration?.(p);
    },
  });
  const best = out.best && (task.kind === 'maxcut' || out.best.feasible) ? out.best.assignment : null;
  return answer(best ?? start, encoding.numQubits, { evaluations: out.evaluations, shots: out.shotsUsed, stopped: out.stopped, solved: best !== null });
}
