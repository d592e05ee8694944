import type { Problem } from '../problem/types';
import { createRng } from '../random';
import { expectationOfDiagonal, isingDiagonal } from '../statevector/diagonal';
import { circuitSeconds, deviceTime, type DeviceAssumptions, type DeviceTime } from './device';
import { depolarizingEstimate, TRAJECTORY_MAX_QUBITS, trajectoryNoise } from './noise';
import { ansatzOf, circuitOf, encodingOf, type CircuitSpec } from './of-run';
import { routeAll } from './summary';
import { LAYOUT_NAMES, type LayoutName } from './types';

export interface DeviceTimeOptions {
  assumptions: DeviceAssumptions;
  /** Measurement settings per estimate (qubit-wise commuting groups; 1 for a network's operator). */
  settings: number;
  shotsPerSetting: number;
  /** Energy estimates the optimisation made (the run's evaluations). */
  estimates: number;
  readoutShots: number;
}

export interface NoiseOptions {
  layout: LayoutName;
  /** 0 = the depolarizing estimate only. At most TRAJECTORY_MAX_QUBITS qubits. */
  trajectories: number;
  shotsPerTrajectory: number;
  seed: number;
  /** What approximation ratios are taken against (the run's best bound, else its best value), or null. */
  reference: { value: number; what: string } | null;
}

export interface NoiseReport {
  layout: LayoutName;
  assumptions: DeviceAssumptions;
  /** Energy ⟨H⟩ and expected business value (cut or crossing weight) at the run's parameters. */
  noiseless: { energy: number; expectation: number; ratio: number | null };
  depolarizing: { fidelity: number; energy: number; expectation: number; ratio: number | null };
  trajectories: null | {
    count: number; shots: number;
    energy: number; energyStdError: number;
    expectation: number; expectationStdError: number; ratio: number | null;
    best: { assignment: number[]; value: number; feasible: boolean } | null;
  };
  reference: { value: number; what: string } | null;
}

/** The `deviceTime` block of a result: the inputs and, per layout, the times. */
export interface RunDeviceTime {
  shotsPerSetting: number;
  settings: number;
  estimates: number;
  readoutShots: number;
  assumptions: DeviceAssumptions;
  layouts: RunAnalysis['deviceTime'];
}

export interface RunAnalysis {
  deviceTime: Record<LayoutName, DeviceTime & { circuitSeconds: number }>;
  noise?: NoiseReport;
}

/**
 * Device time for every layout and, when asked, noise on one layout, for a finished variational
 * run rebuilt from its problem, circuit spec and parameters (docs/runs.md).
 */
export function analyseRun(problem: Problem, spec: CircuitSpec, params: ArrayLike<number>, time: DeviceTimeOptions, noise?: NoiseOptions, shouldStop?: () => boolean): RunAnalysis {
  const encoding = encodingOf(problem, spec);
  const routed = routeAll(circuitOf(encoding, spec));
  const deviceTimes = Object.fromEntries(LAYOUT_NAMES.map((l) => {
    const seconds = circuitSeconds(routed[l].numQubits, routed[l].gates, time.assumptions);
    return [l, { circuitSeconds: seconds, ...deviceTime(seconds, { settings: time.settings, shotsPerSetting: time.shotsPerSetting, estimates: time.estimates, readoutShots: time.readoutShots }, time.assumptions) }];
  })) as RunAnalysis['deviceTime'];
  if (!noise) return { deviceTime: deviceTimes };

  const a = time.assumptions;
  const c = routed[noise.layout];
  const ideal = ansatzOf(encoding, spec).prepare(params);
  const op = encoding.operator, valueOp = encoding.valueOperator;
  const maximise = problem.kind === 'maxcut';
  const ratio = (v: number) => (noise.reference === null || v === 0 ? null : maximise ? v / noise.reference.value : noise.reference.value / v);
  const noiseless = { energy: expectationOfDiagonal(ideal, isingDiagonal(op)), expectation: expectationOfDiagonal(ideal, isingDiagonal(valueOp)) };
  const dE = depolarizingEstimate(c, op, ideal, a), dV = depolarizingEstimate(c, valueOp, ideal, a);
  let trajectories: NoiseReport['trajectories'] = null;
  if (noise.trajectories > 0) {
    if (encoding.numQubits > TRAJECTORY_MAX_QUBITS) throw new RangeError(`the trajectory simulation takes at most ${TRAJECTORY_MAX_QUBITS} qubits; this circuit has ${encoding.numQubits} (ask for 0 trajectories: the depolarizing estimate only)`);
    const t = trajectoryNoise(c, params, op, a, { trajectories: noise.trajectories, shotsPerTrajectory: noise.shotsPerTrajectory, rng: createRng(noise.seed), shouldStop }, encoding, valueOp);
    trajectories = {
      count: t.trajectories, shots: t.shots,
      energy: t.energy, energyStdError: t.stdError,
      expectation: t.value!.mean, expectationStdError: t.value!.stdError, ratio: ratio(t.value!.mean),
      best: t.best ? { assignment: t.best.assignment, value: t.best.value, feasible: t.best.feasible } : null,
    };
  }
  return {
    deviceTime: deviceTimes,
    noise: {
      layout: noise.layout,
      assumptions: a,
      noiseless: { ...noiseless, ratio: ratio(noiseless.expectation) },
      depolarizing: { fidelity: dE.fidelity, energy: dE.energy, expectation: dV.energy, ratio: ratio(dV.energy) },
      trajectories,
      reference: noise.reference,
    },
  };
}

/** Approximation ratios of a noise report against a reference found later (the run's bound). */
export function withReference(n: NoiseReport, kind: Problem['kind'], reference: { value: number; what: string } | null): NoiseReport {
  const ratio = (v: number) => (reference === null || v === 0 ? null : kind === 'maxcut' ? v / reference.value : reference.value / v);
  return {
    ...n,
    reference,
    noiseless: { ...n.noiseless, ratio: ratio(n.noiseless.expectation) },
    depolarizing: { ...n.depolarizing, ratio: ratio(n.depolarizing.expectation) },
    trajectories: n.trajectories && { ...n.trajectories, ratio: ratio(n.trajectories.expectation) },
  };
}
