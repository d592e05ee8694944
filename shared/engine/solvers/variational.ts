/**
 * The variational solvers `vqe` and `qaoa` (registry: shared/engine/solvers/registry.ts).
 * Both encode the problem as an Ising cost operator (shared/engine/encodings), optimise a
 * circuit on the CPU statevector and answer with the best read-out sample; k-way problems go
 * through recursive bisection by default (one small operator per split) or one-hot encoding.
 */
import { circuitOf, type CircuitSpec } from '../circuits/of-run';
import { warmProbabilities } from '../circuits/warm';
import { circuitSummary } from '../circuits/summary';
import { createFlipState } from '../classical/flip-state';
import { greedyMaxcut, polishBisection, polishMaxcut } from '../classical/local-search';
import { randomBalancedSides } from '../classical/balance';
import { freeDepots } from '../classical/result';
import { SettingsError } from '../classical/settings';
import { encodeBisection } from '../encodings/bisection';
import { encodeProblem, type EncodingOptions } from '../encodings';
import type { Encoding } from '../encodings/types';
import { crossingWeight, isBalanced } from '../problem/evaluate';
import type { Problem } from '../problem/types';
import { createRng, type Rng } from '../random';
import { DEFAULT_MAX_QUBITS, stateBytes } from '../statevector/state';
import { OPTIMIZER_NAMES, type OptimizerName } from '../variational/optimize';
import { runQaoa, type VariationalOutcome, type VariationalTracePoint } from '../variational/qaoa-run';
import { firstBisectionStep, recursiveBisection } from '../variational/recursive-bisection';
import { runVqeOnEncoding, type VqeAnsatzName } from '../variational/vqe-run';
import type { SampledAssignment, SolveContext, SolveResult, SolverDefinition, TracePoint } from './types';

/** Default qubit ceiling for interactive runs (a 24-qubit state is 256 MiB). */
export const INTERACTIVE_MAX_QUBITS = 24;

interface CommonSettings {
  layers: number;
  shots: number;
  readoutShots: number;
  optimizer: OptimizerName;
  restarts: number;
  maxIterations: number;
  maxQubits: number;
  kwayStrategy: 'recursive' | 'onehot';
  penaltyRule: 'lucas' | 'dominant';
}
export interface QaoaSettings extends CommonSettings {
  warmStart: boolean;
  warmStartEpsilon: number;
}
export interface VqeSettings extends CommonSettings {
  ansatz: VqeAnsatzName;
  entangler: 'line' | 'ring';
}

type FieldSpec =
  | { type: 'int' | 'number'; default: number; min: number; max: number }
  | { type: 'choice'; default: string; choices: readonly string[] }
  | { type: 'boolean'; default: boolean };

const COMMON: Record<keyof CommonSettings, FieldSpec> = {
  layers: { type: 'int', default: 2, min: 1, max: 10 },
  shots: { type: 'int', default: 0, min: 0, max: 1_000_000 },
  readoutShots: { type: 'int', default: 1024, min: 1, max: 1_000_000 },
  optimizer: { type: 'choice', default: 'auto', choices: ['auto', ...OPTIMIZER_NAMES] },
  restarts: { type: 'int', default: 2, min: 1, max: 20 },
  maxIterations: { type: 'int', default: 300, min: 1, max: 10_000 },
  maxQubits: { type: 'int', default: INTERACTIVE_MAX_QUBITS, min: 1, max: DEFAULT_MAX_QUBITS },
  kwayStrategy: { type: 'choice', default: 'recursive', choices: ['recursive', 'onehot'] },
  penaltyRule: { type: 'choice', default: 'lucas', choices: ['lucas', 'dominant'] },
};

/** Plain-object settings against a field table; one message per bad or unknown field. */
function parseFields(input: unknown, fields: Record<string, FieldSpec>): Record<string, number | string | boolean> {
  if (input !== undefined && input !== null && (typeof input !== 'object' || Array.isArray(input))) {
    throw new SettingsError({ settings: 'give the settings as an object of named fields' });
  }
  const given = (input ?? {}) as Record<string, unknown>;
  const errors: Record<string, string> = {};
  const out: Record<string, number | string | boolean> = {};
  for (const key of Object.keys(given)) if (!(key in fields)) errors[key] = `unknown setting; allowed: ${Object.keys(fields).join(', ')}`;
  for (const [key, spec] of Object.entries(fields)) {
    const raw = given[key];
    if (raw === undefined) { out[key] = spec.default; continue; }
    if (spec.type === 'choice') {
      if (typeof raw !== 'string' || !spec.choices.includes(raw)) errors[key] = `must be one of ${spec.choices.join(', ')} (got ${JSON.stringify(raw)})`;
      else out[key] = raw;
    } else if (spec.type === 'boolean') {
      if (typeof raw !== 'boolean') errors[key] = `must be true or false (got ${JSON.stringify(raw)})`;
      else out[key] = raw;
    } else if (typeof raw !== 'number' || !Number.isFinite(raw)) errors[key] = `must be a number (got ${JSON.stringify(raw)})`;
    else if (spec.type === 'int' && !Number.isInteger(raw)) errors[key] = `must be a whole number (got ${raw})`;
    else if (raw < spec.min || raw > spec.max) errors[key] = `must lie in ${spec.min}…${spec.max} (got ${raw})`;
    else out[key] = raw;
  }
  if (Object.keys(errors).length > 0) throw new SettingsError(errors);
  // 'auto': SPSA copes with shot noise; the simplex is the better choice on exact energies.
  if (out.optimizer === 'auto') out.optimizer = (out.shots as number) > 0 ? 'spsa' : 'nelder-mead';
  return out;
}

const encodingOptions = (s: CommonSettings): EncodingOptions => ({ penaltyRule: s.penaltyRule });

/** Qubits the run needs: the direct encoding, or the first (largest) split for recursive k-way. */
function qubitsFor(problem: Problem, s: CommonSettings): { qubits: number; what: string } {
  if (problem.kind === 'kway' && s.kwayStrategy === 'recursive') {
    const sub = firstBisectionStep(problem);
    return { qubits: encodeBisection(sub.problem, { ...encodingOptions(s), imbalanceWindow: sub.imbalanceWindow }).numQubits, what: 'the first bisection of the recursive k-way split' };
  }
  return { qubits: encodeProblem(problem, encodingOptions(s)).numQubits, what: `the ${problem.kind === 'kway' ? 'one-hot k-way' : problem.kind} encoding` };
}

function refuse(problem: Problem, s: CommonSettings): string | null {
  // Cheap lower bound first: a large network is refused without building its operator.
  let free = 0;
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] < 0) free++;
  const oneHot = problem.kind === 'kway' && s.kwayStrategy === 'onehot';
  const atLeast = oneHot ? free * problem.k : free;
  const { qubits, what } = atLeast > s.maxQubits
    ? { qubits: atLeast, what: oneHot ? 'the one-hot k-way encoding' : `one qubit per free depot (${free} free depots)` }
    : qubitsFor(problem, s);
  if (qubits <= s.maxQubits) return null;
  const mib = stateBytes(qubits) / 2 ** 20;
  return `${what} needs ${atLeast > s.maxQubits ? 'at least ' : ''}${qubits} qubits (a ${mib >= 1024 ? `${(mib / 1024).toFixed(0)} GiB` : `${mib.toFixed(0)} MiB`} statevector); ` +
    `this run allows ${s.maxQubits} (maxQubits; the simulator's hard limit is ${DEFAULT_MAX_QUBITS}). ` +
    (problem.kind === 'kway' && s.kwayStrategy === 'onehot' ? 'Use kwayStrategy "recursive", pin depots, ' : 'Pin depots, ') +
    'split the network, or use a classical solver.';
}

/** A quick classical answer to warm-start QAOA from (greedy + 1-flip / swap polish). */
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

interface RunPlan {
  /** The circuit the run simulates (without the encoding choice, added by the shared loop). */
  spec(encoding: Encoding, warm: ArrayLike<number> | null): Omit<CircuitSpec, 'encoding' | 'penaltyRule'>;
  run(encoding: Encoding, warm: ArrayLike<number> | null, shouldStop: () => boolean, onIteration: (p: VariationalTracePoint) => void): VariationalOutcome;
}

/** The solve loop shared by both solvers: time/cancel, progress, k-way strategy, result mapping. */
async function solveVariational(problem: Problem, s: CommonSettings, ctx: SolveContext, plan: RunPlan, rng: Rng, warmStart: boolean): Promise<SolveResult> {
  const start = performance.now();
  const elapsed = () => (performance.now() - start) / 1000;
  const shouldStop = () => elapsed() >= ctx.timeLimitSeconds || ctx.cancel?.cancelled === true;
  const splits = problem.kind === 'kway' && s.kwayStrategy === 'recursive' ? problem.k - 1 : 1; // k − 1 bisections in all
  const budget = s.maxIterations * s.restarts * splits;
  let lastReport = -Infinity, iterationBase = 0, lastIteration = 0;
  const trace: TracePoint[] = [];
  const onIteration = (p: VariationalTracePoint) => {
    lastIteration = iterationBase + p.iteration;
    trace.push({ iteration: lastIteration, energy: p.energy, stdError: p.stdError, seconds: elapsed() });
    const now = elapsed();
    if (now - lastReport >= 0.05) {
      lastReport = now;
      ctx.onProgress?.({ fraction: Math.min(1, Math.max(now / Math.max(ctx.timeLimitSeconds, 1e-9), lastIteration / budget)), iteration: lastIteration, energy: p.energy, stdError: p.stdError });
    }
  };
  const notes: string[] = [];
  const recursive = problem.kind === 'kway' && s.kwayStrategy === 'recursive';
  let stoppedAny = false;
  // Gate counts per qubit layout for the circuit the result's params belong to.
  const circuitFields = (encoding: Encoding, warm: ArrayLike<number> | null, which: CircuitSpec['encoding']): Partial<SolveResult> => {
    const spec: CircuitSpec = { ...plan.spec(encoding, warm), encoding: which, penaltyRule: s.penaltyRule };
    return { circuit: circuitSummary(circuitOf(encoding, spec)), circuitSpec: spec };
  };
  const finish = (assignment: ArrayLike<number>, outcome: VariationalOutcome | null, extra: Partial<SolveResult>): SolveResult => {
    const a = Array.from(assignment, (x) => x | 0);
    const infeasible = !isBalanced(problem, a);
    if (infeasible) notes.push(recursive ? 'the combined assignment breaks the balance rule (a split could not meet its window)' : 'no sampled answer met the balance rule; the best infeasible sample is returned');
    if (outcome?.stopped || stoppedAny) notes.push('stopped early (time limit or cancel)');
    return {
      value: crossingWeight(problem, a),
      assignment: a,
      bound: null,
      gap: null,
      provenOptimal: false,
      energy: outcome?.energy ?? null,
      expectation: outcome?.expectation ?? null,
      params: outcome?.params ?? null,
      seconds: elapsed(),
      evaluations: 0,
      shots: 0,
      trace,
      ...extra,
      ...(infeasible ? { infeasible: true } : {}),
      notes,
    };
  };
  const toSamples = (o: VariationalOutcome): SampledAssignment[] => o.samples.map((d) => ({ assignment: d.assignment, count: d.count, value: d.value }));

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
      if (!first) firstCircuit = circuitFields(enc, null, 'first-split');
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
  let warm: ArrayLike<number> | null = null;
  if (warmStart) {
    warm = classicalStart(problem, rng);
    if (warm) notes.push(`warm start from a greedy + local-search answer of value ${crossingWeight(problem, warm)}`);
    else notes.push('warm start is available for max-cut and bisection only; started from |+⟩ⁿ');
  }
  const out = plan.run(encoding, warm, shouldStop, onIteration);
  if (out.feasibleShare !== null) notes.push(`${(100 * out.feasibleShare).toFixed(1)} % of read-out shots met the balance rule`);
  const best = out.best!;
  return finish(best.assignment, out, { evaluations: out.evaluations, shots: out.shotsUsed, samples: toSamples(out), ...circuitFields(encoding, warm, 'direct') });
}

export const qaoaSolver: SolverDefinition<QaoaSettings> = {
  name: 'qaoa',
  label: 'QAOA (simulated quantum circuit)',
  family: 'variational',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'No optimality guarantee: returns the best sampled answer of an optimised p-layer QAOA circuit on an exact CPU statevector; balance is checked, never assumed.',
  parseSettings(input) {
    const out = parseFields(input, {
      ...COMMON,
      warmStart: { type: 'boolean', default: false },
      warmStartEpsilon: { type: 'number', default: 0.25, min: 0, max: 0.5 },
    });
    return out as unknown as QaoaSettings;
  },
  refuses: (problem, s) => refuse(problem, s),
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    return solveVariational(problem, s, ctx, {
      spec: (encoding, warm) => ({ ansatz: 'qaoa', layers: s.layers, ...(warm ? { warmStart: { probabilities: warmProbabilities(encoding, warm), epsilon: s.warmStartEpsilon } } : {}) }),
      run: (encoding, warm, shouldStop, onIteration) => runQaoa({
        encoding, layers: s.layers, optimizer: s.optimizer, shots: s.shots, readoutShots: s.readoutShots,
        restarts: s.restarts, maxIterations: s.maxIterations, rng, shouldStop, onIteration,
        warmStart: warm ? { assignment: warm, epsilon: s.warmStartEpsilon } : undefined,
        stateOptions: { maxQubits: s.maxQubits },
      }),
    }, rng, s.warmStart);
  },
};

export const vqeSolver: SolverDefinition<VqeSettings> = {
  name: 'vqe',
  label: 'VQE (simulated quantum circuit)',
  family: 'variational',
  kinds: ['maxcut', 'bisection', 'kway'],
  guarantee: 'No optimality guarantee: returns the best sampled answer of a variationally optimised circuit (ladder or alternating ansatz) on an exact CPU statevector; balance is checked, never assumed.',
  parseSettings(input) {
    const out = parseFields(input, {
      ...COMMON,
      ansatz: { type: 'choice', default: 'ladder', choices: ['ladder', 'alternating'] },
      entangler: { type: 'choice', default: 'ring', choices: ['ring', 'line'] },
    });
    return out as unknown as VqeSettings;
  },
  refuses: (problem, s) => refuse(problem, s),
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    return solveVariational(problem, s, ctx, {
      spec: () => (s.ansatz === 'ladder' ? { ansatz: 'ladder', layers: s.layers, entangler: s.entangler } : { ansatz: 'qaoa', layers: s.layers }),
      run: (encoding, _warm, shouldStop, onIteration) => runVqeOnEncoding(encoding, {
        ansatz: s.ansatz, layers: s.layers, entangler: s.entangler, optimizer: s.optimizer, shots: s.shots,
        readoutShots: s.readoutShots, restarts: s.restarts, maxIterations: s.maxIterations, rng, shouldStop, onIteration,
        stateOptions: { maxQubits: s.maxQubits },
      }),
    }, rng, false);
  },
};

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const variationalSolvers: SolverDefinition<any>[] = [vqeSolver, qaoaSolver];
