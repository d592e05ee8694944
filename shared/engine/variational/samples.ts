import type { Encoding } from '../encodings/types';
import { better } from '../problem/compare';
import { senseOf } from '../problem/types';
import type { Rng } from '../random';
import { sampleBasisStates } from '../statevector/sample';
import type { StateVector } from '../statevector/state';

export interface DecodedSample {
  /** Basis index that was measured. */
  state: number;
  assignment: number[];
  count: number;
  /** Business value (crossingWeight) of the decoded assignment. */
  value: number;
  feasible: boolean;
}

/**
 * Read out `shots` samples, decode each distinct outcome, and pick the best: highest cut for
 * maxcut; lowest crossing among FEASIBLE samples for partitions (when no sample is feasible the
 * best infeasible one is returned and flagged — never hidden).
 */
export function readOut(encoding: Encoding, state: StateVector, shots: number, rng: Rng, top = 10): { samples: DecodedSample[]; best: DecodedSample; feasibleShare: number } {
  const counts = sampleBasisStates(state, shots, rng);
  const decoded: DecodedSample[] = [];
  let feasibleShots = 0;
  for (const [x, count] of counts) {
    const a = Array.from(encoding.decode(x));
    const feasible = encoding.feasible(a);
    if (feasible) feasibleShots += count;
    decoded.push({ state: x, assignment: a, count, value: encoding.valueOf(a), feasible });
  }
  const best = bestSample(encoding.kind, decoded);
  const samples = decoded.slice().sort((a, b) => b.count - a.count || a.state - b.state).slice(0, top);
  return { samples, best, feasibleShare: feasibleShots / Math.max(1, shots) };
}

/** The best of decoded samples by problem/compare.ts (feasible first, then value); of equals the most frequent. */
export function bestSample(kind: Encoding['kind'], decoded: DecodedSample[]): DecodedSample {
  const sense = senseOf(kind);
  let best = decoded[0];
  for (const d of decoded) if (better(sense, d, best) || (!better(sense, best, d) && d.count > best.count)) best = d;
  return best;
}
