import type { Problem } from '../problem/types';
import { bitAt } from './qubo';

/** depot i → qubit (free depots in input order), −1 when pinned; plus the number of free depots. */
export function freeDepotQubits(problem: Problem): { qubitOfDepot: Int32Array; free: number } {
  const qubitOfDepot = new Int32Array(problem.network.n).fill(-1);
  let free = 0;
  for (let i = 0; i < problem.network.n; i++) if (problem.pins[i] < 0) qubitOfDepot[i] = free++;
  return { qubitOfDepot, free };
}

/** Side per depot from a basis index / bit array: bit 1 ⇔ side 1; pinned depots keep their pin. */
export function decodeSides(problem: Problem, qubitOfDepot: Int32Array, state: number | Uint8Array): Int32Array {
  const n = problem.network.n;
  const sides = new Int32Array(n);
  for (let i = 0; i < n; i++) sides[i] = qubitOfDepot[i] < 0 ? problem.pins[i] : bitAt(state, qubitOfDepot[i]);
  return sides;
}

/** Largest weighted degree Σ|w| over the given depots (free ones: only they are flipped). */
export function maxAbsWeightedDegree(problem: Problem, onlyFree: boolean): number {
  const { n, adjStart, adjWeight } = problem.network;
  let best = 0;
  for (let i = 0; i < n; i++) {
    if (onlyFree && problem.pins[i] >= 0) continue;
    let d = 0;
    for (let t = adjStart[i]; t < adjStart[i + 1]; t++) d += Math.abs(adjWeight[t]);
    if (d > best) best = d;
  }
  return best;
}

export function totalAbsLaneWeight(problem: Problem): number {
  let s = 0;
  for (let e = 0; e < problem.network.m; e++) s += Math.abs(problem.network.laneWeight[e]);
  return s;
}

/** Depot-qubit bits of a side assignment (inverse of decodeSides on free depots). */
export function encodeSides(qubitOfDepot: Int32Array, free: number, assignment: ArrayLike<number>): Uint8Array {
  const bits = new Uint8Array(free);
  for (let i = 0; i < qubitOfDepot.length; i++) if (qubitOfDepot[i] >= 0) bits[qubitOfDepot[i]] = assignment[i] ? 1 : 0;
  return bits;
}
