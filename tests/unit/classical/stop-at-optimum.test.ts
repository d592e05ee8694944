/**
 * A heuristic in a run stops once it reaches a value another solver of the same run proved
 * optimal (searching on cannot improve it), and every checked result says when its value was
 * first reached. The optimum is Petersen's max-cut, 12 (textbook fact: the Petersen graph has 15
 * edges and its maximum cut is 12 — e.g. Godsil & Royle, "Algebraic Graph Theory", 2001; value
 * from memory), and exact enumeration is asked for it independently here.
 */
import { solveProblem } from '../../../shared/engine/solvers/orchestrate';
import { petersen, problemOf, randomGraph } from './helpers';

test('exact proves Petersen\'s max-cut 12; tabu told so stops on reaching it, well before its time limit, and is marked proven', async () => {
  const problem = problemOf(10, petersen());
  const exact = await solveProblem(problem, 'exact', {}, { seed: 1, timeLimitSeconds: 30 });
  expect(exact.value).toBe(12);
  expect(exact.provenOptimal).toBe(true);

  const told = await solveProblem(problem, 'tabu', {}, { seed: 1, timeLimitSeconds: 20, knownOptimum: () => exact.value });
  expect(told.value).toBe(12);
  expect(told.stoppedAtKnownOptimum).toBe(true);
  expect(told.provenOptimal).toBe(true);
  expect(told.notes.join(' ')).toMatch(/stopped early/);
  // Well under the 20 s it would otherwise search (a behaviour check with ample margin, not a speed target).
  expect(told.seconds).toBeLessThan(10);
  expect(told.secondsToBest).toBeLessThanOrEqual(told.seconds);
});

test('without a known optimum a heuristic runs on as before and is not marked stopped', async () => {
  const problem = problemOf(10, petersen());
  const alone = await solveProblem(problem, 'tabu', {}, { seed: 1, timeLimitSeconds: 1 });
  expect(alone.stoppedAtKnownOptimum).toBeUndefined();
  expect(alone.value).toBe(12);
  expect(alone.secondsToBest).toBeGreaterThanOrEqual(0);
  expect(alone.secondsToBest).toBeLessThanOrEqual(alone.seconds);
});

test('a known optimum the heuristic does not reach does not stop it early, and exact solvers are never stopped', async () => {
  // 12 depots (the size of the reported case): the told "optimum" is above any cut, so it is never reached.
  const problem = problemOf(12, randomGraph(12, 0.5, 7, 'unit'));
  const exact = await solveProblem(problem, 'exact', {}, { seed: 1, timeLimitSeconds: 30, knownOptimum: () => 1e9 });
  expect(exact.stoppedAtKnownOptimum).toBeUndefined();
  expect(exact.provenOptimal).toBe(true);
  const tabu = await solveProblem(problem, 'tabu', {}, { seed: 1, timeLimitSeconds: 1, knownOptimum: () => exact.value + 1 });
  expect(tabu.stoppedAtKnownOptimum).toBeUndefined();
  expect(tabu.seconds).toBeGreaterThan(0.5); // it used its time
});
