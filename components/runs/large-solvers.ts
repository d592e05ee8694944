/**
 * What the app says about the variational solvers made for networks beyond the statevector
 * limit (rqaoa, qaoa-blocks), as pure functions: when run setup proposes them, how their answers
 * compare with the classical heuristic, the bound and the best known answer (with and without
 * classical refinement), and the figures of RQAOA's rounds and of the blocks.
 */
import { bestOf, better, gapOfKind, senseOf } from '../../shared/engine/problem/compare';
import type { RqaoaRoundEntry } from '../../shared/engine/variational/rqaoa-log';
import { VARIATIONAL_MAX_QUBITS } from '../../shared/runs/default-solvers';
import type { BestKnownView, JobView, ProblemInput } from '../../shared/schemas/runs';
import { gapToBound } from './scorecard';

/** The solvers proposed above the statevector limit (shared/runs/default-solvers.ts picks them). */
export const LARGE_SOLVERS = ['rqaoa', 'qaoa-blocks'] as const;
export const isLargeSolver = (name: string) => (LARGE_SOLVERS as readonly string[]).includes(name);

export interface LargeProposal {
  /** Qubits QAOA/VQE would simulate on the whole network. */
  needed: number;
  /** The statevector limit, or the plan's included qubits when lower. */
  limit: number;
  /** Large-network solvers among the defaults, in order. */
  proposed: string[];
}

/**
 * Run setup's proposal: when the direct circuit (qaoa's answer for this question) is wider than the
 * limit, the defaults hold the large-network solvers instead; null when the direct circuits fit.
 */
export function largeProposal(answers: readonly { name: string; qubits: number }[] | undefined, defaults: readonly string[] | undefined, planQubits?: number): LargeProposal | null {
  const direct = answers?.find((a) => a.name === 'qaoa');
  const limit = Math.min(VARIATIONAL_MAX_QUBITS, planQubits ?? Infinity);
  if (!direct || direct.qubits <= limit) return null;
  return { needed: direct.qubits, limit, proposed: (defaults ?? []).filter(isLargeSolver) };
}

export type RefinementWord = 'changed' | 'unchanged' | 'off' | 'none';

export interface LargeRow {
  jobId: number;
  solver: string;
  label: string;
  /** 'variational' rows are the large-network solvers; 'classical' the heuristics beside them. */
  role: 'variational' | 'classical';
  value: number | null;
  /** Value before classical refinement (variational rows), else null. */
  unrefined: number | null;
  unrefinedBalanced: boolean;
  refinement: RefinementWord;
  gapToBestKnown: number | null;
  gapToBound: number | null;
  seconds: number | null;
}

export interface LargeComparison {
  rows: LargeRow[];
  bestKnown: BestKnownView | null;
  bound: number | null;
}

/**
 * The large-network comparison of a run: each rqaoa / qaoa-blocks job and each classical heuristic
 * job, with the value, the value before refinement, whether refinement changed it, and the gaps to
 * the best known answer and the bound (problem/compare.ts gap). Null when the run has no
 * large-network solver.
 */
export function largeComparison(run: { id: number; problem: Pick<ProblemInput, 'kind'>; jobs: readonly Pick<JobView, 'id' | 'solver' | 'family' | 'status' | 'result'>[]; bestKnown?: BestKnownView | null }, bound: number | null, labels: Record<string, string> = {}): LargeComparison | null {
  if (!run.jobs.some((j) => isLargeSolver(j.solver))) return null;
  const kind = run.problem.kind;
  const bestKnown = withOwnAnswers(run);
  const rows = run.jobs
    .filter((j) => isLargeSolver(j.solver) || j.family === 'heuristic')
    .map((j): LargeRow => {
      const r = j.status === 'succeeded' ? j.result : null;
      const ref = r?.refinement;
      const refinement: RefinementWord = !isLargeSolver(j.solver) || !r ? 'none' : !ref || !ref.applied ? 'off' : ref.unrefinedValue !== r.value || ref.unrefinedInfeasible !== !!r.infeasible ? 'changed' : 'unchanged';
      const balanced = !r?.infeasible;
      return {
        jobId: j.id,
        solver: j.solver,
        label: labels[j.solver] ?? j.solver,
        role: isLargeSolver(j.solver) ? 'variational' : 'classical',
        value: r ? r.value : null,
        unrefined: r && isLargeSolver(j.solver) ? (ref ? ref.unrefinedValue : r.value) : null,
        unrefinedBalanced: ref ? !ref.unrefinedInfeasible : balanced,
        refinement,
        gapToBestKnown: r && balanced && bestKnown ? gapOfKind(kind, r.value, bestKnown.value) : null,
        gapToBound: r && balanced ? gapToBound(kind, r.value, bound) : null,
        seconds: r ? r.seconds : null,
      };
    });
  return { rows, bestKnown, bound };
}

/**
 * The server's best known answer (read with the run) joined with this run's own balanced answers,
 * which may have arrived since (the live screen patches jobs in without reading the run again):
 * the better by problem/compare.ts, the server's on a tie (it may be proven optimal or older).
 */
export function withOwnAnswers(run: { id: number; problem: Pick<ProblemInput, 'kind'>; jobs: readonly Pick<JobView, 'solver' | 'status' | 'result'>[]; bestKnown?: BestKnownView | null }): BestKnownView | null {
  const sense = senseOf(run.problem.kind);
  const own = bestOf(sense, run.jobs.filter((j) => j.status === 'succeeded' && j.result && !j.result.infeasible), (j) => ({ value: j.result!.value, feasible: true }));
  const server = run.bestKnown ?? null;
  if (!own) return server;
  const mine = { value: own.result!.value, runId: run.id, solver: own.solver, provenOptimal: own.result!.provenOptimal, runsCompared: Math.max(1, server?.runsCompared ?? 1) };
  if (!server) return mine;
  return better(sense, { value: mine.value, feasible: true }, { value: server.value, feasible: true }) ? mine : server;
}

/** "Round 3", "Rounds 10–14", "Before round 1" for one log entry. */
export function roundName(e: Pick<RqaoaRoundEntry, 'from' | 'to'>): string {
  if (e.from === 0 && e.to === 0) return 'Before round 1';
  return e.from === e.to ? `Round ${e.from}` : `Rounds ${e.from}–${e.to}`;
}

/** "0.912" or "0.912–0.640": the |correlation| range a round imposed. */
export function correlationRange(e: Pick<RqaoaRoundEntry, 'strongest' | 'weakest' | 'eliminated'>): string {
  if (e.eliminated === 0) return '—';
  return e.strongest - e.weakest < 5e-4 ? e.strongest.toFixed(3) : `${e.strongest.toFixed(3)}–${e.weakest.toFixed(3)}`;
}

/** Blocks per size, largest size first: [{ size: 14, blocks: 40 }, …]. */
export function blockSizeCounts(sizes: readonly number[]): { size: number; blocks: number }[] {
  const count = new Map<number, number>();
  for (const s of sizes) count.set(s, (count.get(s) ?? 0) + 1);
  return [...count].map(([size, blocks]) => ({ size, blocks })).sort((a, b) => b.size - a.size);
}

/**
 * A colour index (0…palette−1) per block such that blocks joined by a lane differ where the
 * palette allows: greedy colouring in order of decreasing block degree (Welsh & Powell 1967);
 * when every colour is taken around a block, the one least used there. `ends` are lane endpoints
 * as depot indices.
 */
export function blockColours(blockOf: readonly number[], ends: readonly (readonly [number, number])[], palette: number): number[] {
  const blocks = blockOf.reduce((m, b) => Math.max(m, b + 1), 0);
  const near: Set<number>[] = Array.from({ length: blocks }, () => new Set());
  for (const [a, b] of ends) {
    const x = blockOf[a], y = blockOf[b];
    if (x === undefined || y === undefined || x === y) continue;
    near[x].add(y);
    near[y].add(x);
  }
  const colour = new Array<number>(blocks).fill(-1);
  const order = Array.from({ length: blocks }, (_, i) => i).sort((a, b) => near[b].size - near[a].size || a - b);
  for (const b of order) {
    const used = new Array<number>(palette).fill(0);
    for (const n of near[b]) if (colour[n] >= 0) used[colour[n]]++;
    let pick = used.indexOf(0);
    if (pick < 0) pick = used.indexOf(Math.min(...used));
    colour[b] = pick;
  }
  return colour;
}
