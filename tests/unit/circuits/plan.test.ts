/**
 * The preview's circuit (solver.plannedCircuit, asked before launch) equals what the finished run
 * reports (`circuit` and `circuitSpec` of its result) for the same problem, settings and seed —
 * both follow shared/engine/solvers/circuit-plan.ts.
 */
import { createRng } from '../../../shared/engine/random';
import { qaoaSolver } from '../../../shared/engine/solvers/qaoa';
import { vqeSolver } from '../../../shared/engine/solvers/vqe';
import { exactSolver } from '../../../shared/engine/solvers/exact';
import type { AnySolverDefinition } from '../../../shared/engine/solvers/registry';
import { problemOf, randomGraph, ringEdges } from '../encodings/fixtures';

const cases: { name: string; solver: AnySolverDefinition; settings: Record<string, unknown>; problem: () => ReturnType<typeof problemOf> }[] = [
  { name: 'QAOA p = 2, max-cut on a random 7-depot network', solver: qaoaSolver, settings: { layers: 2 }, problem: () => problemOf(7, randomGraph(createRng(3), 7, 0.5), { kind: 'maxcut' }) },
  { name: 'QAOA warm-started, bisection (slack qubits)', solver: qaoaSolver, settings: { layers: 1, warmStart: true }, problem: () => problemOf(6, randomGraph(createRng(5), 6, 0.6), { kind: 'bisection', tolerance: 0.2 }, [1, 2, 1, 3, 1, 2]) },
  { name: 'QAOA, 3 regions by recursive bisection (the first split)', solver: qaoaSolver, settings: { layers: 1 }, problem: () => problemOf(7, ringEdges(7), { kind: 'kway', k: 3, tolerance: 0.3 }) },
  { name: 'VQE ladder on a ring entangler', solver: vqeSolver, settings: { layers: 2 }, problem: () => problemOf(6, ringEdges(6), { kind: 'maxcut' }) },
  { name: 'VQE ladder, line entangler, with pins', solver: vqeSolver, settings: { layers: 1, entangler: 'line' }, problem: () => problemOf(7, randomGraph(createRng(8), 7, 0.5), { kind: 'maxcut', pins: { 1: 0, 4: 1 } }) },
  { name: 'VQE alternating ansatz (counted as QAOA)', solver: vqeSolver, settings: { layers: 2, ansatz: 'alternating' }, problem: () => problemOf(6, randomGraph(createRng(9), 6, 0.7), { kind: 'maxcut' }) },
];

describe('the preview plans the circuit the run reports', () => {
  test.each(cases)('$name', async ({ solver, settings, problem }) => {
    const p = problem();
    const parsed = solver.parseSettings({ ...settings, maxIterations: 5, restarts: 1 });
    const seed = 11;
    const planned = solver.plannedCircuit(p, parsed, seed);
    expect(planned).not.toBeNull();
    const result = await solver.solve(p, parsed, { seed, timeLimitSeconds: 30 });
    expect(planned!.summary).toEqual(result.circuit);
    expect(planned!.spec).toEqual(result.circuitSpec);
    expect(planned!.summary.layouts.all.twoQubitGates).toBeGreaterThan(0);
  });

  test('the warm start changes the circuit (so the plan must follow the setting)', () => {
    const p = problemOf(6, randomGraph(createRng(5), 6, 0.6), { kind: 'maxcut' });
    const cold = qaoaSolver.plannedCircuit(p, qaoaSolver.parseSettings({ layers: 1 }), 1)!;
    const warm = qaoaSolver.plannedCircuit(p, qaoaSolver.parseSettings({ layers: 1, warmStart: true }), 1)!;
    // ry(−θ) rz(2β) ry(θ) instead of rx(2β): two more one-qubit gates per qubit and layer.
    expect(warm.summary.layouts.all.oneQubitGates - cold.summary.layouts.all.oneQubitGates).toBe(2 * 6);
    expect(warm.spec.warmStart).toBeDefined();
  });

  test('nothing to simulate when every depot is pinned; classical solvers plan no circuit', () => {
    const p = problemOf(3, ringEdges(3), { kind: 'maxcut', pins: { 1: 0, 2: 1, 3: 0 } });
    expect(qaoaSolver.plannedCircuit(p, qaoaSolver.parseSettings({}), 0)).toBeNull();
    expect(exactSolver.plannedCircuit(problemOf(4, ringEdges(4), { kind: 'maxcut' }), exactSolver.parseSettings({}), 0)).toBeNull();
  });
});
