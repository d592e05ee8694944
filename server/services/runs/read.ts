import { Op, type WhereOptions } from 'sequelize';
import type { Deps } from '../../deps';
import { notFound } from '../../lib/http-error';
import { getSolver } from '../../../shared/engine/solvers/registry';
import type { JobView, ProblemInput, RunListItem, RunListQuery, RunView } from '../../../shared/schemas/runs';
import type { RunRow } from '../../models/run';
import type { RunJobRow } from '../../models/run-job';
import { bestKnownFor } from './best-known';

/**
 * Reading runs: one run with its jobs and checked results, and the organisation's run list.
 * Every query is scoped to the organisation. Nothing here writes.
 */

/** What the run service's modules use of Deps; billing only through `runHooks` (run-hooks.ts). */
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

/** The run row (not deleted) of this organisation, or 404. */
export async function findRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<RunRow> {
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
  const problem = parseJson(run.problem, { kind: 'maxcut' } as ProblemInput);
  return {
    id: run.id,
    status: run.status,
    problem,
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
    bestKnown: await bestKnownFor(deps, organisationId, run.versionId, problem),
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
