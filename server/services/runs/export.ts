import type { Deps } from '../../deps';
import { conflict, notFound } from '../../lib/http-error';
import { bestOf } from '../../../shared/engine/problem/compare';
import { senseOf } from '../../../shared/engine/problem/types';
import { writeCsvTable } from '../../../shared/formats/csv-cells';
import { partWord } from '../../../shared/runs/regions';
import type { JobView, RunView } from '../../../shared/schemas/runs';
import { getVersionDocument } from '../networks';
import { getRun, type RunServiceDeps } from './read';

/** Exporting runs: the assignment CSV and the JSON report, both from the best (or chosen) answer. */

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
