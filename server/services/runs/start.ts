import { HttpError } from '../../lib/http-error';
import { planLabel, runLimits, type RunPrice } from '../../../shared/plans';
import type { CreateRunBody, JobStatus, RunStatus } from '../../../shared/schemas/runs';
import { assertQueueUp, enqueueJobs, type SolveJobData } from '../queue';
import { refreshRunStatus } from '../runs-status';
import { assertStartable, effectivePlan, planRun, type RunActor } from './planning';
import type { RunServiceDeps } from './read';

/** Starting runs (control): create one from its plan, and release a held one once it is paid. */

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
