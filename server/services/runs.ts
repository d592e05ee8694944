import { Op, type WhereOptions } from 'sequelize';
import type { Deps } from '../deps';
import { HttpError, conflict, notFound } from '../lib/http-error';
import { can } from '../../shared/permissions';
import { formatMoney, planLabel, runLimits, type RunPrice } from '../../shared/plans';
import { bestOf } from '../../shared/engine/problem/compare';
import { senseOf } from '../../shared/engine/problem/types';
import { getSolver } from '../../shared/engine/solvers/registry';
import { describeEncoding, estimatedPauliTerms } from '../../shared/engine/solvers/orchestrate';
import {
  deriveRunStatus, type CreateRunBody, type JobStatus, type JobView, type PreviewBody, type ProblemInput, type RunListItem, type RunListQuery, type RunStatus, type RunView,
} from '../../shared/schemas/runs';
import type { RunRow } from '../models/run';
import type { RunJobRow } from '../models/run-job';
import { getVersionDocument } from './networks';
import { writeCsvTable } from '../../shared/formats/csv-cells';
import { assertQueueUp, enqueueJobs, removeEntries, requestCancel, type SolveJobData } from './queue';
import { refreshRunStatus } from './runs-status';
import { assertStartable, effectivePlan, planLimitError, planRun, type RunActor } from './runs/planning';
import { partWord } from '../../shared/runs/regions';

/** Who asks (see runs/planning.ts). */
export type { RunActor } from './runs/planning';

export type RunServiceDeps = Pick<Deps, 'db' | 'models' | 'redis' | 'mailer' | 'config' | 'logger' | 'runHooks'>;

const iso = (d: Date | null | undefined): string | null => (d ? new Date(d).toISOString() : null);
const parseJson = <T>(text: string | null | undefined, fallback: T): T => {
  if (!text) return fallback;
  try {
    return JSON.parse(text) as T;
  } catch {
    return fallback;
  }
};

/** Above this many estimated Pauli terms the preview does not build the operator in the API process. */
const PREVIEW_MAX_TERMS = 300_000;

/**
 * Create a run: plan it (runs/planning.ts: problem, solvers, rights, size and price — the same
 * planning the preview shows), write the run and its jobs in one transaction, and put the jobs
 * on the queue after commit (the reconciler re-adds any that did not make it). A priced run, or
 * `hold`, is created awaiting payment (off the queue until releaseRun).
 */
export async function createRun(deps: RunServiceDeps, actor: RunActor, body: CreateRunBody, opts: { hold?: boolean } = {}): Promise<{ id: number; status: RunStatus; price: RunPrice | null }> {
  const planned = await planRun(deps, actor, body);
  assertStartable(planned);
  const { problem, networkId, solvers, limits, seconds, plan } = planned;
  const price = planned.quote.price;
  const ceiling = effectivePlan(planned);
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
      solvers.map((c, position) => ({
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

/**
 * The preview: the same planning as createRun (nothing is written) shown per solver — qubits,
 * refusal, whether the role may use its settings — plus the encoding summary of the widest circuit
 * a chosen solver simulates, the price or the size refusal, and `blockers`: every reason the run
 * would not start (the app disables Start while there is one).
 */
export async function previewRun(deps: RunServiceDeps, actor: RunActor, body: PreviewBody) {
  const planned = await planRun(deps, actor, body);
  const { problem, solvers, plan, limits, seconds, quote } = planned;
  // Describe what a chosen solver will simulate (k regions: the first split), else the direct encoding.
  const chosen = solvers.map((c) => c.definition.circuit(problem, c.parsed)).find((c) => c !== null) ?? null;
  const target = chosen ?? { problem, options: {}, what: `the direct ${problem.kind === 'kway' ? 'one-hot k-way' : problem.kind} encoding (no chosen solver simulates a circuit)` };
  let encoding: ReturnType<typeof describeEncoding> | null = null;
  let encodingNote: string | null = null;
  try {
    const terms = estimatedPauliTerms(target.problem);
    if (terms > PREVIEW_MAX_TERMS) throw new Error(`the ${problem.kind} operator would have about ${Math.round(terms).toLocaleString('en')} Pauli terms; too large to summarise here (the variational solvers would refuse it; qaoa-blocks splits it into blocks)`);
    encoding = describeEncoding(target.problem, { ...target.options, ...(body.precision !== undefined ? { precision: body.precision } : {}) });
  } catch (e) {
    encodingNote = (e as Error).message;
  }
  const limitProblem = planned.limitRefusal ? planLimitError(plan, planned.limitRefusal).message : null;
  const blockers = [
    ...Object.values(planned.fields).flat(),
    ...Object.values(planned.refusals).flat(),
    ...(planned.forbidden ? [planned.forbidden] : []),
    ...(limitProblem ? [limitProblem] : []),
  ];
  // Each solver may use its time limit, then the orchestrator spends up to min(10 s, limit/5) on bounds.
  const boundSeconds = Math.min(10, Math.max(0.5, seconds / 5));
  return {
    depots: problem.network.n,
    lanes: problem.network.m,
    encoding,
    /** Which circuit the encoding summary describes, in words. */
    circuit: target.what,
    encodingNote,
    plan: { id: plan, label: planLabel(plan), limits },
    limitProblem,
    /** Billing: the price when this is a paid run (null = free or refused), and whether the credits cover it. */
    price: quote.price ? { ...quote.price, label: formatMoney(quote.price) } : null,
    quote,
    fields: planned.fields,
    forbidden: planned.forbidden,
    blockers,
    startable: blockers.length === 0,
    solvers: solvers.map((c) => ({
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
    const d = getSolver(row.solver);
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
  const rows = (await deps.models.Network.findAll({ where: { id: [...new Set(ids)] }, attributes: ['id', 'name'], raw: true })) as unknown as Array<{ id: number; name: string }>;
  return new Map(rows.map((r) => [r.id, r.name]));
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
  // Plain rows of just the listed columns (no model instances): the busiest list under load (docs/benchmarks.md, Load).
  const listed = ['id', 'status', 'problem', 'networkId', 'versionId', 'depotCount', 'createdAt', 'finishedAt'] as const;
  const rows = (await deps.models.Run.findAll({ where, order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: query.limit, raw: true, attributes: [...listed] })) as unknown as Array<Pick<RunRow, (typeof listed)[number]>>;
  const ids = rows.map((r) => r.id);
  const jobs = ids.length ? ((await deps.models.RunJob.findAll({ where: { runId: { [Op.in]: ids } }, attributes: ['runId', 'solver'], order: [['runId', 'ASC'], ['position', 'ASC']], raw: true })) as unknown as Array<{ runId: number; solver: string }>) : [];
  const solversOf = new Map<number, string[]>();
  for (const j of jobs) {
    const list = solversOf.get(j.runId) ?? [];
    list.push(j.solver);
    solversOf.set(j.runId, list);
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
  const withResult = view.jobs.filter((j) => j.result !== null);
  if (withResult.length === 0) throw conflict('This run has no result yet; download it once a solver has finished.');
  // problem/compare.ts: a feasible answer first, then the better value.
  return bestOf(senseOf(view.problem.kind), withResult, (j) => ({ value: j.result!.value, feasible: !j.result!.infeasible }))!;
}

/** CSV: depot id, name, side (max-cut, bisection) or region (k-way) of the chosen job. */
export async function assignmentCsv(deps: RunServiceDeps, organisationId: number, id: number, jobId?: number): Promise<{ fileName: string; body: string }> {
  const view = await getRun(deps, organisationId, id);
  const job = pickJob(view, jobId);
  const document = await getVersionDocument(deps as Deps, organisationId, view.versionId);
  const column = partWord(view.problem.kind);
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
