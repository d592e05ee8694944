import { Op, type WhereOptions } from 'sequelize';
import type { Deps } from '../deps';
import { HttpError, badRequest, conflict, forbidden, notFound } from '../lib/http-error';
import { can, type Role } from '../../shared/permissions';
import { formatMoney, nextPlan, paidRunPlan, planLabel, runLimits, type PlanRunLimits, type RunPrice } from '../../shared/plans';
import { buildCompactNetwork } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { NetworkDocument } from '../../shared/engine/network/types';
import type { Problem, ProblemSpec } from '../../shared/engine/problem/types';
import type { AnySolverDefinition } from '../../shared/engine/solvers/registry';
import {
  deriveRunStatus, type CreateRunBody, type JobStatus, type JobView, type PreviewBody, type ProblemInput, type RunListItem, type RunListQuery, type RunStatus, type RunView,
} from '../../shared/schemas/runs';
import type { RunRow } from '../models/run';
import type { RunJobRow } from '../models/run-job';
import { getVersionDocument } from './networks';
import { writeCsvTable } from '../../shared/formats/csv-cells';
import { assertQueueUp, enqueueJobs, removeEntries, requestCancel, type SolveJobData } from './queue';
import { loadRunsConfig } from './queue-config';
import { refreshRunStatus } from './runs-status';
import { quoteRun } from './pricing';

type Registry = typeof import('../../shared/engine/solvers/registry');
type Orchestrate = typeof import('../../shared/engine/solvers/orchestrate');
// Loaded on first use: the API starts without loading every solver (as the CLI does).
const registry = (): Registry => require('../../shared/engine/solvers/registry');
const orchestrate = (): Orchestrate => require('../../shared/engine/solvers/orchestrate');

/** Who asks: the organisation every query is scoped to, the user, and the role for `runs:advanced`. */
export interface RunActor {
  organisationId: number;
  userId: number | null;
  role: Role | null;
}

export type RunServiceDeps = Pick<Deps, 'db' | 'models' | 'redis' | 'mailer' | 'config' | 'logger' | 'runHooks'>;

/** Solvers that simulate fewer qubits than the direct encoding (decomposition) say how many. */
interface QubitAware {
  simulatedQubits?: (problem: Problem, settings: unknown) => number;
}

const iso = (d: Date | null | undefined): string | null => (d ? new Date(d).toISOString() : null);
const parseJson = <T>(text: string | null | undefined, fallback: T): T => {
  if (!text) return fallback;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
};

/** Key-order independent JSON, to compare settings with the defaults. */
function stable(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(stable).join(',')}]`;
  if (value && typeof value === 'object') {
    return `{${Object.keys(value as object).sort().map((k) => `${JSON.stringify(k)}:${stable((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return JSON.stringify(value ?? null);
}

async function planOf(deps: RunServiceDeps, organisationId: number): Promise<string> {
  const org = await deps.models.Organisation.findByPk(organisationId);
  return org?.plan ?? 'free';
}

function planLimit(plan: string, message: string, limit: string): HttpError {
  const up = nextPlan(plan);
  const todo = up ? `Upgrade to the ${planLabel(up)} plan (Billing) or make the run smaller.` : 'Make the run smaller.';
  return new HttpError(402, `${message} ${todo}`, { code: 'plan_limit', limit, plan });
}

interface CheckedEntry {
  definition: AnySolverDefinition;
  /** Settings as given (stored; the worker parses them again). */
  settings: Record<string, unknown>;
  isDefault: boolean;
  refusal: string | null;
  qubits: number | null;
}

/**
 * Qubits of the direct encoding. Building the operator is cheap for small networks; beyond
 * DIRECT_QUBITS_EXACT free depots every encoding needs at least one qubit per free depot, which is
 * over every plan's limit anyway, so the API thread never builds a large operator just to refuse it.
 */
const DIRECT_QUBITS_EXACT = 40;
function directQubits(problem: Problem): number {
  let free = 0;
  for (let i = 0; i < problem.pins.length; i++) if (problem.pins[i] < 0) free++;
  return free > DIRECT_QUBITS_EXACT ? free : orchestrate().qubitsFor(problem) ?? free;
}

/** Above this many estimated Pauli terms the preview does not build the operator in the API process. */
const PREVIEW_MAX_TERMS = 300_000;

/** Field errors of the solver entries: unknown names, kinds, settings out of range. */
function checkEntries(problem: Problem, entries: CreateRunBody['solvers']): { checked: CheckedEntry[]; fields: Record<string, string[]> } {
  const { getSolver } = registry();
  const fields: Record<string, string[]> = {};
  const checked: CheckedEntry[] = [];
  entries.forEach((entry, i) => {
    let definition: AnySolverDefinition;
    try {
      definition = getSolver(entry.solver);
    } catch (e) {
      fields[`solvers.${i}.solver`] = [(e as Error).message];
      return;
    }
    if (!definition.kinds.includes(problem.kind)) {
      fields[`solvers.${i}.solver`] = [`${definition.name} answers ${definition.kinds.join(', ')}, not ${problem.kind}; choose another solver`];
      return;
    }
    let parsed: unknown;
    try {
      parsed = definition.parseSettings(entry.settings ?? {});
    } catch (e) {
      const f = (e as { fields?: Record<string, string> }).fields;
      if (f) for (const [k, v] of Object.entries(f)) fields[`solvers.${i}.settings.${k}`] = [v];
      else fields[`solvers.${i}.settings`] = [(e as Error).message];
      return;
    }
    const isDefault = entry.settings === undefined || stable(parsed) === stable(definition.parseSettings({}));
    const refusal = definition.refuses(problem, parsed);
    let qubits: number | null = null;
    const aware = definition as AnySolverDefinition & QubitAware;
    if (aware.simulatedQubits) qubits = aware.simulatedQubits(problem, parsed);
    else if (definition.family === 'variational') qubits = directQubits(problem);
    checked.push({ definition, settings: entry.settings ?? {}, isDefault, refusal, qubits });
  });
  return { checked, fields };
}

async function loadProblem(deps: RunServiceDeps, organisationId: number, versionId: number, spec: ProblemInput) {
  const version = await deps.models.NetworkVersion.findOne({ where: { id: versionId, organisationId }, attributes: ['id', 'networkId', 'depotCount'] });
  if (!version) throw notFound('Network version');
  const document: NetworkDocument = await getVersionDocument(deps as Deps, organisationId, versionId);
  let problem: Problem;
  try {
    problem = bindProblem(buildCompactNetwork(document), spec as ProblemSpec);
  } catch (e) {
    throw badRequest((e as Error).message, { problem: [(e as Error).message] });
  }
  return { problem, networkId: version.get('networkId') as number, document };
}

function checkLimits(limits: PlanRunLimits, plan: string, problem: Problem, checked: CheckedEntry[], seconds: number): void {
  const label = planLabel(plan);
  if (problem.network.n > limits.maxDepots) {
    throw planLimit(plan, `The ${label} plan runs networks of up to ${limits.maxDepots} depots; this one has ${problem.network.n}.`, 'depots');
  }
  if (seconds > limits.maxSecondsPerSolver) {
    throw planLimit(plan, `The ${label} plan gives each solver at most ${limits.maxSecondsPerSolver} s; ${seconds} s were asked for.`, 'seconds');
  }
  for (const c of checked) {
    if (c.qubits !== null && c.qubits > limits.maxQubits && c.refusal === null) {
      throw planLimit(plan, `${c.definition.name} would simulate ${c.qubits} qubits; the ${label} plan allows ${limits.maxQubits}. Try the decomposition solver (qaoa-blocks) or a classical one.`, 'qubits');
    }
  }
}

/** What the price depends on (billing's priceOfRun): size, time, and each solver's family and qubits. */
function runSizeOf(problem: Problem, checked: CheckedEntry[], seconds: number) {
  return { depots: problem.network.n, secondsPerSolver: seconds, solvers: checked.map((c) => ({ family: c.definition.family, qubits: c.qubits })) };
}

/**
 * Create a run: check the version, the problem, every solver entry (settings, refusals, the
 * role's right to non-default settings) and the plan's limits; write the run and its jobs in one
 * transaction; put the jobs on the queue after commit (the reconciler re-adds any that did not
 * make it). `hold` creates it awaiting payment (off the queue until releaseRun).
 */
export async function createRun(deps: RunServiceDeps, actor: RunActor, body: CreateRunBody, opts: { hold?: boolean } = {}): Promise<{ id: number; status: RunStatus; price: RunPrice | null }> {
  const rc = loadRunsConfig();
  const { problem, networkId } = await loadProblem(deps, actor.organisationId, body.versionId, body.problem);
  const { checked, fields } = checkEntries(problem, body.solvers);
  if (Object.keys(fields).length > 0) throw badRequest('Some solver choices are not valid.', fields);
  const refusals: Record<string, string[]> = {};
  checked.forEach((c, i) => { if (c.refusal !== null) refusals[`solvers.${i}.solver`] = [`${c.definition.name} refuses this problem: ${c.refusal}`]; });
  if (Object.keys(refusals).length > 0) throw badRequest('Some solvers cannot take this problem.', refusals);
  if (!can(actor.role, 'runs:advanced') && checked.some((c) => !c.isDefault)) {
    throw forbidden(`Your role (${actor.role ?? 'none'}) may start runs with the default solver settings only; remove the custom settings or ask an analyst or admin (runs:advanced).`);
  }
  const plan = await planOf(deps, actor.organisationId);
  const limits = runLimits(plan);
  const seconds = body.timeLimitSeconds ?? Math.min(rc.RUN_DEFAULT_SECONDS, limits.maxSecondsPerSolver);
  // Billing: above the plan's included size a run is priced (up to the paid ceiling) and held until paid.
  // A paid run may go up to the next plan's limits.
  const { price } = await quoteRun(deps, actor.organisationId, runSizeOf(problem, checked, seconds));
  const ceiling = price ? paidRunPlan(plan) : plan;
  checkLimits(runLimits(ceiling), ceiling, problem, checked, seconds);
  const active = await deps.models.Run.count({ where: { organisationId: actor.organisationId, status: ['queued', 'running'], deletedAt: null } });
  if (active >= limits.maxActiveRuns) {
    throw new HttpError(429, `Your organisation already has ${active} runs waiting or running (the ${planLabel(plan)} plan allows ${limits.maxActiveRuns} at once). Wait for some to finish or cancel one.`, { code: 'too_many_runs' });
  }
  const held = !!opts.hold || price !== null;
  if (!held) await assertQueueUp(deps.redis);

  const now = new Date();
  const { run, jobs } = await deps.db.transaction(async (transaction) => {
    const run = await deps.models.Run.create(
      {
        organisationId: actor.organisationId, networkId, versionId: body.versionId, createdBy: actor.userId, problem: JSON.stringify(body.problem),
        status: held ? 'awaiting_payment' : 'queued', held, releasedAt: held ? null : now, priority: price ? Math.min(limits.priority, runLimits(ceiling).priority) : limits.priority, seed: body.seed ?? 1, timeLimitSeconds: seconds, depotCount: problem.network.n,
      },
      { transaction },
    );
    const runId = run.get('id') as number;
    const jobs = await deps.models.RunJob.bulkCreate(
      checked.map((c, position) => ({
        runId, organisationId: actor.organisationId, position, solver: c.definition.name, settings: JSON.stringify(c.settings), status: 'queued' as JobStatus, queuedAt: now,
      })),
      { transaction },
    );
    if (price) await deps.runHooks.recordCharge({ runId, organisationId: actor.organisationId, price }, transaction);
    return { run, jobs };
  });
  const runId = run.get('id') as number;
  if (!held) {
    const entries: SolveJobData[] = jobs.map((j) => ({ jobId: j.get('id') as number, runId, organisationId: actor.organisationId, generation: 0 }));
    try {
      await enqueueJobs(deps, entries, limits.priority);
    } catch (err) {
      deps.logger.warn({ err, runId }, "enqueue after commit failed; the workers' periodic reconciler will add the jobs");
    }
  }
  return { id: runId, status: held ? 'awaiting_payment' : 'queued', price };
}

/** Put a held run's jobs on the queue (billing calls this once payment is through). */
export async function releaseRun(deps: RunServiceDeps, runId: number): Promise<boolean> {
  const [changed] = await deps.models.Run.update({ held: false, releasedAt: new Date() }, { where: { id: runId, held: true, deletedAt: null } });
  if (!changed) return false;
  const run = (await deps.models.Run.findByPk(runId))!;
  const jobs = await deps.models.RunJob.findAll({ where: { runId, status: 'queued' } });
  await refreshRunStatus(deps, runId);
  await enqueueJobs(deps, jobs.map((j) => ({ jobId: j.get('id') as number, runId, organisationId: run.get('organisationId') as number, generation: j.get('generation') as number })), run.get('priority') as number);
  return true;
}

/** The encoding summary, per-solver refusals and time budgets — nothing is written. */
export async function previewRun(deps: RunServiceDeps, actor: RunActor, body: PreviewBody) {
  const rc = loadRunsConfig();
  const { problem } = await loadProblem(deps, actor.organisationId, body.versionId, body.problem);
  const { checked, fields } = checkEntries(problem, body.solvers);
  const plan = await planOf(deps, actor.organisationId);
  const limits = runLimits(plan);
  const seconds = body.timeLimitSeconds ?? Math.min(rc.RUN_DEFAULT_SECONDS, limits.maxSecondsPerSolver);
  let encoding: ReturnType<Orchestrate['describeEncoding']> | null = null;
  let encodingNote: string | null = null;
  try {
    const terms = orchestrate().estimatedPauliTerms(problem);
    if (terms > PREVIEW_MAX_TERMS) throw new Error(`the direct ${problem.kind} operator would have about ${Math.round(terms).toLocaleString('en')} Pauli terms; too large to summarise here (the variational solvers would refuse it; qaoa-blocks splits it into blocks)`);
    encoding = orchestrate().describeEncoding(problem, body.precision !== undefined ? { precision: body.precision } : {});
  } catch (e) {
    encodingNote = (e as Error).message;
  }
  const quote = await quoteRun(deps, actor.organisationId, runSizeOf(problem, checked, seconds));
  let limitProblem: string | null = null;
  try {
    const ceiling = quote.price ? paidRunPlan(plan) : plan;
    checkLimits(runLimits(ceiling), ceiling, problem, checked, seconds);
  } catch (e) {
    limitProblem = (e as Error).message;
  }
  // Each solver may use its time limit, then the orchestrator spends up to min(10 s, limit/5) on bounds.
  const boundSeconds = Math.min(10, Math.max(0.5, seconds / 5));
  return {
    depots: problem.network.n,
    lanes: problem.network.m,
    encoding,
    encodingNote,
    plan: { id: plan, label: planLabel(plan), limits },
    limitProblem,
    /** Billing: the price when this is a paid run (null = free), and whether the credits cover it. */
    price: quote.price ? { ...quote.price, label: formatMoney(quote.price) } : null,
    quote,
    fields,
    solvers: checked.map((c) => ({
      solver: c.definition.name,
      label: c.definition.label,
      family: c.definition.family,
      guarantee: c.definition.guarantee,
      refusal: c.refusal,
      defaultSettings: c.isDefault,
      needsAdvanced: !c.isDefault,
      allowed: c.isDefault || can(actor.role, 'runs:advanced'),
      qubits: c.qubits,
      estimatedSeconds: { atMost: seconds + boundSeconds, note: 'anytime solvers stop at the time limit; exact ones may finish sooner' },
    })),
  };
}

function jobView(row: RunJobRow): JobView {
  let label = row.solver, family = 'unknown';
  try {
    const d = registry().getSolver(row.solver);
    label = d.label;
    family = d.family;
  } catch {
    // a solver that was removed since: its stored results stay readable
  }
  return {
    id: row.id,
    position: row.position,
    solver: row.solver,
    label,
    family,
    settings: parseJson(row.settings, {}),
    status: row.status,
    progress: row.status === 'succeeded' ? 1 : row.progress,
    live: parseJson(row.live, null),
    attempt: row.attempt,
    queuedAt: iso(row.queuedAt),
    startedAt: iso(row.startedAt),
    finishedAt: iso(row.finishedAt),
    result: parseJson(row.result, null),
    error: row.error,
  };
}

async function findRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<RunRow> {
  const row = await deps.models.Run.findOne({ where: { id, organisationId, deletedAt: null } });
  if (!row) throw notFound('Run');
  return row.get({ plain: true }) as RunRow;
}

async function networkNames(deps: RunServiceDeps, ids: number[]): Promise<Map<number, string>> {
  if (ids.length === 0) return new Map();
  const rows = await deps.models.Network.findAll({ where: { id: [...new Set(ids)] }, attributes: ['id', 'name'] });
  return new Map(rows.map((r) => [r.get('id') as number, r.get('name') as string]));
}

export async function getRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<RunView> {
  const run = await findRun(deps, organisationId, id);
  const jobs = await deps.models.RunJob.findAll({ where: { runId: id, organisationId }, order: [['position', 'ASC']] });
  const names = await networkNames(deps, [run.networkId]);
  return {
    id: run.id,
    status: run.status,
    problem: parseJson(run.problem, { kind: 'maxcut' } as ProblemInput),
    networkId: run.networkId,
    versionId: run.versionId,
    networkName: names.get(run.networkId) ?? null,
    depotCount: run.depotCount,
    timeLimitSeconds: run.timeLimitSeconds,
    seed: run.seed,
    createdBy: run.createdBy,
    createdAt: iso(run.createdAt)!,
    releasedAt: iso(run.releasedAt),
    finishedAt: iso(run.finishedAt),
    jobs: jobs.map((j) => jobView(j.get({ plain: true }) as RunJobRow)),
  };
}

export async function listRuns(deps: RunServiceDeps, organisationId: number, query: RunListQuery): Promise<RunListItem[]> {
  const where: WhereOptions<RunRow> = { organisationId, deletedAt: null };
  if (query.networkId) Object.assign(where, { networkId: query.networkId });
  if (query.status) Object.assign(where, { status: query.status });
  const rows = (await deps.models.Run.findAll({ where, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: query.limit })).map((r) => r.get({ plain: true }) as RunRow);
  const ids = rows.map((r) => r.id);
  const jobs = ids.length ? await deps.models.RunJob.findAll({ where: { runId: { [Op.in]: ids } }, attributes: ['runId', 'solver', 'position'], order: [['position', 'ASC']] }) : [];
  const solversOf = new Map<number, string[]>();
  for (const j of jobs) {
    const list = solversOf.get(j.get('runId') as number) ?? [];
    list.push(j.get('solver') as string);
    solversOf.set(j.get('runId') as number, list);
  }
  const names = await networkNames(deps, rows.map((r) => r.networkId));
  return rows.map((r) => ({
    id: r.id, status: r.status, problem: parseJson(r.problem, { kind: 'maxcut' } as ProblemInput), networkId: r.networkId, versionId: r.versionId,
    networkName: names.get(r.networkId) ?? null, depotCount: r.depotCount, solvers: solversOf.get(r.id) ?? [], createdAt: iso(r.createdAt)!, finishedAt: iso(r.finishedAt),
  }));
}

/**
 * Cancel: queued jobs become cancelled at once (and leave the queue); running ones get the
 * cancel flag — their worker stops the solver within about a second and stores the best answer
 * found so far (status cancelled).
 */
export async function cancelRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<RunView> {
  await findRun(deps, organisationId, id);
  await assertQueueUp(deps.redis);
  const jobs = (await deps.models.RunJob.findAll({ where: { runId: id, status: ['queued', 'running'] } })).map((j) => j.get({ plain: true }) as RunJobRow);
  if (jobs.length === 0) throw conflict('Nothing to cancel: every job of this run has finished.');
  // Flag first, so a worker that is claiming a queued job right now still sees it.
  await requestCancel(deps, jobs);
  const queued = jobs.filter((j) => j.status === 'queued');
  if (queued.length > 0) {
    await deps.models.RunJob.update(
      { status: 'cancelled', finishedAt: new Date(), error: 'cancelled before it started' },
      { where: { id: queued.map((j) => j.id), status: 'queued' } },
    );
    await removeEntries(deps, queued.map((j) => ({ jobId: j.id, generation: j.generation })));
  }
  await refreshRunStatus(deps, id);
  return getRun(deps, organisationId, id);
}

/**
 * Retry the failed and cancelled jobs of a run (each becomes a new generation on the queue). A
 * run whose price was given back must be paid again first (billing's rerunNeedsPayment): it stays
 * held, awaiting payment, with its jobs queued behind the payment.
 */
export async function retryRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<RunView> {
  await findRun(deps, organisationId, id);
  await assertQueueUp(deps.redis);
  const { entries, held, priority } = await deps.db.transaction(async (transaction) => {
    const run = (await deps.models.Run.findOne({ where: { id, organisationId, deletedAt: null }, lock: transaction.LOCK.UPDATE, transaction }))!;
    const jobs = (await deps.models.RunJob.findAll({ where: { runId: id, status: ['failed', 'cancelled'] }, transaction })).map((j) => j.get({ plain: true }) as RunJobRow);
    if (jobs.length === 0) throw conflict('Nothing to retry: no job of this run failed or was cancelled.');
    const held = (run.get('held') as boolean) || (await deps.runHooks.rerunNeedsPayment(id, transaction));
    const entries: SolveJobData[] = [];
    for (const j of jobs) {
      const [changed] = await deps.models.RunJob.update(
        { status: 'queued', generation: j.generation + 1, progress: 0, live: null, result: null, error: null, startedAt: null, finishedAt: null, queuedAt: new Date(), worker: null },
        { where: { id: j.id, status: j.status, generation: j.generation }, transaction },
      );
      if (changed) entries.push({ jobId: j.id, runId: id, organisationId, generation: j.generation + 1 });
    }
    await run.update(held ? { held: true } : { releasedAt: new Date() }, { transaction });
    return { entries, held, priority: run.get('priority') as number };
  });
  await refreshRunStatus(deps, id);
  if (!held) await enqueueJobs(deps, entries, priority);
  return getRun(deps, organisationId, id);
}

/** Hide a run (cancelling what still runs); its rows stay for the audit trail. */
export async function deleteRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<void> {
  await findRun(deps, organisationId, id);
  const live = (await deps.models.RunJob.findAll({ where: { runId: id, status: ['queued', 'running'] } })).map((j) => j.get({ plain: true }) as RunJobRow);
  if (live.length > 0) {
    await assertQueueUp(deps.redis);
    await requestCancel(deps, live);
    await deps.models.RunJob.update({ status: 'cancelled', finishedAt: new Date(), error: 'the run was deleted' }, { where: { id: live.map((j) => j.id), status: 'queued' } });
    await removeEntries(deps, live.filter((j) => j.status === 'queued').map((j) => ({ jobId: j.id, generation: j.generation })));
  }
  await deps.models.Run.update({ deletedAt: new Date() }, { where: { id, organisationId } });
}

/** The job whose answer a download uses: the one asked for, else the best feasible finished one. */
function pickJob(view: RunView, jobId?: number): JobView {
  if (jobId !== undefined) {
    const j = view.jobs.find((x) => x.id === jobId);
    if (!j) throw notFound('Job');
    if (!j.result) throw conflict(`Job ${jobId} has no result yet (status ${j.status}).`);
    return j;
  }
  const max = view.problem.kind === 'maxcut';
  const withResult = view.jobs.filter((j) => j.result !== null);
  if (withResult.length === 0) throw conflict('This run has no result yet; download it once a solver has finished.');
  const feasible = withResult.filter((j) => !j.result!.infeasible);
  const pool = feasible.length > 0 ? feasible : withResult;
  return pool.reduce((best, j) => ((max ? j.result!.value > best.result!.value : j.result!.value < best.result!.value) ? j : best));
}

/** CSV: depot id, name, side (max-cut, bisection) or region (k-way) of the chosen job. */
export async function assignmentCsv(deps: RunServiceDeps, organisationId: number, id: number, jobId?: number): Promise<{ fileName: string; body: string }> {
  const view = await getRun(deps, organisationId, id);
  const job = pickJob(view, jobId);
  const document = await getVersionDocument(deps as Deps, organisationId, view.versionId);
  const column = view.problem.kind === 'kway' ? 'region' : 'side';
  const rows = document.depots.map((d, i) => [d.id, d.name, job.result!.assignment[i]]);
  return { fileName: `run-${id}-${job.solver}.csv`, body: writeCsvTable(['depot_id', 'depot_name', column], rows, '\r\n') };
}

/** JSON report: the run, every job with its checked result, and which answer is best. */
export async function runReport(deps: RunServiceDeps, organisationId: number, id: number) {
  const view = await getRun(deps, organisationId, id);
  const document = await getVersionDocument(deps as Deps, organisationId, view.versionId);
  let best: { jobId: number; solver: string; value: number; bound: number | null; gap: number | null } | null = null;
  try {
    const j = pickJob(view);
    best = { jobId: j.id, solver: j.solver, value: j.result!.value, bound: j.result!.bound, gap: j.result!.gap };
  } catch {
    best = null;
  }
  return {
    format: 'spinyard-run-report',
    generatedAt: new Date().toISOString(),
    run: view,
    network: { id: view.networkId, versionId: view.versionId, name: view.networkName, depots: document.depots.map((d) => ({ id: d.id, name: d.name ?? null })) },
    best,
    note: 'Values are recomputed from each assignment; bounds are proven limits on the optimum. Variational and heuristic results carry no optimality guarantee.',
  };
}

/** Status of a run, from the stored jobs (for tests and the SSE stream's first message). */
export function statusOf(jobs: JobStatus[], held: boolean): RunStatus {
  return deriveRunStatus(jobs, held);
}
