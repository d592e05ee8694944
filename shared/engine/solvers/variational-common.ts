/**
 * What `qaoa` and `vqe` share: the common settings fields, the refusal by circuit width, and the
 * solve loop (time and cancel, progress, the k-way strategy, mapping outcomes to a SolveResult).
 * Both encode the problem as an Ising cost operator (shared/engine/encodings), optimise a circuit
 * on the CPU statevector and answer with the best read-out sample.
 */
import { z } from 'zod';
import { circuitOf, type CircuitSpec } from '../circuits/of-run';
import { encodingChoice, specOf, type AnsatzOf } from './circuit-plan';
import { defaultAssumptions, EXACT_RUN_SHOTS } from '../circuits/device';
import { TRAJECTORY_MAX_QUBITS } from '../circuits/noise';
import { analyseRun } from '../circuits/run-analysis';
import { circuitSummary } from '../circuits/summary';
import { randomBalancedSides } from '../classical/balance';
import { createFlipState } from '../classical/flip-state';
import { greedyMaxcut, polishBisection, polishMaxcut } from '../classical/local-search';
import { freeDepots } from '../classical/result';
import { encodeBisection } from '../encodings/bisection';
import { encodeProblem } from '../encodings';
import type { Encoding } from '../encodings/types';
import { crossingWeight, isBalanced, isFeasible } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import type { Rng } from '../random';
import { DEFAULT_MAX_QUBITS, stateBytes } from '../statevector/state';
import { OPTIMIZER_NAMES } from '../variational/optimize';
import type { VariationalOutcome, VariationalTracePoint } from '../variational/qaoa-run';
import { recursiveBisection } from '../variational/recursive-bisection';
import { circuitSize, encodingOptions } from './circuit-qubits';
import { booleanField, choiceField, intField, numberField } from './settings';
import type { SampledAssignment, SolveContext, SolveResult, TracePoint } from './types';

/** Default qubit ceiling for interactive runs (a 24-qubit state is 256 MiB). */
export const INTERACTIVE_MAX_QUBITS = 24;

/** Settings fields both circuit solvers take. */
export const commonFields = {
  layers: intField(2, 1, 10),
  shots: intField(0, 0, 1_000_000),
  readoutShots: intField(1024, 1, 1_000_000),
  optimizer: choiceField(['auto', ...OPTIMIZER_NAMES] as const, 'auto'),
  restarts: intField(2, 1, 20),
  maxIterations: intField(300, 1, 10_000),
  maxQubits: intField(INTERACTIVE_MAX_QUBITS, 1, DEFAULT_MAX_QUBITS),
  kwayStrategy: choiceField(['recursive', 'onehot'] as const, 'recursive'),
  penaltyRule: choiceField(['lucas', 'dominant'] as const, 'lucas'),
  /** Add the noise comparison (default device assumptions) to the result (docs/runs.md, "Noise"). */
  noise: booleanField(false),
  noiseLayout: choiceField(['all', 'line', 'grid'] as const, 'line'),
  noiseTrajectories: intField(20, 0, 1000),
  /** CVaR objective share α in (0, 1] (Barkoutsos et al. 2020, variational/cvar.ts); 1 = plain expectation. */
  cvarAlpha: numberField(1, 0.01, 1),
};

type CommonParsed = z.output<z.ZodObject<typeof commonFields>>;
export type CommonSettings = Omit<CommonParsed, 'optimizer'> & { optimizer: (typeof OPTIMIZER_NAMES)[number] };

/**
 * 'auto' optimizer: SPSA copes with shot noise; on exact energies the solver's own choice (the
 * simplex for QAOA's 2p angles, COBYLA for VQE's many rotation angles, where a simplex stalls).
 */
export function resolveOptimizerWith(exactAuto: CommonSettings['optimizer']) {
  return <T extends CommonParsed>(s: T): Omit<T, 'optimizer'> & { optimizer: CommonSettings['optimizer'] } =>
    ({ ...s, optimizer: s.optimizer === 'auto' ? (s.shots > 0 ? 'spsa' : exactAuto) : s.optimizer });
}

export const resolveOptimizer = resolveOptimizerWith('nelder-mead');

export const circuitQubits = (problem: Problem, s: CommonSettings): number => circuitSize(problem, s).qubits;

/** Refuse a circuit wider than the run's maxQubits, with the memory it would take and what to do. */
export function refuseWide(problem: Problem, s: CommonSettings): string | null {
  const { qubits, atLeast, what } = circuitSize(problem, s);
  if (qubits <= s.maxQubits) return null;
  const mib = stateBytes(qubits) / 2 ** 20;
  return `${what} needs ${atLeast ? 'at least ' : ''}${qubits} qubits (a ${mib >= 1024 ? `${(mib / 1024).toFixed(0)} GiB` : `${mib.toFixed(0)} MiB`} statevector); ` +
    `this run allows ${s.maxQubits} (maxQubits; the simulator's hard limit is ${DEFAULT_MAX_QUBITS}). ` +
    (problem.kind === 'kway' && s.kwayStrategy === 'onehot' ? 'Use kwayStrategy "recursive", pin depots, ' : 'Pin depots, ') +
    'split the network, or use a classical solver.';
}

/** A quick classical answer to warm-start QAOA from (greedy + 1-flip / swap polish), with a note saying so. */
export function warmStartFrom(problem: Problem, rng: Rng): { warm: ArrayLike<number> | null; note: string } {
  const warm = classicalStart(problem, rng);
  return warm
    ? { warm, note: `warm start from a greedy + local-search answer of value ${crossingWeight(problem, warm)}` }
    : { warm: null, note: 'warm start is available for max-cut and bisection only; started from |+⟩ⁿ' };
}

function classicalStart(problem: Problem, rng: Rng): Int8Array | null {
  const free = freeDepots(problem.pins);
  if (problem.kind === 'maxcut') {
    const st = createFlipState(problem.network, greedyMaxcut(problem));
    polishMaxcut(problem, st, free);
    return st.side;
  }
  if (problem.kind === 'bisection') {
    const st = createFlipState(problem.network, randomBalancedSides(problem, rng));
    polishBisection(problem, st, free);
    return st.side;
  }
  return null;
}

export interface CircuitRun {
  /** The circuit the run simulates (without the encoding choice, added by the shared loop; circuit-plan.ts). */
  spec: AnsatzOf;
  run(encoding: Encoding, warm: ArrayLike<number> | null, shouldStop: () => boolean, onIteration: (p: VariationalTracePoint) => void): VariationalOutcome;
}

/** The solve loop shared by both solvers: time/cancel, progress, k-way strategy, result mapping. */
export async function solveVariational(problem: Problem, s: CommonSettings, ctx: SolveContext, plan: CircuitRun, warmStart: (() => { warm: ArrayLike<number> | null; note: string }) | null): Promise<SolveResult> {
  const start = performance.now();
  const elapsed = () => (performance.now() - start) / 1000;
  const shouldStop = () => elapsed() >= ctx.timeLimitSeconds || ctx.cancel?.cancelled === true;
  const recursive = encodingChoice(problem, s) === 'first-split';
  const splits = recursive ? problem.k - 1 : 1; // k − 1 bisections in all
  const budget = s.maxIterations * s.restarts * splits;
  let lastReport = -Infinity, iterationBase = 0, lastIteration = 0;
  const trace: TracePoint[] = [];
  const onIteration = (p: VariationalTracePoint) => {
    lastIteration = iterationBase + p.iteration;
    trace.push({ iteration: lastIteration, energy: p.energy, stdError: p.stdError, seconds: elapsed(), ...(p.start !== undefined ? { start: p.start } : {}) });
    const now = elapsed();
    if (now - lastReport >= 0.05) {
      lastReport = now;
      ctx.onProgress?.({ fraction: Math.min(1, Math.max(now / Math.max(ctx.timeLimitSeconds, 1e-9), lastIteration / budget)), iteration: lastIteration, energy: p.energy, stdError: p.stdError });
    }
  };
  const notes: string[] = [];
  let stoppedAny = false;
  // The noise simulation gets the run's time limit again (trajectories simulated so far are kept).
  const noiseStop = () => {
    const t0 = performance.now();
    return () => ctx.cancel?.cancelled === true || (performance.now() - t0) / 1000 >= ctx.timeLimitSeconds;
  };
  // Gate counts per qubit layout for the circuit the result's params belong to; device time
  // always, noise when asked (docs/runs.md), at those parameters.
  const circuitFields = (encoding: Encoding, warm: ArrayLike<number> | null, which: CircuitSpec['encoding'], out: VariationalOutcome): Partial<SolveResult> => {
    const spec = specOf(plan.spec, s, which, encoding, warm);
    const shots = s.shots > 0 ? s.shots : EXACT_RUN_SHOTS;
    const analysis = analyseRun(problem, spec, out.params,
      { assumptions: defaultAssumptions(), settings: 1, shotsPerSetting: shots, estimates: out.evaluations, readoutShots: s.readoutShots },
      s.noise ? { layout: s.noiseLayout, trajectories: encoding.numQubits <= TRAJECTORY_MAX_QUBITS ? s.noiseTrajectories : 0, shotsPerTrajectory: 100, seed: ctx.seed, reference: null } : undefined,
      noiseStop());
    if (s.noise && encoding.numQubits > TRAJECTORY_MAX_QUBITS) notes.push(`noise: ${encoding.numQubits} qubits is above the trajectory simulation's ${TRAJECTORY_MAX_QUBITS}; the depolarizing estimate only`);
    return {
      circuit: circuitSummary(circuitOf(encoding, spec)),
      circuitSpec: spec,
      deviceTime: { shotsPerSetting: shots, settings: 1, estimates: out.evaluations, readoutShots: s.readoutShots, assumptions: defaultAssumptions(), layouts: analysis.deviceTime },
      ...(analysis.noise ? { noise: analysis.noise } : {}),
    };
  };
  const finish = (assignment: ArrayLike<number>, outcome: VariationalOutcome | null, extra: Partial<SolveResult>): SolveResult => {
    const a = Array.from(assignment, (x) => x | 0);
    const infeasible = !isBalanced(problem, a);
    if (infeasible) notes.push(recursive ? 'the combined assignment breaks the balance rule (a split could not meet its window)' : 'no sampled answer met the balance rule; the best infeasible sample is returned');
    if (outcome?.stopped || stoppedAny) notes.push('stopped early (time limit or cancel)');
    return {
      value: crossingWeight(problem, a), assignment: a, bound: null, gap: null, provenOptimal: false,
      energy: outcome?.energy ?? null, expectation: outcome?.expectation ?? null, params: outcome?.params ?? null,
      seconds: elapsed(), evaluations: 0, shots: 0, trace,
      ...extra,
      ...(infeasible ? { infeasible: true } : {}),
      notes,
    };
  };
  // Samples carry their feasibility (pins and balance of the whole problem), which ranks them.
  const toSamples = (o: VariationalOutcome): SampledAssignment[] =>
    o.samples.map((d) => ({ assignment: d.assignment, count: d.count, value: d.value, feasible: isFeasible(problem, d.assignment) }));

  if (recursive) {
    let evaluations = 0, shots = 0;
    let first: VariationalOutcome | null = null;
    let firstCircuit: Partial<SolveResult> = {};
    const assignment = await recursiveBisection(problem, async (step) => {
      if (step.problem.pins.every((p) => p >= 0)) return step.problem.pins;
      const enc = encodeBisection(step.problem, { ...encodingOptions(s), imbalanceWindow: step.imbalanceWindow });
      const out = plan.run(enc, null, shouldStop, onIteration);
      iterationBase = lastIteration;
      evaluations += out.evaluations;
      shots += out.shotsUsed;
      if (!first) firstCircuit = circuitFields(enc, null, 'first-split', out);
      first = first ?? out;
      stoppedAny = stoppedAny || out.stopped;
      notes.push(`split regions ${step.firstRegion}…${step.firstRegion + step.regions0 - 1} | ${step.firstRegion + step.regions0}…${step.firstRegion + step.regions0 + step.regions1 - 1}: ${enc.numQubits} qubits, ${enc.rule}`);
      await new Promise((r) => setTimeout(r, 0)); // let a cancel message arrive between splits
      return out.best ? out.best.assignment : step.problem.pins.map((p) => Math.max(0, p));
    });
    notes.push('k-way by recursive bisection: energy, expectation and params are those of the first split; samples are not combined across splits');
    const top = first as VariationalOutcome | null;
    return finish(assignment, top, { energy: top?.energy ?? null, expectation: null, params: top?.params ?? null, evaluations, shots, ...firstCircuit });
  }

  const encoding = encodeProblem(problem, encodingOptions(s));
  notes.push(encoding.rule, ...encoding.penalties.map((p) => `${p.name} penalty ${p.weight.toPrecision(4)}: ${p.rule}`));
  if (encoding.numQubits === 0) {
    notes.push('every depot is pinned: no circuit to run');
    return finish(problem.pins, null, {});
  }
  const start0 = warmStart?.() ?? null;
  if (start0) notes.push(start0.note);
  const warm = start0?.warm ?? null;
  const out = plan.run(encoding, warm, shouldStop, onIteration);
  if (out.feasibleShare !== null) notes.push(`${(100 * out.feasibleShare).toFixed(1)} % of read-out shots met the balance rule`);
  const best = out.best!;
  return finish(best.assignment, out, { evaluations: out.evaluations, shots: out.shotsUsed, samples: toSamples(out), ...circuitFields(encoding, warm, 'direct', out) });
}
