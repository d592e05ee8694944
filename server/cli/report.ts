import type { Problem } from '../../shared/engine/problem/types';
import type { EncodingSummary, RunResult } from '../../shared/engine/solvers/orchestrate';
import type { SolverListing } from '../../shared/engine/solvers/registry';

/** The one object `spinyard solve --json` prints (field list documented in docs/cli.md). */
export interface SolveReport {
  problem: Problem['kind'];
  solver: string;
  file: string;
  n: number;
  m: number;
  k: number;
  qubits: number | null;
  sense: 'max' | 'min';
  value: number;
  /** Side 0/1 or region 0…k−1 per depot, in input order (ids in `depots`). */
  assignment: number[];
  depots: string[];
  energy: number | null;
  expectation: number | null;
  params: number[] | null;
  bound: number | null;
  boundSource: string | null;
  gap: number | null;
  provenOptimal: boolean;
  infeasible: boolean;
  seconds: number;
  evaluations: number;
  shots: number;
  seed: number;
  timeLimitSeconds: number;
  cancelled: boolean;
  notes: string[];
  warnings: string[];
  /** Variational solvers: qubits and gate counts per qubit layout (docs/runs.md). */
  circuit?: import('../../shared/engine/circuits/summary').CircuitSummary;
  /** Variational solvers: time on a device per layout under the stated assumptions. */
  deviceTime?: import('../../shared/engine/circuits/run-analysis').RunDeviceTime;
  /** With --noise: noiseless vs noisy energy, expected value and approximation ratio. */
  noise?: import('../../shared/engine/circuits/run-analysis').NoiseReport;
}

export function solveReport(file: string, problem: Problem, result: RunResult, extra: { qubits: number | null; seed: number; timeLimitSeconds: number; cancelled: boolean; warnings: string[] }): SolveReport {
  return {
    problem: problem.kind,
    solver: result.solver,
    file,
    n: problem.network.n,
    m: problem.network.m,
    k: problem.k,
    qubits: extra.qubits,
    sense: result.sense,
    value: result.value,
    assignment: result.assignment,
    depots: problem.network.depotIds,
    energy: result.energy,
    expectation: result.expectation,
    params: result.params,
    bound: result.bound,
    boundSource: result.boundSource,
    gap: result.gap,
    provenOptimal: result.provenOptimal,
    infeasible: result.infeasible ?? false,
    seconds: result.seconds,
    evaluations: result.evaluations,
    shots: result.shots,
    seed: extra.seed,
    timeLimitSeconds: extra.timeLimitSeconds,
    cancelled: extra.cancelled,
    notes: result.notes,
    warnings: extra.warnings,
    ...(result.circuit ? { circuit: result.circuit } : {}),
  };
}

/** Seconds in a readable unit. */
function seconds(s: number): string {
  if (s < 1e-3) return `${(s * 1e6).toPrecision(3)} µs`;
  if (s < 1) return `${(s * 1e3).toPrecision(3)} ms`;
  if (s < 120) return `${s.toPrecision(3)} s`;
  if (s < 7200) return `${(s / 60).toPrecision(3)} min`;
  return `${(s / 3600).toPrecision(3)} h`;
}

const KIND_WORDS = { maxcut: 'max-cut', bisection: 'balanced bisection', kway: 'k-way partition' } as const;
export const num = (x: number | null): string => (x === null ? '—' : Number.isInteger(x) ? String(x) : String(Number(x.toPrecision(10))));

/** Depot ids grouped by side or region, each list cut short after `limit` ids. */
function groups(report: SolveReport, limit = 16): string[] {
  const word = report.problem === 'kway' ? 'region' : 'side';
  const lines: string[] = [];
  for (let part = 0; part < report.k; part++) {
    const ids = report.depots.filter((_, i) => report.assignment[i] === part);
    const shown = ids.slice(0, limit).join(' ');
    lines.push(`  ${`${word} ${part}`.padEnd(10)} ${ids.length} depot(s): ${shown}${ids.length > limit ? ' …' : ''}`);
  }
  return lines;
}

export function solveSummary(r: SolveReport): string {
  const what = r.problem === 'maxcut' ? 'cut weight, higher is better' : 'crossing weight, lower is better';
  const lines = [
    `${KIND_WORDS[r.problem]}${r.problem === 'kway' ? ` (k = ${r.k})` : ''} of ${r.file}: ${r.n} depots, ${r.m} lanes; solver ${r.solver}${r.cancelled ? ' (cancelled)' : ''}`,
    `  ${'value'.padEnd(10)} ${num(r.value)} (${what})${r.infeasible ? ' — INFEASIBLE: see notes' : ''}`,
    `  ${'bound'.padEnd(10)} ${num(r.bound)}${r.boundSource ? ` (${r.boundSource})` : ''}   gap ${r.gap === null ? '—' : `${(100 * r.gap).toFixed(2)} %`}${r.provenOptimal ? '   proven optimal' : ''}`,
  ];
  if (r.expectation !== null || r.energy !== null) lines.push(`  ${'quantum'.padEnd(10)} expectation ${num(r.expectation)}   energy ${num(r.energy)}   qubits ${num(r.qubits)}`);
  if (r.circuit) {
    for (const [layout, c] of Object.entries(r.circuit.layouts)) {
      lines.push(`  ${`${layout === 'all' ? 'all-to-all' : layout}`.padEnd(10)} ${c.oneQubitGates} one-qubit + ${c.twoQubitGates} two-qubit gates, two-qubit depth ${c.twoQubitDepth}, depth ${c.depth}${c.swaps ? `, ${c.swaps} swaps` : ''}`);
    }
  }
  if (r.deviceTime) {
    const t = r.deviceTime.layouts;
    lines.push(`  ${'device'.padEnd(10)} ${r.deviceTime.settings} setting × ${r.deviceTime.shotsPerSetting} shots per estimate: ${seconds(t.all.estimateSeconds)} (all-to-all), ${seconds(t.line.estimateSeconds)} (line), ${seconds(t.grid.estimateSeconds)} (grid); whole run on a line ${seconds(t.line.runSeconds)} — assumed durations, see docs/runs.md`);
  }
  if (r.noise) {
    const n = r.noise;
    const ratio = (x: number | null) => (x === null ? '' : `, ratio ${x.toFixed(3)}`);
    lines.push(`  ${'noise'.padEnd(10)} ${n.layout} layout: noiseless expectation ${num(n.noiseless.expectation)}${ratio(n.noiseless.ratio)}; depolarizing estimate ${num(n.depolarizing.expectation)}${ratio(n.depolarizing.ratio)} (fidelity ${n.depolarizing.fidelity.toPrecision(3)})`);
    if (n.trajectories) lines.push(`  ${''.padEnd(10)} ${n.trajectories.count} trajectories: ${num(n.trajectories.expectation)} ± ${n.trajectories.expectationStdError.toPrecision(2)}${ratio(n.trajectories.ratio)}; best sampled answer under noise ${n.trajectories.best ? `${num(n.trajectories.best.value)}${n.trajectories.best.feasible ? '' : ' (unbalanced)'}` : '—'}`);
  }
  lines.push(`  ${'time'.padEnd(10)} ${r.seconds.toFixed(2)} s   evaluations ${r.evaluations}   shots ${r.shots}   seed ${r.seed}`);
  lines.push(...groups(r));
  for (const note of r.notes) lines.push(`  note: ${note}`);
  return lines.join('\n');
}

export function inspectReport(file: string, problem: Problem, d: EncodingSummary) {
  let totalAbs = 0;
  for (const w of problem.network.laneWeight) totalAbs += Math.abs(w);
  return { file, problem: problem.kind, k: problem.k, depots: problem.network.n, lanes: problem.network.m, totalAbsLaneWeight: totalAbs, pinned: Array.from(problem.pins).filter((p) => p >= 0).length, ...d };
}

export function inspectText(r: ReturnType<typeof inspectReport>): string {
  const lines = [
    `${KIND_WORDS[r.problem]}${r.problem === 'kway' ? ` (k = ${r.k})` : ''} of ${r.file}`,
    `  depots             ${r.depots} (${r.pinned} pinned)`,
    `  lanes              ${r.lanes} (total |weight| ${num(r.totalAbsLaneWeight)})`,
    `  encoding           ${r.method}`,
    `  qubits             ${r.qubits} (${r.depotQubits} depot, ${r.slackQubits} slack)`,
    `  Pauli terms        ${r.pauliTerms} (${r.linearTerms} Z, ${r.quadraticTerms} ZZ) + offset ${num(r.offset)}`,
    `  commuting groups   ${r.commutingGroups} (${r.groupMethod})`,
    `  shots              ${r.shots} for standard error ${num(r.precision)} (Σ|c| = ${num(r.coefficientNorm)})`,
  ];
  for (const p of r.penalties) lines.push(`  penalty ${p.name.padEnd(11)}${num(p.weight)} — ${p.rule}`);
  lines.push(`  rule               ${r.rule}`);
  if (r.approximate) lines.push('  note: depot weights were rounded to a grid for the penalty (see rule)');
  return lines.join('\n');
}

export function solversText(list: SolverListing[]): string {
  const width = Math.max(4, ...list.map((s) => s.name.length));
  const lines = [`${'name'.padEnd(width)}  ${'family'.padEnd(11)} ${'problems'.padEnd(24)} guarantee`];
  for (const s of list) lines.push(`${s.name.padEnd(width)}  ${s.family.padEnd(11)} ${s.kinds.join(',').padEnd(24)} ${s.guarantee}`);
  return lines.join('\n');
}
