/**
 * The classical solvers (exact, bound and heuristic families) as SolverDefinitions, plus
 * `computeBounds` (attached by the orchestrator to every run) and the `best` entry point.
 * Pure engine code: worker threads are reached only through loadPool (loaded on first use)
 * when a solver is asked to use more than one thread.
 */
import type { Problem, ProblemKind } from '../problem/types';
import { crossingWeight, isBalanced, maxPartWeight } from '../problem/evaluate';
import { createRng, type Rng } from '../random';
import type { SolveContext, SolveResult, SolverDefinition } from './types';
import { parseNumberSettings, type NumberSchema } from '../classical/settings';
import { classicalResult, freeDepots, integerLanes } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { balanceWindow, randomBalancedSides, randomSides } from '../classical/balance';
import { createFlipState } from '../classical/flip-state';
import { greedyMaxcut, polishBisection, polishMaxcut } from '../classical/local-search';
import { betterExact, createChunkWalk, emptyExact, enumeratedDepots, planExact, type ExactBest } from '../classical/exact';
import { exactKway, kwaySearchSize } from '../classical/exact-kway';
import { tabuMaxcut, tabuMaxcutDefaults } from '../classical/tabu-maxcut';
import { tabuBisection, tabuBisectionDefaults } from '../classical/tabu-bisection';
import { anneal, annealDefaults } from '../classical/anneal';
import { goemansWilliamson, gwDefaults } from '../classical/goemans-williamson';
import { multilevelBisect, type PartGraph } from '../classical/fm-bisection';
import { kwayPartition, kwayDefaults } from '../classical/kway';
import { loadPool } from '../classical/threads/load-pool';
import { certifiedShiftBound, computeBounds as computeClassicalBounds, type BoundOptions, type BoundReport } from '../classical/bounds';

export { SettingsError } from '../classical/settings';
export type { BoundOptions, BoundReport } from '../classical/bounds';

/** Proven bound for a problem (see classical/bounds.ts for the sources). */
export function computeBounds(problem: Problem, opts: BoundOptions = {}): BoundReport {
  return computeClassicalBounds(problem, { denseLimit: 1500, ...opts });
}

const kindWords: Record<ProblemKind, string> = { maxcut: 'max-cut', bisection: 'balanced bisection', kway: 'k-way regions' };

function kindRefusal(name: string, kinds: ProblemKind[], problem: Problem, suggestion: string): string | null {
  if (kinds.includes(problem.kind)) return null;
  return `${name} handles ${kinds.map((k) => kindWords[k]).join(' and ')}, not ${kindWords[problem.kind]}; use ${suggestion}`;
}

const threadsField = { default: 1, min: 1, max: 8, integer: true };

/** Run `copies` of a solver in worker threads with forked seeds (null answers dropped). */
async function workerCopies(name: string, problem: Problem, settings: unknown, ctx: SolveContext, copies: number, rng: Rng): Promise<SolveResult[]> {
  if (copies <= 0) return [];
  const { runInWorker } = loadPool();
  const runs = Array.from({ length: copies }, () =>
    runInWorker(
      { task: 'solve', solver: name, problem, settings, seed: rng.fork().int(2 ** 31), timeLimitSeconds: ctx.timeLimitSeconds },
      { cancel: ctx.cancel, killAfterSeconds: ctx.timeLimitSeconds + 30 },
    ).catch(() => null),
  );
  return (await Promise.all(runs)).filter((r): r is SolveResult => r !== null);
}

function pickBest(problem: Problem, results: SolveResult[]): SolveResult {
  const maximise = problem.kind === 'maxcut';
  let best = results[0];
  for (const r of results.slice(1)) {
    if (r.infeasible && !best.infeasible) continue;
    if ((best.infeasible && !r.infeasible) || (maximise ? r.value > best.value : r.value < best.value)) best = r;
  }
  return best;
}

/** A starting assignment that respects pins (and the balance window for two-sided min). */
function startSides(problem: Problem, rng: Rng): Int8Array {
  return problem.kind === 'maxcut' ? randomSides(problem, rng) : randomBalancedSides(problem, rng);
}

// ---------------------------------------------------------------- exact

const exactSchema = {
  maxDepots: { default: 32, min: 1, max: 36, integer: true },
  maxKwayStates: { default: 1e7, min: 1, max: 1e8 },
  threads: { ...threadsField, default: 2 },
} satisfies NumberSchema;
type ExactSettings = ReturnType<typeof parseExact>;
const parseExact = (input: unknown) => parseNumberSettings(input, exactSchema);

export const exactSolver: SolverDefinition<ExactSettings> = {
  name: 'exact',
  label: 'Exact enumeration',
  family: 'exact',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'Visits every assignment (Gray-code order, one depot fixed by symmetry), so the answer is optimal when it finishes within the time limit.',
  parseSettings: parseExact,
  refuses(problem, s) {
    if (problem.kind === 'kway') {
      const size = kwaySearchSize(problem);
      return size > s.maxKwayStates
        ? `exact k-way search is limited to ${s.maxKwayStates.toExponential(0)} assignments (this question has about ${size.toExponential(1)}); use milp for a proven optimum or fm for a fast answer`
        : null;
    }
    const f = enumeratedDepots(problem);
    return f > s.maxDepots
      ? `exact enumeration is limited to ${s.maxDepots} free depots (2^${s.maxDepots} states); this question has ${f}. Use milp for a proven optimum or tabu for a fast answer`
      : null;
  },
  async solve(problem, s, ctx) {
    const control = createRunControl(ctx);
    if (problem.kind === 'kway') {
      const r = exactKway(problem, () => control.shouldStop());
      const assignment = r.assignment ?? fallbackAssignment(problem);
      return classicalResult(problem, {
        assignment,
        bound: r.complete && r.assignment ? r.value : null,
        provenOptimal: r.complete && r.assignment !== null,
        seconds: control.elapsed(),
        evaluations: r.nodes,
        notes: r.assignment ? (r.complete ? [] : ['time limit reached before the search finished: best found so far, not proven']) : ['no assignment meets the balance rule with these pins'],
      });
    }
    const f = enumeratedDepots(problem);
    const threads = f >= 22 ? s.threads : 1;
    const plan = planExact(problem, threads > 1 ? threads * 4 : 1);
    const chunks = 2 ** plan.splitBits;
    let best: ExactBest = emptyExact(problem);
    let threaded = threads > 1 && chunks > 1;
    if (threaded) {
      try {
        best = await exactInWorkers(problem, plan, chunks, threads, ctx);
      } catch {
        threaded = false; // no worker threads here (or one failed): walk on this thread instead
        best = emptyExact(problem);
      }
    }
    if (!threaded) {
      outer: for (let c = 0; c < chunks; c++) {
        const walk = createChunkWalk(problem, plan, c);
        while (!walk.run(16)) {
          const sofar = problem.kind === 'maxcut' ? Math.max(best.value, walk.bestValue()) : Math.min(best.value, walk.bestValue());
          if (await control.tick(Number.isFinite(sofar) ? sofar : undefined)) {
            best = betterExact(problem, best, { ...walk.result(), complete: false });
            break outer;
          }
        }
        best = betterExact(problem, best, walk.result());
      }
    }
    const found = best.assignment !== null;
    return classicalResult(problem, {
      assignment: found ? best.assignment! : fallbackAssignment(problem),
      bound: best.complete && found ? best.value : null,
      provenOptimal: best.complete && found,
      seconds: control.elapsed(),
      evaluations: best.states,
      notes: !found
        ? [best.complete ? 'no assignment meets the balance rule with these pins' : 'stopped before a feasible state was found']
        : best.complete ? [] : ['stopped before every state was seen: best found so far, not proven'],
    });
  },
};

async function exactInWorkers(problem: Problem, plan: ReturnType<typeof planExact>, chunks: number, threads: number, ctx: SolveContext): Promise<ExactBest> {
  const { runInWorker } = loadPool();
  const deadlineMs = Date.now() + ctx.timeLimitSeconds * 1000;
  const jobs = Array.from({ length: threads }, (_, t) => {
    const mine: number[] = [];
    for (let c = t; c < chunks; c += threads) mine.push(c);
    return runInWorker({ task: 'exact', problem, plan, chunks: mine, deadlineMs }, { cancel: ctx.cancel, killAfterSeconds: ctx.timeLimitSeconds + 30 });
  });
  let best = emptyExact(problem);
  for (const a of await Promise.all(jobs)) best = betterExact(problem, best, a ?? { ...emptyExact(problem), complete: false });
  return best;
}

function fallbackAssignment(problem: Problem): number[] {
  return Array.from(problem.pins, (p) => (p >= 0 ? p : 0));
}

// ---------------------------------------------------------------- milp

const milpSchema = {
  maxDepots: { default: 2000, min: 1, max: 20000, integer: true },
  maxLanes: { default: 20000, min: 1, max: 200000, integer: true },
} satisfies NumberSchema;
type MilpSettings = ReturnType<typeof parseMilp>;
const parseMilp = (input: unknown) => parseNumberSettings(input, milpSchema);

/** Quick heuristic answer used as a MIP start and as the fallback answer. */
function quickStart(problem: Problem, rng: Rng): Int8Array {
  const free = freeDepots(problem.pins);
  if (problem.kind === 'maxcut') {
    const st = createFlipState(problem.network, greedyMaxcut(problem));
    polishMaxcut(problem, st, free);
    return st.side;
  }
  const g = partGraph(problem);
  if (problem.kind === 'bisection') return multilevelBisect(g, balanceWindow(problem), rng);
  return kwayPartition(g, problem.pins, problem.k, maxPartWeight(problem), rng);
}

export const milpSolver: SolverDefinition<MilpSettings> = {
  name: 'milp',
  label: 'Mixed-integer program (HiGHS)',
  family: 'exact',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'Branch-and-cut (HiGHS): optimal when it finishes, otherwise the best answer found with a proven dual bound and gap.',
  parseSettings: parseMilp,
  refuses(problem, s) {
    const { n, m } = problem.network;
    if (n > s.maxDepots || m > s.maxLanes) {
      return `the MILP is limited to ${s.maxDepots} depots and ${s.maxLanes} lanes (this network has ${n} and ${m}); use tabu (max-cut) or fm (partitioning) instead`;
    }
    return null;
  },
  async solve(problem, _s, ctx) {
    const control = createRunControl(ctx);
    const rng = createRng(ctx.seed);
    let start = quickStart(problem, rng);
    if (problem.kind === 'maxcut' && problem.network.n > 0) {
      // A short tabu run gives HiGHS a strong incumbent, so its search prunes from the start.
      const short = createRunControl(ctx, Math.min(1, 0.05 * ctx.timeLimitSeconds));
      start = (await tabuMaxcut(problem, start, tabuMaxcutDefaults, rng, short)).side;
    }
    const { runInWorker } = loadPool();
    const remaining = Math.max(0.1, ctx.timeLimitSeconds - control.elapsed());
    const ticker = setInterval(() => ctx.onProgress?.({ fraction: control.fraction() }), 250);
    let run;
    try {
      run = await runInWorker(
        { task: 'milp', problem, timeLimitSeconds: remaining, seed: ctx.seed, start: Array.from(start) },
        { cancel: ctx.cancel, killAfterSeconds: remaining + 30 },
      );
    } finally {
      clearInterval(ticker);
    }
    const notes: string[] = [];
    let assignment: ArrayLike<number> = start;
    let bound: number | null = null;
    let proven = false;
    if (run) {
      notes.push(`HiGHS status: ${run.status}${run.nodes !== null ? `, ${run.nodes} nodes` : ''}`);
      if (run.assignment) {
        const better = problem.kind === 'maxcut'
          ? crossingWeight(problem, run.assignment) >= crossingWeight(problem, start)
          : isBalanced(problem, run.assignment) && crossingWeight(problem, run.assignment) <= crossingWeight(problem, start);
        if (better || !isBalanced(problem, start)) assignment = run.assignment;
      }
      if (run.dualBound !== null) {
        bound = run.dualBound;
        if (integerLanes(problem)) bound = problem.kind === 'maxcut' ? Math.floor(bound + 1e-6) : Math.ceil(bound - 1e-6);
      }
      proven = run.status === 'optimal';
      if (proven && bound !== null) {
        // HiGHS proved optimality of its incumbent: the bound is that value.
        const v = crossingWeight(problem, assignment);
        bound = problem.kind === 'maxcut' ? Math.max(v, Math.min(bound, v)) : Math.min(v, Math.max(bound, v));
      }
    } else notes.push('MILP stopped (cancelled); answer from the starting heuristic');
    return classicalResult(problem, { assignment, bound, provenOptimal: proven, seconds: control.elapsed(), evaluations: run?.nodes ?? 0, notes });
  },
};

// ---------------------------------------------------------------- greedy

const greedySchema = {} satisfies NumberSchema;
export const greedySolver: SolverDefinition<Record<string, number>> = {
  name: 'greedy',
  label: 'Greedy + local search',
  family: 'heuristic',
  kinds: ['maxcut', 'bisection'],
  guarantee: 'No optimality guarantee: a greedy construction followed by 1-flip (and, for bisection, swap) local search to a local optimum.',
  parseSettings: (input) => parseNumberSettings(input, greedySchema),
  refuses: (problem) => kindRefusal('greedy', ['maxcut', 'bisection'], problem, 'fm for k-way regions'),
  async solve(problem, _s, ctx) {
    const control = createRunControl(ctx);
    const free = freeDepots(problem.pins);
    if (problem.kind === 'maxcut') {
      const st = createFlipState(problem.network, greedyMaxcut(problem));
      const flips = polishMaxcut(problem, st, free);
      return classicalResult(problem, { assignment: st.side, seconds: control.elapsed(), evaluations: flips + problem.network.n });
    }
    const st = createFlipState(problem.network, greedyBisection(problem));
    const moves = polishBisection(problem, st, free);
    return classicalResult(problem, { assignment: st.side, seconds: control.elapsed(), evaluations: moves + problem.network.n });
  },
};

/**
 * Greedy bisection: grow side 1 from the pins (or the first free depot) by the strongest
 * pull until it reaches the middle of the balance window.
 */
function greedyBisection(problem: Problem): Int8Array {
  const g = partGraph(problem);
  const rng = createRng(1);
  const side = multilevelBisect(g, balanceWindow(problem), rng, { coarsestSize: Math.max(2, g.n), initialTries: 1, maxPasses: 0, stall: 0 });
  return side;
}

// ---------------------------------------------------------------- tabu

const tabuSchema = {
  threads: threadsField,
  tenureMin: { default: tabuMaxcutDefaults.tenureMin, min: 1, max: 1000, integer: true },
  tenureShare: { default: tabuMaxcutDefaults.tenureShare, min: 0, max: 0.5 },
  jumpShare: { default: tabuMaxcutDefaults.jumpShare, min: 0, max: 0.5 },
  strongJumpShare: { default: tabuMaxcutDefaults.strongJumpShare, min: 0, max: 1 },
  stagnation: { default: tabuMaxcutDefaults.stagnation, min: 1, max: 1e6, integer: true },
  directedFloor: { default: tabuMaxcutDefaults.directedFloor, min: 0, max: 1 },
  recencyShare: { default: tabuMaxcutDefaults.recencyShare, min: 0, max: 1 },
  epochMoves: { default: tabuMaxcutDefaults.epochMoves, min: 0, max: 1e6 },
  walkTenureMin: { default: tabuMaxcutDefaults.walkTenureMin, min: 1, max: 1000, integer: true },
  walkStagnation: { default: tabuMaxcutDefaults.walkStagnation, min: 1, max: 1e6 },
  /** Stop early once this value is reached (0 = never; for max-cut benchmarks). */
  target: { default: 0, min: -1e15, max: 1e15 },
} satisfies NumberSchema;
type TabuSettings = ReturnType<typeof parseTabu>;
const parseTabu = (input: unknown) => parseNumberSettings(input, tabuSchema);

export const tabuSolver: SolverDefinition<TabuSettings> = {
  name: 'tabu',
  label: 'Tabu search (breakout local search)',
  family: 'heuristic',
  kinds: ['maxcut', 'bisection'],
  guarantee: 'No optimality guarantee: breakout-style tabu search (Benlic & Hao 2013) for max-cut, swap-based tabu search for bisection; best found within the time limit.',
  parseSettings: parseTabu,
  refuses: (problem) => kindRefusal('tabu', ['maxcut', 'bisection'], problem, 'fm (recursive bisection) or milp for k-way regions'),
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const extra = workerCopies('tabu', problem, { ...s, threads: 1 }, ctx, s.threads - 1, rng);
    const control = createRunControl(ctx);
    const start = startSides(problem, rng);
    let side: Int8Array, moves: number, bestAt: number;
    if (problem.kind === 'maxcut') {
      const r = await tabuMaxcut(problem, start, { ...tabuMaxcutDefaults, ...s }, rng, control, s.target !== 0 ? s.target : Infinity);
      ({ side, moves, bestAt } = r);
    } else {
      const r = await tabuBisection(problem, start, { ...tabuBisectionDefaults, tenureMin: s.tenureMin }, rng, control);
      ({ side, moves, bestAt } = r);
    }
    const mine = classicalResult(problem, { assignment: side, seconds: control.elapsed(), evaluations: moves, notes: [`best found after ${bestAt.toFixed(2)} s`] });
    return pickBest(problem, [mine, ...(await extra)]);
  },
};

// ---------------------------------------------------------------- anneal

const annealSchema = {
  sweeps: { default: annealDefaults.sweeps, min: 1, max: 1e7, integer: true },
  acceptStart: { default: annealDefaults.acceptStart, min: 1e-6, max: 0.999 },
  acceptEnd: { default: annealDefaults.acceptEnd, min: 1e-9, max: 0.999 },
} satisfies NumberSchema;
type AnnealSettings = ReturnType<typeof parseAnneal>;
const parseAnneal = (input: unknown) => parseNumberSettings(input, annealSchema);

export const annealSolver: SolverDefinition<AnnealSettings> = {
  name: 'anneal',
  label: 'Simulated annealing',
  family: 'heuristic',
  kinds: ['maxcut', 'bisection'],
  guarantee: 'No optimality guarantee: simulated annealing with a calibrated geometric schedule, restarted from the best state while time remains.',
  parseSettings: parseAnneal,
  refuses: (problem) => kindRefusal('anneal', ['maxcut', 'bisection'], problem, 'fm (recursive bisection) or milp for k-way regions'),
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const control = createRunControl(ctx);
    const r = await anneal(problem, startSides(problem, rng), s, rng, control);
    return classicalResult(problem, { assignment: r.side, seconds: control.elapsed(), evaluations: r.moves });
  },
};

// ---------------------------------------------------------------- gw

const gwSchema = {
  rank: { default: gwDefaults.rank, min: 0, max: 1000, integer: true },
  maxSweeps: { default: gwDefaults.maxSweeps, min: 1, max: 1e6, integer: true },
  hyperplanes: { default: gwDefaults.hyperplanes, min: 1, max: 1e6, integer: true },
  tolerance: { default: gwDefaults.tolerance, min: 0, max: 1 },
} satisfies NumberSchema;
type GwSettings = ReturnType<typeof parseGw>;
const parseGw = (input: unknown) => parseNumberSettings(input, gwSchema);

export const gwSolver: SolverDefinition<GwSettings> = {
  name: 'gw',
  label: 'Goemans–Williamson (low-rank SDP + hyperplane rounding)',
  family: 'heuristic',
  kinds: ['maxcut'],
  guarantee: 'For non-negative lanes the random-hyperplane cut has expected value ≥ 0.878 × the SDP value of the vectors found (Goemans & Williamson 1995); the SDP value itself is an estimate, and the upper bound reported is the dual candidate from the vectors, certified by Cholesky (n ≤ 1500).',
  parseSettings: parseGw,
  refuses: (problem) => kindRefusal('gw', ['maxcut'], problem, 'fm, tabu or milp for partitioning'),
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const control = createRunControl(ctx);
    const r = await goemansWilliamson(problem, s, rng, control);
    // The vectors' dual candidate becomes a proven bound once Cholesky certifies it.
    const certified = control.shouldStop() ? null : certifiedShiftBound(problem, r.dualShift, 1500, ctx.seed);
    const bound = certified === null ? null : integerLanes(problem) ? Math.floor(certified + 1e-9) : certified;
    return classicalResult(problem, {
      assignment: r.side,
      bound,
      seconds: control.elapsed(),
      evaluations: r.sweeps * problem.network.m + r.rounds,
      notes: [
        `SDP estimate (Burer–Monteiro, not a bound): ${r.sdpEstimate.toFixed(3)}`,
        `expected hyperplane cut of the vectors: ${r.expectedCut.toFixed(3)}`,
        bound === null ? 'SDP dual not certified (stopped, or n above 1500)' : 'bound: SDP dual candidate from the vectors, certified by Cholesky',
        `${r.sweeps} ascent sweeps, ${r.rounds} hyperplanes`,
      ],
    });
  },
};

// ---------------------------------------------------------------- fm (bisection, k-way)

/** The network as a partitioning graph with two-sided or region pins. */
export function partGraph(problem: Problem): PartGraph {
  const net = problem.network;
  const pin = new Int8Array(net.n);
  for (let i = 0; i < net.n; i++) pin[i] = problem.pins[i];
  return { n: net.n, adjStart: net.adjStart, adjIndex: net.adjIndex, adjWeight: net.adjWeight, vw: net.depotWeight, pin };
}

const fmSchema = {
  coarsestSize: { default: 80, min: 2, max: 100000, integer: true },
  initialTries: { default: 8, min: 1, max: 1000, integer: true },
  maxPasses: { default: 8, min: 1, max: 1000, integer: true },
  stall: { default: 200, min: 1, max: 1e6, integer: true },
  /** Most V-cycles to run (they repeat with new seeds while time remains). */
  cycles: { default: 1000, min: 1, max: 1e6, integer: true },
} satisfies NumberSchema;
type FmSettings = ReturnType<typeof parseFm>;
const parseFm = (input: unknown) => parseNumberSettings(input, fmSchema);

export const fmSolver: SolverDefinition<FmSettings> = {
  name: 'fm',
  label: 'Multilevel Fiduccia–Mattheyses (bisection; k-way by recursive bisection)',
  family: 'heuristic',
  kinds: ['bisection', 'kway'],
  guarantee: 'No optimality guarantee: multilevel heavy-edge coarsening with FM refinement, repeated with new seeds while time remains; every answer meets the balance rule whenever the refinement can reach it.',
  parseSettings: parseFm,
  refuses: (problem) => kindRefusal('fm', ['bisection', 'kway'], problem, 'tabu, gw or milp for max-cut'),
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const control = createRunControl(ctx);
    const g = partGraph(problem);
    const win = balanceWindow(problem);
    const limit = maxPartWeight(problem);
    let best: number[] | null = null;
    let bestValue = Infinity, bestFeasible = false;
    let cycles = 0;
    while (cycles < s.cycles) {
      // Bisection: fresh V-cycles alternate with iterated ones from the best split so far.
      const iterate: boolean = problem.kind === 'bisection' && best !== null && bestFeasible && cycles % 2 === 1;
      const side: Int8Array = problem.kind === 'bisection'
        ? multilevelBisect(g, win, rng, s, iterate ? Int8Array.from(best!) : null)
        : kwayPartition(g, problem.pins, problem.k, limit, rng, { ...kwayDefaults, ...s });
      cycles++;
      const a: number[] = Array.from(side);
      const v = crossingWeight(problem, a);
      const ok = isBalanced(problem, a);
      if (best === null || (ok && !bestFeasible) || (ok === bestFeasible && v < bestValue)) {
        best = a;
        bestValue = v;
        bestFeasible = ok;
      }
      if (await control.tick(bestValue, cycles)) break;
      if (control.shouldStop()) break;
    }
    return classicalResult(problem, { assignment: best!, seconds: control.elapsed(), evaluations: cycles, notes: [`${cycles} multilevel cycles`] });
  },
};

// ---------------------------------------------------------------- best

const bestSchema = {
  threads: { ...threadsField, default: 2 },
  /** Use exact enumeration up to this many free depots. */
  exactDepots: { default: 28, min: 0, max: 34, integer: true },
  /** Run the MILP beside the heuristic up to this many depots … */
  milpDepots: { default: 150, min: 0, max: 5000, integer: true },
  /** … and this average degree. */
  milpDegree: { default: 6, min: 0, max: 1000 },
  /** Share of the time limit kept for the bound computation at the end. */
  boundShare: { default: 0.1, min: 0, max: 0.9 },
} satisfies NumberSchema;
type BestSettings = ReturnType<typeof parseBest>;
const parseBest = (input: unknown) => parseNumberSettings(input, bestSchema);

export const bestSolver: SolverDefinition<BestSettings> = {
  name: 'best',
  label: 'Best classical (portfolio)',
  family: 'exact',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'Runs the strongest applicable solvers within the time limit (exact enumeration when small; else tabu or multilevel FM beside the MILP) and reports the best answer with the tightest proven bound; optimal when the bound meets the value.',
  parseSettings: parseBest,
  refuses: () => null,
  async solve(problem, s, ctx) {
    const control = createRunControl(ctx);
    const rng = createRng(ctx.seed);
    const { n, m } = problem.network;
    const notes: string[] = [];
    const results: SolveResult[] = [];
    let milpBound: number | null = null;
    const exactSettings = exactSolver.parseSettings({ threads: s.threads, maxDepots: s.exactDepots });
    // Enumeration only when it should finish in half the time (≈ 3·10⁷ states/s per thread
    // measured on this kind of machine under load, see docs/benchmarks.md).
    const exactFits = problem.kind === 'kway'
      ? exactSolver.refuses(problem, exactSettings) === null
      : enumeratedDepots(problem) <= s.exactDepots && 2 ** enumeratedDepots(problem) / (3e7 * s.threads) <= 0.5 * ctx.timeLimitSeconds;
    const sub = (fraction: number): SolveContext => ({ ...ctx, seed: rng.fork().int(2 ** 31), timeLimitSeconds: Math.max(0.05, ctx.timeLimitSeconds * fraction - control.elapsed()) });
    if (exactFits) {
      const r = await exactSolver.solve(problem, exactSettings, sub(1));
      results.push(r);
      notes.push(`exact enumeration${r.provenOptimal ? ' proved the optimum' : ' stopped early'}`);
    }
    if (results.length === 0 || !results[0].provenOptimal) {
      const work = 1 - s.boundShare;
      const useMilp = n <= s.milpDepots && (n === 0 || (2 * m) / n <= s.milpDegree);
      const tasks: Array<Promise<SolveResult | null>> = [];
      if (useMilp) tasks.push(milpSolver.solve(problem, milpSolver.parseSettings({}), sub(work)).catch(() => null));
      const heuristic = problem.kind === 'maxcut' ? tabuSolver : fmSolver;
      const hSettings = heuristic.parseSettings(problem.kind === 'maxcut' ? { threads: useMilp ? 1 : s.threads } : {});
      // The second core: the MILP worker when it runs, else a worker copy of the heuristic.
      // Bisection: tabu in the worker (it wins on dense random networks, FM on sparse ones).
      if (!useMilp && s.threads > 1 && problem.kind !== 'maxcut') {
        const other = problem.kind === 'bisection' ? 'tabu' : heuristic.name;
        const otherSettings = problem.kind === 'bisection' ? tabuSolver.parseSettings({}) : hSettings;
        tasks.push(workerCopies(other, problem, otherSettings, sub(work), s.threads - 1, rng).then((r) => r[0] ?? null));
        notes.push(`worker thread ran ${other}`);
      }
      tasks.push(heuristic.solve(problem, hSettings as never, sub(work)));
      for (const r of await Promise.all(tasks)) if (r) results.push(r);
      for (const r of results) {
        if (r.bound !== null && r.notes?.some((x) => x.startsWith('HiGHS'))) milpBound = r.bound;
      }
      notes.push(`ran ${useMilp ? 'milp + ' : ''}${heuristic.name}`);
    }
    const best = pickBest(problem, results);
    const proven = results.find((r) => r.provenOptimal && r.value === best.value);
    let bound: number | null = proven ? proven.bound : null;
    if (!proven) {
      const report = computeBounds(problem, { milpBound, knownValue: problem.kind === 'maxcut' ? best.value : null, seed: ctx.seed });
      bound = report.bound;
      notes.push(`bound from ${report.source}`, ...report.details.notes);
    }
    const maximise = problem.kind === 'maxcut';
    const meets = bound !== null && (maximise ? best.value >= bound - 1e-9 : best.value <= bound + 1e-9);
    return classicalResult(problem, {
      assignment: best.assignment,
      bound,
      provenOptimal: meets || proven !== undefined,
      seconds: control.elapsed(),
      evaluations: results.reduce((a, r) => a + r.evaluations, 0),
      notes: [...notes, ...(best.notes ?? [])],
    });
  },
};

export const classicalSolvers: SolverDefinition<any>[] = [exactSolver, milpSolver, greedySolver, tabuSolver, annealSolver, gwSolver, fmSolver, bestSolver];

