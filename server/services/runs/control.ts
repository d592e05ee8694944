import { conflict } from '../../lib/http-error';
import type { RunView } from '../../../shared/schemas/runs';
import type { RunJobRow } from '../../models/run-job';
import { assertQueueUp, enqueueJobs, removeEntries, removeWaitingChildren, requestCancel, type SolveJobData } from '../queue';
import { refreshRunStatus } from '../runs-status';
import { findRun, getRun, type RunServiceDeps } from './read';
import { NO_ANSWER } from './answer-columns';

/** Controlling runs that exist: cancel, retry (a refunded run waits for a new payment), delete. */

/**
 * Cancel: queued jobs become cancelled at once (and leave the queue); running ones get the
 * cancel flag — their worker stops the solver within about a second and stores the best answer
 * found so far (status cancelled). A solve spread over the workers also loses its children not
 * yet started; its running children stop on the same flag.
 */
export async function cancelRun(deps: RunServiceDeps, organisationId: number, id: number): Promise<RunView> {
  await findRun(deps, organisationId, id);
  await assertQueueUp(deps.redis);
  const jobs = (await deps.models.RunJob.findAll({ where: { runId: id, status: ['queued', 'running'] } })).map((j) => j.get({ plain: true }) as RunJobRow);
  if (jobs.length === 0) throw conflict('Nothing to cancel: every job of this run has finished.');
  // Flag first, so a worker that is claiming a queued job right now still sees it.
  await requestCancel(deps, jobs);
  await removeWaitingChildren(deps, jobs.filter((j) => j.status === 'running').map((j) => ({ jobId: j.id, generation: j.generation })));
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
        { status: 'queued', generation: j.generation + 1, progress: 0, live: null, result: null, ...NO_ANSWER, error: null, startedAt: null, finishedAt: null, queuedAt: new Date(), worker: null },
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
    await removeWaitingChildren(deps, live.filter((j) => j.status === 'running').map((j) => ({ jobId: j.id, generation: j.generation })));
    await deps.models.RunJob.update({ status: 'cancelled', finishedAt: new Date(), error: 'the run was deleted' }, { where: { id: live.map((j) => j.id), status: 'queued' } });
    await removeEntries(deps, live.filter((j) => j.status === 'queued').map((j) => ({ jobId: j.id, generation: j.generation })));
  }
  await deps.models.Run.update({ deletedAt: new Date() }, { where: { id, organisationId } });
}
