/**
 * `spinyard` command line: solve, inspect and list solvers on network files. All numerics
 * come from shared/engine (the same code the server and workers run); this file only turns
 * flags into calls and results into text or one JSON object on stdout.
 */
import { parseArgs } from 'node:util';
import type { NetworkFormat } from '../../shared/formats';
import type { SolveProgress } from '../../shared/engine/solvers/types';
import { loadNetwork, numberFlag, problemFrom, UserError } from './load';
import { inspectReport, inspectText, solveReport, solveSummary, solversText } from './report';
import { USAGE } from './usage';

type Orchestrate = typeof import('../../shared/engine/solvers/orchestrate');
type Registry = typeof import('../../shared/engine/solvers/registry');
// Loaded on demand so file and flag errors are reported without loading every solver.
const orchestrate = (): Orchestrate => require('../../shared/engine/solvers/orchestrate');
const registry = (): Registry => require('../../shared/engine/solvers/registry');
const simKernels = (): typeof import('../lib/sim-wasm') => require('../lib/sim-wasm');

const OPTIONS = {
  problem: { type: 'string', default: 'maxcut' },
  k: { type: 'string' },
  solver: { type: 'string' },
  layers: { type: 'string' },
  shots: { type: 'string' },
  set: { type: 'string', multiple: true, default: [] as string[] },
  seed: { type: 'string', default: '1' },
  'time-limit': { type: 'string', default: '10' },
  tolerance: { type: 'string' },
  pin: { type: 'string', multiple: true, default: [] as string[] },
  depots: { type: 'string' },
  format: { type: 'string' },
  precision: { type: 'string' },
  'no-bounds': { type: 'boolean', default: false },
  json: { type: 'boolean', default: false },
  qasm: { type: 'string' },
  operator: { type: 'string' },
  'qasm-version': { type: 'string', default: '3' },
  'qasm-layout': { type: 'string', default: 'all' },
  'qasm-form': { type: 'string', default: 'bound' },
  device: { type: 'string', multiple: true, default: [] as string[] },
  noise: { type: 'boolean', default: false },
  'noise-layout': { type: 'string', default: 'line' },
  'noise-trajectories': { type: 'string', default: '20' },
  'noise-shots': { type: 'string', default: '100' },
  progress: { type: 'boolean', default: false },
  help: { type: 'boolean', short: 'h', default: false },
} as const;

type Flags = ReturnType<typeof parseArgs<{ options: typeof OPTIONS; allowPositionals: true }>>['values'];

export interface CliIo {
  out: (text: string) => void;
  err: (text: string) => void;
  /** Progress lines are shown only on a terminal, or with --progress. */
  errIsTty: boolean;
}

const FORMATS: NetworkFormat[] = ['edgelist', 'csv', 'json', 'graphml', 'geojson'];

function fileFlags(flags: Flags, positionals: string[], command: string): { file: string; format?: NetworkFormat } {
  if (positionals.length !== 1) throw new UserError(`${command} needs exactly one network FILE (got ${positionals.length})`, [USAGE]);
  if (flags.format !== undefined && !FORMATS.includes(flags.format as NetworkFormat)) throw new UserError(`--format ${flags.format}: choose one of ${FORMATS.join(', ')}`);
  return { file: positionals[0], ...(flags.format ? { format: flags.format as NetworkFormat } : {}) };
}

/** --layers, --shots and --set KEY=VALUE become the solver's settings object. */
function settingsFrom(flags: Flags): Record<string, unknown> {
  const settings: Record<string, unknown> = {};
  const layers = numberFlag('layers', flags.layers, (v) => Number.isInteger(v) && v >= 1, 'a whole number of layers ≥ 1');
  const shots = numberFlag('shots', flags.shots, (v) => Number.isInteger(v) && v >= 0, 'a whole number of shots ≥ 0 (0 = exact expectation)');
  if (layers !== undefined) settings.layers = layers;
  if (shots !== undefined) settings.shots = shots;
  for (const item of flags.set) {
    const eq = item.indexOf('=');
    if (eq <= 0) throw new UserError(`--set ${item}: write KEY=VALUE, e.g. --set tenure=20`);
    const key = item.slice(0, eq), raw = item.slice(eq + 1).trim();
    settings[key] = raw === 'true' ? true : raw === 'false' ? false : raw !== '' && Number.isFinite(Number(raw)) ? Number(raw) : raw;
  }
  return settings;
}

function warn(io: CliIo, warnings: string[]) {
  for (const w of warnings) io.err(`spinyard: warning: ${w}`);
}

async function solveCommand(flags: Flags, positionals: string[], io: CliIo, signals: Signals): Promise<number> {
  if (flags.operator !== undefined) {
    if (positionals.length > 0) throw new UserError('give either a network FILE or --operator FILE, not both');
    const { operatorSolve } = require('./operator') as typeof import('./operator');
    return operatorSolve({
      file: flags.operator, solver: flags.solver ?? 'vqe', settings: settingsFrom(flags), json: flags.json, qasm: qasmFlags(flags),
      seed: numberFlag('seed', flags.seed, Number.isInteger, 'a whole number')!,
      timeLimitSeconds: numberFlag('time-limit', flags['time-limit'], (v) => v > 0, 'a positive number of seconds')!,
    }, io);
  }
  const { file, format } = fileFlags(flags, positionals, 'solve');
  if (flags.solver === undefined) throw new UserError(`solve needs --solver NAME; choose one of: ${registry().solverRegistry.names.join(', ')}`);
  const seed = numberFlag('seed', flags.seed, Number.isInteger, 'a whole number')!;
  const timeLimitSeconds = numberFlag('time-limit', flags['time-limit'], (v) => v > 0, 'a positive number of seconds')!;
  const settings = settingsFrom(flags);
  const qasm = qasmFlags(flags);
  const device = deviceFlags(flags);
  const { network, warnings } = loadNetwork(file, { ...(flags.depots ? { depots: flags.depots } : {}), ...(format ? { format } : {}) });
  const { formatIssue } = require('../../shared/formats') as typeof import('../../shared/formats');
  const warningText = warnings.map(formatIssue);
  warn(io, warningText);
  const problem = problemFrom(network, { problem: flags.problem, k: flags.k, tolerance: flags.tolerance, pins: flags.pin });
  const { solveProblem } = orchestrate();
  // The solver says how many qubits it simulates (0 for classical): the same figure the API prices.
  const definition = registry().getSolver(flags.solver);
  const qubits = definition.qubits(problem, definition.parseSettings(settings));

  const cancel = { cancelled: false };
  signals.onInterrupt = () => {
    cancel.cancelled = true;
    io.err('spinyard: cancelling — the best answer so far will be printed (Ctrl-C again to quit at once)');
  };
  const showProgress = flags.progress || io.errIsTty;
  let lastShown = 0;
  const onProgress = (p: SolveProgress) => {
    const now = Date.now();
    if (!showProgress || (now - lastShown < 250 && p.fraction < 1)) return;
    lastShown = now;
    const parts = [`${Math.round(100 * p.fraction)}%`];
    if (p.iteration !== undefined) parts.push(`iteration ${p.iteration}`);
    if (p.bestValue !== undefined) parts.push(`best ${p.bestValue}`);
    if (p.energy !== undefined) parts.push(`energy ${p.energy.toPrecision(6)}${p.stdError !== undefined ? ` ± ${p.stdError.toPrecision(2)}` : ''}`);
    io.err(`spinyard: ${parts.join('  ')}`);
  };
  const result = await solveProblem(problem, flags.solver, settings, { seed, timeLimitSeconds, cancel, onProgress, stateKernels: simKernels().simKernelsBackend() }, { bounds: !flags['no-bounds'] });
  signals.onInterrupt = null;
  const report = solveReport(file, problem, result, { qubits, seed, timeLimitSeconds, cancelled: cancel.cancelled, warnings: warningText });
  if (qasm) writeQasm(qasm, problem, result, io);
  if (result.circuitSpec && result.params) {
    const { analyseRun } = require('../../shared/engine/circuits/run-analysis') as typeof import('../../shared/engine/circuits/run-analysis');
    const reference = result.bound !== null ? { value: result.bound, what: `the bound (${result.boundSource})` } : { value: result.value, what: 'the value found by this run' };
    const { EXACT_RUN_SHOTS } = require('../../shared/engine/circuits/device') as typeof import('../../shared/engine/circuits/device');
    const shots = typeof settings.shots === 'number' && settings.shots > 0 ? settings.shots : EXACT_RUN_SHOTS;
    const readoutShots = typeof settings.readoutShots === 'number' ? settings.readoutShots : 1024;
    try {
      const analysis = analyseRun(problem, result.circuitSpec, result.params,
        { assumptions: device.assumptions, settings: 1, shotsPerSetting: shots, estimates: result.evaluations, readoutShots },
        device.noise ? { ...device.noise, seed, reference } : undefined);
      report.deviceTime = { shotsPerSetting: shots, settings: 1, estimates: result.evaluations, readoutShots, assumptions: device.assumptions, layouts: analysis.deviceTime };
      const noise = analysis.noise ?? result.noise;
      if (noise) report.noise = noise;
    } catch (e) {
      if (e instanceof RangeError) throw new UserError(`--noise: ${e.message}`);
      throw e;
    }
  } else if (device.noise) io.err(`spinyard: warning: --noise: ${result.solver} runs no circuit; nothing to add noise to`);
  io.out(flags.json ? JSON.stringify(report) : solveSummary(report));
  return cancel.cancelled ? 130 : 0;
}

/** --device KEY=VALUE (assumption overrides) and --noise [--noise-layout L] [--noise-trajectories N] [--noise-shots S]. */
function deviceFlags(flags: Flags) {
  const { defaultAssumptions, DEVICE_DEFAULTS } = require('../../shared/engine/circuits/device') as typeof import('../../shared/engine/circuits/device');
  const assumptions = defaultAssumptions();
  for (const item of flags.device) {
    const eq = item.indexOf('=');
    const key = item.slice(0, Math.max(0, eq)), value = Number(item.slice(eq + 1));
    if (eq <= 0 || !(key in DEVICE_DEFAULTS)) throw new UserError(`--device ${item}: write KEY=VALUE with KEY one of ${Object.keys(DEVICE_DEFAULTS).join(', ')}`);
    const unit = DEVICE_DEFAULTS[key as keyof typeof DEVICE_DEFAULTS].unit;
    if (!Number.isFinite(value) || value < 0 || (unit === 'probability' && value > 1)) throw new UserError(`--device ${item}: ${unit === 's' ? 'a duration in seconds ≥ 0' : 'a probability in 0…1'}`);
    assumptions[key as keyof typeof assumptions] = value;
  }
  if (!flags.noise) return { assumptions, noise: null };
  const layout = flags['noise-layout'];
  if (layout !== 'all' && layout !== 'line' && layout !== 'grid') throw new UserError(`--noise-layout ${layout}: choose all, line or grid`);
  const trajectories = numberFlag('noise-trajectories', flags['noise-trajectories'], (v) => Number.isInteger(v) && v >= 0 && v <= 10_000, 'a whole number 0…10000 (0 = depolarizing estimate only)')!;
  const shotsPerTrajectory = numberFlag('noise-shots', flags['noise-shots'], (v) => Number.isInteger(v) && v >= 0 && v <= 1_000_000, 'a whole number of shots per trajectory')!;
  return { assumptions, noise: { layout, trajectories, shotsPerTrajectory } as const };
}

interface QasmRequest { file: string; version: 2 | 3; layout: 'all' | 'line' | 'grid'; form: 'bound' | 'parameterised' }

/** --qasm FILE [--qasm-version 2|3] [--qasm-layout all|line|grid] [--qasm-form bound|parameterised]. */
function qasmFlags(flags: Flags): QasmRequest | null {
  if (flags.qasm === undefined) return null;
  const version = flags['qasm-version'], layout = flags['qasm-layout'], form = flags['qasm-form'];
  if (version !== '2' && version !== '3') throw new UserError(`--qasm-version ${version}: choose 2 (OpenQASM 2.0) or 3 (OpenQASM 3)`);
  if (layout !== 'all' && layout !== 'line' && layout !== 'grid') throw new UserError(`--qasm-layout ${layout}: choose all, line or grid`);
  if (form !== 'bound' && form !== 'parameterised') throw new UserError(`--qasm-form ${form}: choose bound or parameterised`);
  return { file: flags.qasm, version: version === '2' ? 2 : 3, layout, form };
}

function writeQasm(q: QasmRequest, problem: import('../../shared/engine/problem/types').Problem, result: import('../../shared/engine/solvers/orchestrate').RunResult, io: CliIo): void {
  if (!result.circuitSpec || !result.params) {
    io.err(`spinyard: warning: --qasm: ${result.solver} runs no circuit (or every depot was pinned); no file written`);
    return;
  }
  const { runQasm } = require('../../shared/engine/circuits/export') as typeof import('../../shared/engine/circuits/export');
  const { writeFileSync } = require('node:fs') as typeof import('node:fs');
  try {
    writeFileSync(q.file, runQasm(problem, result.circuitSpec, result.params, q));
  } catch (e) {
    throw new UserError(`--qasm ${q.file}: ${(e as NodeJS.ErrnoException).code === 'ENOENT' ? 'the folder does not exist' : (e as Error).message}`);
  }
}

function inspectCommand(flags: Flags, positionals: string[], io: CliIo): number {
  if (flags.operator !== undefined) {
    if (positionals.length > 0) throw new UserError('give either a network FILE or --operator FILE, not both');
    const { operatorInspect } = require('./operator') as typeof import('./operator');
    return operatorInspect(flags.operator, numberFlag('precision', flags.precision, (v) => v > 0, 'a positive standard error, e.g. 0.5'), flags.json, io);
  }
  const { file, format } = fileFlags(flags, positionals, 'inspect');
  const { network, warnings } = loadNetwork(file, { ...(flags.depots ? { depots: flags.depots } : {}), ...(format ? { format } : {}) });
  const { formatIssue } = require('../../shared/formats') as typeof import('../../shared/formats');
  warn(io, warnings.map(formatIssue));
  const problem = problemFrom(network, { problem: flags.problem, k: flags.k, tolerance: flags.tolerance, pins: flags.pin });
  const precision = numberFlag('precision', flags.precision, (v) => v > 0, 'a positive standard error, e.g. 0.5');
  let summary;
  try {
    summary = orchestrate().describeEncoding(problem, precision !== undefined ? { precision } : {});
  } catch (e) {
    if (e instanceof Error && /Pauli terms/.test(e.message)) throw new UserError(e.message);
    throw e;
  }
  const report = inspectReport(file, problem, summary);
  io.out(flags.json ? JSON.stringify(report) : inspectText(report));
  return 0;
}

function solversCommand(flags: Flags, io: CliIo): number {
  const list = registry().listSolvers();
  io.out(flags.json ? JSON.stringify(list) : solversText(list));
  return 0;
}

/** SIGINT handling shared with the bootstrap: the first Ctrl-C asks the solver to stop. */
export interface Signals {
  onInterrupt: (() => void) | null;
}

const USER_ERRORS = new Set(['UserError', 'UnknownSolverError', 'SolverRefusedError', 'SettingsError', 'ProblemError']);

/** Runs one command; returns the exit code. Never calls process.exit (tests call it directly). */
export async function main(argv: string[], io: CliIo, signals: Signals = { onInterrupt: null }): Promise<number> {
  try {
    let parsed;
    try {
      parsed = parseArgs({ args: argv, options: OPTIONS, allowPositionals: true, strict: true });
    } catch (e) {
      const err = e as Error & { code?: string };
      const flag = /'(-[^' ]+)/.exec(err.message)?.[1];
      const message = err.code === 'ERR_PARSE_ARGS_UNKNOWN_OPTION' && flag ? `unknown flag ${flag}`
        : err.code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE' && flag ? `flag ${flag} needs a value`
        : err.message.replace(/\s+/g, ' ');
      throw new UserError(message, [USAGE]);
    }
    const { values: flags, positionals } = parsed;
    const [command, ...rest] = positionals;
    if (flags.help || command === 'help' || command === undefined) {
      (command === undefined && !flags.help ? io.err : io.out)(USAGE);
      return command === undefined && !flags.help ? 2 : 0;
    }
    switch (command) {
      case 'solve': return await solveCommand(flags, rest, io, signals);
      case 'inspect': return inspectCommand(flags, rest, io);
      case 'solvers': return solversCommand(flags, io);
      default: throw new UserError(`unknown command "${command}"; use solve, inspect, solvers or help`, [USAGE]);
    }
  } catch (e) {
    if (e instanceof Error && USER_ERRORS.has(e.name)) {
      io.err(`spinyard: ${e.name === 'SettingsError' ? `solver settings: ${e.message}` : e.message}`);
      for (const d of (e as UserError).details ?? []) io.err(d.startsWith('usage:') ? d : `spinyard: ${d}`);
      return 2;
    }
    io.err(`spinyard: internal error: ${e instanceof Error ? e.stack ?? e.message : String(e)}`);
    return 1;
  }
}

/** Entry point used by spinyard.cjs: wires stdout/stderr, Ctrl-C and the exit code. */
export function runCli(argv: string[]): void {
  const signals: Signals = { onInterrupt: null };
  let interrupts = 0;
  process.on('SIGINT', () => {
    interrupts++;
    if (interrupts === 1 && signals.onInterrupt) signals.onInterrupt();
    else process.exit(130);
  });
  const io: CliIo = {
    out: (text) => process.stdout.write(text + '\n'),
    err: (text) => process.stderr.write(text + '\n'),
    errIsTty: Boolean(process.stderr.isTTY),
  };
  main(argv, io, signals).then((code) => {
    process.exitCode = code;
    // Solvers may leave worker threads or timers behind; do not wait for them once output is flushed.
    process.stdout.write('', () => process.stderr.write('', () => process.exit(code)));
  });
}
