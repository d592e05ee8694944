import { annealSolver } from '../../../shared/engine/solvers/anneal';
import { exactSolver } from '../../../shared/engine/solvers/exact';
import { fmSolver } from '../../../shared/engine/solvers/fm';
import { gwSolver } from '../../../shared/engine/solvers/gw';
import { milpSolver } from '../../../shared/engine/solvers/milp';
import { tabuSolver } from '../../../shared/engine/solvers/tabu';
import type { SolveProgress, SolverDefinition } from '../../../shared/engine/solvers/types';
import { problemOf, randomGraph } from './helpers';

// Anytime behaviour (common practice for time-limited solvers): progress with the best value
// so far, a cancel flag honoured long before the time limit, the same seed → the same answer.
describe('anytime, cancellable, seeded', () => {
  const maxcut = problemOf(300, randomGraph(300, 0.05, 71, 'unit'));
  const bisection = problemOf(300, randomGraph(300, 0.05, 71, 'unit'), { kind: 'bisection' });
  const cases: Array<[string, SolverDefinition<any>, typeof maxcut]> = [
    ['tabu', tabuSolver, maxcut],
    ['anneal', annealSolver, maxcut],
    ['gw', gwSolver, maxcut],
    ['fm', fmSolver, bisection],
    ['tabu (bisection)', tabuSolver, bisection],
    ['exact', exactSolver, problemOf(34, randomGraph(34, 0.3, 72, 'unit'))],
    ['milp', milpSolver, problemOf(120, randomGraph(120, 0.3, 73, 'unit'))],
  ];
  test.each(cases)('%s: reports progress and stops on cancel', async (_name, def, problem) => {
    const progress: SolveProgress[] = [];
    // Counts how often the solver looks at the flag after it is raised: at least once means the
    // solver was still running and saw it (no wall time is asserted).
    const cancel = {
      raised: false, readsAfterRaise: 0,
      get cancelled() { if (this.raised) this.readsAfterRaise++; return this.raised; },
    };
    const settings = def.parseSettings(def === exactSolver ? { threads: 1, maxDepots: 34 } : {});
    // Raised at the first progress report: the run is under way, whatever the machine's speed.
    const onProgress = (p: SolveProgress) => { progress.push(p); cancel.raised = true; };
    const r = await def.solve(problem, settings, { seed: 3, timeLimitSeconds: 60, cancel, onProgress });
    expect(cancel.readsAfterRaise).toBeGreaterThan(0);
    // …and stopped: progress is reported every ~50 ms while a solver runs, so one that went on
    // after seeing the flag would report again (at most one closing report is allowed).
    expect(progress.length).toBeLessThanOrEqual(2);
    expect(r.assignment).toHaveLength(problem.network.n);
    expect(progress.length).toBeGreaterThan(0);
    expect(progress.every((p) => p.fraction >= 0 && p.fraction <= 1)).toBe(true);
    if (def !== milpSolver) expect(progress.some((p) => typeof p.bestValue === 'number')).toBe(true);
  }, 30000);

  test('same seed, same problem, iteration-bound run → same answer (gw with fixed sweeps and hyperplanes)', async () => {
    const settings = gwSolver.parseSettings({ maxSweeps: 30, hyperplanes: 20 });
    const a = await gwSolver.solve(maxcut, settings, { seed: 5, timeLimitSeconds: 60 });
    const b = await gwSolver.solve(maxcut, settings, { seed: 5, timeLimitSeconds: 60 });
    expect(b.assignment).toEqual(a.assignment);
  });
});
