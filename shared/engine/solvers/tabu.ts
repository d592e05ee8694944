/**
 * `tabu`: for max-cut, partition crossover and path relinking between the best cuts of
 * breakout-style tabu runs (relink-maxcut.ts; the runs after Benlic & Hao 2013, simplified: our
 * own perturbation schedule); swap-based tabu search for bisection; extra copies on worker threads.
 */
import { classicalResult } from '../classical/result';
import { createRunControl } from '../classical/run-control';
import { tabuBisection, tabuBisectionDefaults } from '../classical/tabu-bisection';
import { relinkDefaults, relinkMaxcut } from '../classical/relink-maxcut';
import { tabuMaxcutDefaults } from '../classical/tabu-maxcut';
import { createRng } from '../random';
import { pickBest, startSides, threadsField, workerCopies } from './classical-common';
import { defineSolver } from './define';
import { booleanField, intField, numberField, settingsObject } from './settings';

const d = tabuMaxcutDefaults;
const settings = settingsObject({
  threads: threadsField(),
  tenureMin: intField(d.tenureMin, 1, 1000),
  tenureShare: numberField(d.tenureShare, 0, 0.5),
  jumpShare: numberField(d.jumpShare, 0, 0.5),
  strongJumpShare: numberField(d.strongJumpShare, 0, 1),
  stagnation: intField(d.stagnation, 1, 1e6),
  directedFloor: numberField(d.directedFloor, 0, 1),
  recencyShare: numberField(d.recencyShare, 0, 1),
  epochMoves: numberField(d.epochMoves, 0, 1e6),
  walkTenureMin: intField(d.walkTenureMin, 1, 1000),
  walkStagnation: numberField(d.walkStagnation, 1, 1e6),
  restartStagnation: numberField(d.restartStagnation, 0, 1e6),
  eliteSize: intField(d.eliteSize, 0, 64),
  combineShare: numberField(d.combineShare, 0, 1),
  poolSize: intField(relinkDefaults.poolSize, 0, 64),
  relinkStall: numberField(relinkDefaults.relinkStall, 1, 1e6),
  relinkDistance: numberField(relinkDefaults.relinkDistance, 0, 0.5),
  startStall: numberField(relinkDefaults.startStall, 0, 1e6),
  childStall: numberField(relinkDefaults.childStall, 0, 1e6),
  crossover: booleanField(relinkDefaults.crossover),
  /** Stop early once this value is reached (0 = never; for max-cut benchmarks). */
  target: numberField(0, -1e15, 1e15),
});

export const tabuSolver = defineSolver({
  name: 'tabu',
  label: 'Tabu search (breakout-style)',
  family: 'heuristic',
  kinds: ['maxcut', 'bisection'],
  otherwise: 'fm (recursive bisection) or milp for k-way regions',
  guarantee: 'No optimality guarantee: tabu search with breakout-style perturbations (after Benlic & Hao 2013, simplified) and partition crossover / path relinking between its best cuts for max-cut, swap-based tabu search for bisection; best found within the time limit.',
  settings,
  async solve(problem, s, ctx) {
    const rng = createRng(ctx.seed);
    const extra = workerCopies('tabu', problem, { ...s, threads: 1 }, ctx, s.threads - 1, rng);
    const control = createRunControl(ctx);
    const start = startSides(problem, rng);
    let side: Int8Array, moves: number, bestAt: number;
    const notes: string[] = [];
    if (problem.kind === 'maxcut') {
      const run = await relinkMaxcut(problem, start, { ...tabuMaxcutDefaults, ...relinkDefaults, ...s }, rng, control, s.target !== 0 ? s.target : Infinity);
      ({ side, moves, bestAt } = run);
      notes.push(`${run.runs} tabu run${run.runs === 1 ? '' : 's'}, ${run.crossed} started from a partition-crossover child`);
    } else {
      ({ side, moves, bestAt } = await tabuBisection(problem, start, { ...tabuBisectionDefaults, tenureMin: s.tenureMin }, rng, control));
    }
    const mine = classicalResult(problem, { assignment: side, seconds: control.elapsed(), evaluations: moves, notes: [`best found after ${bestAt.toFixed(2)} s`, ...notes] });
    return pickBest(problem, [mine, ...(await extra)]);
  },
});
