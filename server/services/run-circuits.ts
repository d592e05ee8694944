import { buildCompactNetwork } from '../../shared/engine/network/build';
import { bindProblem } from '../../shared/engine/problem/bind';
import type { ProblemSpec } from '../../shared/engine/problem/types';
import { DEVICE_DEFAULTS, defaultAssumptions } from '../../shared/engine/circuits/device';
import { runQasm } from '../../shared/engine/circuits/export';
import { analyseRun, withReference } from '../../shared/engine/circuits/run-analysis';
import type { DeviceBody } from '../../shared/schemas/circuits';
import type { JobView } from '../../shared/schemas/runs';
import type { Deps } from '../deps';
import { badRequest, conflict } from '../lib/http-error';
import { getVersionDocument } from './networks';
import { getRun } from './runs';

/** The job whose circuit is asked for: the given one, else the first variational job with a result. */
async function circuitJob(deps: Deps, organisationId: number, runId: number, jobId?: number) {
  const view = await getRun(deps, organisationId, runId);
  const job: JobView | undefined = jobId === undefined ? view.jobs.find((j) => j.result?.circuitSpec) : view.jobs.find((j) => j.id === jobId);
  if (!job) throw badRequest(jobId === undefined ? 'This run has no variational job with a result yet.' : `Run ${runId} has no job ${jobId}.`, { job: ['not a job of this run'] });
  const result = job.result;
  if (!result?.circuitSpec || !result.params) throw conflict(`Job ${job.id} (${job.solver}) has no circuit: only finished QAOA and VQE jobs have one.`);
  const document = await getVersionDocument(deps, organisationId, view.versionId);
  const problem = bindProblem(buildCompactNetwork(document), view.problem as ProblemSpec);
  return { view, job, result, problem, spec: result.circuitSpec, params: result.params };
}

/** OpenQASM text of a job's optimised circuit (docs/runs.md, "OpenQASM export"). */
export async function jobQasm(deps: Deps, organisationId: number, runId: number, q: { job?: number; version: '2' | '3'; layout: 'all' | 'line' | 'grid'; form: 'bound' | 'parameterised' }) {
  const { job, problem, spec, params } = await circuitJob(deps, organisationId, runId, q.job);
  const body = runQasm(problem, spec, params, { version: q.version === '2' ? 2 : 3, layout: q.layout, form: q.form });
  return { fileName: `run-${runId}-${job.solver}-${q.layout}-${q.form}-openqasm${q.version}.qasm`, body };
}

/** Device time and the depolarizing estimate again, under an analyst's assumptions. */
export async function jobDevice(deps: Deps, organisationId: number, runId: number, body: DeviceBody) {
  const { job, result, problem, spec, params } = await circuitJob(deps, organisationId, runId, body.job);
  const assumptions = { ...defaultAssumptions(), ...body.assumptions };
  const base = result.deviceTime;
  const analysis = analyseRun(problem, spec, params,
    { assumptions, settings: base?.settings ?? 1, shotsPerSetting: base?.shotsPerSetting ?? 10_000, estimates: base?.estimates ?? result.evaluations, readoutShots: base?.readoutShots ?? 1024 },
    { layout: body.noiseLayout, trajectories: 0, shotsPerTrajectory: 0, seed: 1, reference: null });
  const reference = result.bound !== null ? { value: result.bound, what: `the bound (${result.boundSource ?? 'solver'})` } : { value: result.value, what: 'the value found by this solver' };
  return {
    job: job.id,
    solver: job.solver,
    circuit: result.circuit!,
    deviceTime: { settings: base?.settings ?? 1, shotsPerSetting: base?.shotsPerSetting ?? 10_000, estimates: base?.estimates ?? result.evaluations, readoutShots: base?.readoutShots ?? 1024, assumptions, layouts: analysis.deviceTime },
    noise: withReference(analysis.noise!, problem.kind, reference),
    defaults: DEVICE_DEFAULTS,
  };
}
