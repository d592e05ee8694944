import { createLadderAnsatz } from '../../../shared/engine/ansatz/ladder';
import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import { encodeMaxCut } from '../../../shared/engine/encodings/maxcut';
import { centralDifferenceGradient, parameterShiftGradient } from '../../../shared/engine/optimizers/gradients';
import { createRng } from '../../../shared/engine/random';
import { expectationOfDiagonal, isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { optimizeAnsatz } from '../../../shared/engine/variational/optimize';
import { createDiagonalEstimator } from '../../../shared/engine/variational/estimate';
import { ladderStart } from '../../../shared/engine/variational/vqe-run';
import { problemOf, randomGraph } from '../encodings/fixtures';

// Parameter-shift rule: exact for parameters entering one gate e^{−iθP/2} (Mitarai et al., PRA 98, 032309
// (2018); Schuld et al., PRA 99, 032331 (2019)); not for QAOA's γ on a weighted cost (common practice).
describe('gradients of circuit energies', () => {
  const rng = createRng(31);
  const n = 5;
  const edges = randomGraph(rng, n, 0.7, () => 0.3 + 2 * rng.next());
  const enc = encodeMaxCut(problemOf(n, edges, { kind: 'maxcut' }));
  const diag = isingDiagonal(enc.operator);

  test('ladder: parameter shift equals central differences for every RY/RZ angle', () => {
    const ansatz = createLadderAnsatz({ numQubits: n, layers: 2 });
    const f = (x: Float64Array) => expectationOfDiagonal(ansatz.prepare(x), diag);
    const x = Float64Array.from({ length: ansatz.numParams }, () => rng.normal());
    const shift = parameterShiftGradient(f)(x), diff = centralDifferenceGradient(f, 1e-5)(x);
    shift.forEach((g, j) => expect(g).toBeCloseTo(diff[j], 7));
    expect(ansatz.gradientRule.every((r) => r === 'shift')).toBe(true);
  });

  test('QAOA γ on a weighted cost: the two-term shift rule is wrong, hence finite differences', () => {
    const ansatz = createQaoaAnsatz({ numQubits: n, layers: 1, energyDiagonal: diag });
    const f = (x: Float64Array) => expectationOfDiagonal(ansatz.prepare(x), diag);
    const x = Float64Array.of(0.4, 0.3);
    const shift = parameterShiftGradient(f)(x), diff = centralDifferenceGradient(f, 1e-5)(x);
    expect(Math.abs(shift[0] - diff[0])).toBeGreaterThan(1e-3);
    expect(ansatz.gradientRule).toEqual(['difference', 'difference']);
  });

  test('Adam with parameter-shift gradients lowers the ladder energy, reproducibly', () => {
    const ansatz = createLadderAnsatz({ numQubits: n, layers: 1 });
    const run = () => optimizeAnsatz({
      ansatz, estimate: createDiagonalEstimator(diag, 0, createRng(1)), optimizer: 'adam',
      starts: [ladderStart(n, 1, createRng(2))], maxIterations: 80, rng: createRng(3), shouldStop: () => false,
    });
    const r = run();
    expect(r.trace[r.trace.length - 1].energy).toBeLessThan(r.trace[0].energy - 0.1);
    expect(r.fx).toBeGreaterThanOrEqual(Math.min(...diag) - 1e-9); // variational principle
    expect(Array.from(run().x)).toEqual(Array.from(r.x));
  });
});
