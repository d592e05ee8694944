import { crossingWeight } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createIsingBuilder, pinnedRef } from './builder';
import { decodeSides, encodeSides, freeDepotQubits } from './depots';
import type { Encoding } from './types';

/**
 * Weighted max-cut: H = Σ_lanes (w/2)(s_u s_v − 1) = −cut(s), so the ground state is the
 * maximum cut and cut = −energy. (Equivalently H = ½Σ w s_u s_v − W/2, i.e. cut = (W − H')/2
 * with H' = Σ w s_u s_v.) QAOA's cost C = −H = Σ w(1 − Z_u Z_v)/2 is the cut-value operator.
 * Pinned depots substitute their fixed spin: a lane to a pinned depot becomes a linear term.
 */
export function encodeMaxCut(problem: Problem): Encoding {
  const { qubitOfDepot, free } = freeDepotQubits(problem);
  const ref = (i: number) => (qubitOfDepot[i] >= 0 ? qubitOfDepot[i] : pinnedRef(problem.pins[i]));
  const b = createIsingBuilder(free);
  const cut = createIsingBuilder(free);
  const { m, laneFrom, laneTo, laneWeight } = problem.network;
  for (let e = 0; e < m; e++) {
    b.zz(ref(laneFrom[e]), ref(laneTo[e]), laneWeight[e] / 2);
    b.constant(-laneWeight[e] / 2);
    cut.zz(ref(laneFrom[e]), ref(laneTo[e]), -laneWeight[e] / 2);
    cut.constant(laneWeight[e] / 2);
  }
  return {
    kind: 'maxcut',
    method: 'maxcut',
    numQubits: free,
    operator: b.build(),
    depotQubits: free,
    qubitOfDepot,
    valueOperator: cut.build(),
    encodeAssignment: (a) => encodeSides(qubitOfDepot, free, a),
    decode: (state) => decodeSides(problem, qubitOfDepot, state),
    valueOf: (a) => crossingWeight(problem, a),
    feasible: () => true,
    valueOfEnergy: (energy) => -energy,
    penalties: [],
    rule: `max-cut: energy = −(cut weight); one qubit per free depot (${free}); pinned depots enter as fixed spins.`,
    approximate: false,
  };
}
