import { createFlipState } from '../classical/flip-state';
import { polishBisection, polishMaxcut, repairBalance } from '../classical/local-search';
import { freeDepots } from '../classical/result';
import { encodeBisection } from '../encodings/bisection';
import { encodeMaxCut } from '../encodings/maxcut';
import { crossingWeight, isBalanced } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { level1Coefficients, level1ExpectationOf } from './level1';
import { level1Graph } from './level1-graph';
import { bitsOfSpins, runRqaoa, type RqaoaRound } from './rqaoa';
import { roundLog, type RoundInfo, type RqaoaRoundEntry } from './rqaoa-log';

/**
 * Recursive QAOA on a splitting question (variational/rqaoa.ts on the encoding's operator).
 *
 * Max-cut: the max-cut encoding, any size (pins are fields). Bisection: the penalty encoding
 * (encodings/bisection.ts), whose balance penalty couples every pair of depots, so a round
 * costs O(n³) through the triangles: offered up to RQAOA_BISECTION_LIMIT free depots and
 * refused above. The answer is then checked against the balance rule and reported infeasible
 * when it misses it (unless refinement repairs it).
 *
 * `refine`: classical local search after the variational answer (1-flip for max-cut, flips and
 * swaps inside the window for bisection, with a balance repair first). The unrefined value is
 * always reported beside the refined one, so the comparison with classical solvers stays honest.
 */
export const RQAOA_BISECTION_LIMIT = 80;

export interface RqaoaProblemOptions {
  stopAt: number;
  batchFraction: number;
  refine: boolean;
  hurry?: () => boolean;
  overdue?: () => boolean;
  onRound?: (round: RqaoaRound) => void;
}

export interface RqaoaStep {
  round: number;
  /** Depot id eliminated. */
  depot: string;
  /** Depot id it follows, or null when fixed. */
  follows: string | null;
  /** +1: same side as `follows` (or side 0 when fixed); −1: the other side (or side 1). */
  sign: 1 | -1;
  correlation: number;
}

export interface RqaoaProblemOutcome {
  assignment: Int32Array;
  value: number;
  /** Value before refinement (equal to value when refine is off). */
  unrefinedValue: number;
  unrefinedFeasible: boolean;
  refineMoves: number;
  feasible: boolean;
  /** First round on the whole problem: [γ, β], ⟨H⟩ and the expected business value. */
  params: [number, number];
  energy: number;
  expectation: number;
  rounds: number;
  remainder: number;
  evaluations: number;
  /** Depot eliminations in order (slack qubits of the bisection encoding are left out). */
  steps: RqaoaStep[];
  /** Per round: depots eliminated and the correlations used (rqaoa-log.ts; at most ROUND_LOG_CAP entries). */
  roundLog: RqaoaRoundEntry[];
}

/** Why rqaoa will not take a problem, or null. */
export function rqaoaRefusal(problem: Problem): string | null {
  if (problem.kind === 'kway') return 'rqaoa answers max-cut and balanced bisection; for k regions use qaoa (recursive bisection) or a classical solver';
  if (problem.kind === 'bisection') {
    const free = freeDepots(problem.pins).length;
    if (free > RQAOA_BISECTION_LIMIT) {
      return `rqaoa solves bisection on its penalty encoding, where every pair of depots interacts, up to ${RQAOA_BISECTION_LIMIT} free depots (this network has ${free}); use qaoa-blocks or a classical solver (fm, tabu) for larger bisections`;
    }
  }
  return null;
}

export function rqaoaOnProblem(problem: Problem, opts: RqaoaProblemOptions): RqaoaProblemOutcome {
  const refusal = rqaoaRefusal(problem);
  if (refusal) throw new RangeError(refusal);
  const encoding = problem.kind === 'bisection' ? encodeBisection(problem) : encodeMaxCut(problem);
  const rounds: RoundInfo[] = [];
  const onRound = (r: RqaoaRound) => { rounds.push({ round: r.round, spins: r.spins, gamma: r.gamma, beta: r.beta }); opts.onRound?.(r); };
  const out = runRqaoa(encoding.operator, { stopAt: opts.stopAt, batchFraction: opts.batchFraction, hurry: opts.hurry, overdue: opts.overdue, onRound });
  const raw = encoding.decode(bitsOfSpins(out.spins));
  const unrefinedValue = crossingWeight(problem, raw);
  const unrefinedFeasible = isBalanced(problem, raw);
  let assignment = raw, refineMoves = 0;
  if (opts.refine) {
    const free = freeDepots(problem.pins);
    const st = createFlipState(problem.network, raw);
    if (problem.kind === 'maxcut') refineMoves = polishMaxcut(problem, st, free);
    else {
      if (!isBalanced(problem, st.side)) refineMoves += repairBalance(problem, st, free);
      refineMoves += polishBisection(problem, st, free);
    }
    assignment = Int32Array.from(st.side);
  }
  const g = level1Graph(encoding.operator);
  const [gamma, beta] = out.firstParams;
  const expectation = encoding.numQubits > 0 ? level1ExpectationOf(g, level1Coefficients(g, gamma), beta, encoding.valueOperator) : encoding.valueOperator.offset;
  const depotOfQubit = new Map<number, string>();
  encoding.qubitOfDepot.forEach((q, i) => { if (q >= 0) depotOfQubit.set(q, problem.network.depotIds[i]); });
  const steps: RqaoaStep[] = [];
  for (const e of out.eliminations) {
    const depot = depotOfQubit.get(e.qubit);
    if (depot === undefined) continue; // a slack qubit
    steps.push({ round: e.round, depot, follows: e.partner < 0 ? null : depotOfQubit.get(e.partner) ?? `slack ${e.partner}`, sign: e.sign, correlation: e.correlation });
  }
  return {
    assignment,
    value: crossingWeight(problem, assignment),
    unrefinedValue,
    unrefinedFeasible,
    refineMoves,
    feasible: isBalanced(problem, assignment),
    params: out.firstParams,
    energy: out.firstEnergy,
    expectation,
    rounds: out.rounds,
    remainder: out.remainder,
    evaluations: out.evaluations,
    steps,
    roundLog: roundLog(rounds, steps),
  };
}
