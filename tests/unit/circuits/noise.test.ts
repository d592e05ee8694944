/**
 * Noise models and device time. The trajectory simulation must equal the noiseless value with
 * zero error, and agree within 3 standard errors with the depolarizing estimate where the two
 * models coincide (common practice: the depolarizing channel with parameter ε is a uniformly
 * random Pauli of the 4ᵏ applied with probability ε; Nielsen & Chuang, "Quantum Computation and
 * Quantum Information", 2000, §8.3.4): a single qubit, and global depolarizing noise.
 */
import { createQaoaAnsatz } from '../../../shared/engine/ansatz/qaoa';
import { circuitSeconds, defaultAssumptions, deviceTime, DEVICE_DEFAULTS, type DeviceAssumptions } from '../../../shared/engine/circuits/device';
import { depolarizingEstimate, trajectoryNoise } from '../../../shared/engine/circuits/noise';
import { qaoaCircuit } from '../../../shared/engine/circuits/qaoa';
import { routeCircuit } from '../../../shared/engine/circuits/route';
import { createRng } from '../../../shared/engine/random';
import { expectationOfDiagonal, isingDiagonal } from '../../../shared/engine/statevector/diagonal';
import { complete, maxcutOperator } from './graphs';

const noiseless: DeviceAssumptions = { ...defaultAssumptions(), oneQubitError: 0, twoQubitError: 0, readoutError: 0 };
const weightedK4 = () => {
  const op = maxcutOperator(4, complete(4), [0.3, -0.2, 0, 0.5]);
  op.quadCoeff.set([0.5, 1, 0.25, 0.75, 0.5, 1.5]);
  return op;
};
const params = [0.4, -0.3, 0.7, 0.2];

test('zero error: trajectories and the estimate equal the noiseless energy', () => {
  const op = weightedK4();
  const ideal = createQaoaAnsatz({ numQubits: 4, layers: 2, energyDiagonal: isingDiagonal(op) }).prepare(params);
  const exact = expectationOfDiagonal(ideal, isingDiagonal(op));
  const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), 'line');
  const t = trajectoryNoise(c, params, op, noiseless, { trajectories: 3, shotsPerTrajectory: 0, rng: createRng(1) });
  expect(Math.abs(t.energy - exact)).toBeLessThan(1e-9);
  expect(t.stdError).toBeLessThan(1e-12);
  expect(Math.abs(depolarizingEstimate(c, op, ideal, noiseless).energy - exact)).toBeLessThan(1e-12);
});

test('single qubit: trajectory mean agrees with the depolarizing estimate within 3 SE', () => {
  const op = maxcutOperator(1, [], [0.8]);
  const a = { ...noiseless, oneQubitError: 0.08, readoutError: 0.05 };
  const ideal = createQaoaAnsatz({ numQubits: 1, layers: 2, energyDiagonal: isingDiagonal(op) }).prepare(params);
  const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), 'all');
  const est = depolarizingEstimate(c, op, ideal, a);
  expect(est.fidelity).toBeCloseTo(0.92 ** 5, 12); // h, rz, rx, rz, rx
  const t = trajectoryNoise(c, params, op, a, { trajectories: 4000, shotsPerTrajectory: 0, rng: createRng(3) });
  expect(t.stdError).toBeGreaterThan(0);
  expect(Math.abs(t.energy - est.energy)).toBeLessThan(3 * t.stdError);
  // The noise is visible: the ideal value lies well outside the noisy one's error bar.
  const exact = expectationOfDiagonal(ideal, isingDiagonal(op));
  expect(Math.abs(t.energy - exact)).toBeGreaterThan(5 * t.stdError);
});

test('global depolarizing on 4 routed qubits: trajectory mean agrees with the estimate within 3 SE', () => {
  const op = weightedK4();
  const a = { ...noiseless, oneQubitError: 0.01, twoQubitError: 0.03, readoutError: 0.02 };
  const ideal = createQaoaAnsatz({ numQubits: 4, layers: 2, energyDiagonal: isingDiagonal(op) }).prepare(params);
  const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), 'line');
  const est = depolarizingEstimate(c, op, ideal, a);
  const t = trajectoryNoise(c, params, op, a, { trajectories: 1500, shotsPerTrajectory: 0, rng: createRng(5), model: 'global' });
  expect(Math.abs(t.energy - est.energy)).toBeLessThan(3 * t.stdError);
  expect(est.fidelity).toBeLessThan(0.5);
});

test('sampled best answer under noise is a decoded, re-evaluated cut', () => {
  const op = weightedK4();
  const c = routeCircuit(qaoaCircuit({ operator: op, layers: 2 }), 'grid');
  const encoding = { kind: 'maxcut', decode: (x: number) => Int32Array.from([0, 1, 2, 3], (q) => (x >> q) & 1), valueOf: (s: number[]) => complete(4).reduce((v, [i, j], t) => v + (s[i] !== s[j] ? op.quadCoeff[t] : 0), 0), feasible: () => true } as never;
  const t = trajectoryNoise(c, params, op, defaultAssumptions(), { trajectories: 5, shotsPerTrajectory: 200, rng: createRng(9) }, encoding);
  expect(t.shots).toBe(1000);
  expect(t.best!.value).toBe(complete(4).reduce((v, [i, j], k) => v + (t.best!.assignment[i] !== t.best!.assignment[j] ? op.quadCoeff[k] : 0), 0));
  expect(t.best!.value).toBe(3.5); // the maximum cut, {0,3} | {1,2}: 0.5 + 1 + 0.5 + 1.5 (by hand over the 7 cuts), is sampled in 1000 shots
});

describe('device time', () => {
  test('circuit duration is the longest weighted path', () => {
    const t = circuitSeconds(3, [
      { name: 'h', qubits: [0] }, { name: 'h', qubits: [1] }, { name: 'cx', qubits: [0, 1] },
      { name: 'rz', qubits: [1], angle: { param: -1, scale: 1 } }, { name: 'cx', qubits: [1, 2] },
    ], { oneQubitGateSeconds: 2, twoQubitGateSeconds: 10 });
    expect(t).toBe(2 + 10 + 2 + 10);
  });

  test('settings × shots × (circuit + read-out + reset), per estimate and per run', () => {
    const a = { ...defaultAssumptions(), readoutSeconds: 1, shotOverheadSeconds: 2 };
    const d = deviceTime(3, { settings: 4, shotsPerSetting: 100, estimates: 10, readoutShots: 50 }, a);
    expect(d.shotSeconds).toBe(6);
    expect(d.estimateSeconds).toBe(4 * 100 * 6);
    expect(d.runSeconds).toBe(10 * 2400 + 50 * 6);
  });

  test('every default names its source and says it is an assumption or from memory', () => {
    for (const f of Object.values(DEVICE_DEFAULTS)) expect(f.source).toMatch(/from memory|assumption/);
  });
});

describe('in a run', () => {
  test('qaoa with noise: true carries device time and noise with ratios against the run bound', async () => {
    const { solveProblem } = await import('../../../shared/engine/solvers/orchestrate');
    const { buildCompactNetwork } = await import('../../../shared/engine/network/build');
    const { bindProblem } = await import('../../../shared/engine/problem/bind');
    const doc = {
      depots: ['a', 'b', 'c', 'd', 'e'].map((id) => ({ id })),
      lanes: [['a', 'b', 3], ['b', 'c', 1], ['c', 'd', 2], ['d', 'e', 1], ['e', 'a', 2], ['a', 'c', 1]].map(([from, to, w]) => ({ from, to, weight: w })),
    };
    const problem = bindProblem(buildCompactNetwork(doc as never), { kind: 'maxcut' } as never);
    const r = await solveProblem(problem, 'qaoa', { noise: true, noiseTrajectories: 6, maxIterations: 20, restarts: 1 }, { seed: 2, timeLimitSeconds: 10 });
    expect(r.circuit!.qubits).toBe(5);
    expect(r.deviceTime!.layouts.line.estimateSeconds).toBeGreaterThan(0);
    expect(r.noise!.trajectories!.count).toBe(6);
    expect(Math.abs(r.noise!.noiseless.expectation - r.expectation!)).toBeLessThan(1e-9);
    expect(r.noise!.reference!.value).toBe(r.bound);
    expect(r.noise!.noiseless.ratio).toBeCloseTo(r.expectation! / r.bound!, 12);
    const plain = await solveProblem(problem, 'qaoa', { maxIterations: 20, restarts: 1 }, { seed: 2, timeLimitSeconds: 10 });
    expect(plain.noise).toBeUndefined();
    expect(plain.deviceTime).toBeDefined();
  });
});
