import type { Deps } from '../deps';
import { deriveRunStatus, runSeconds, type JobStatus, type RunStatus } from '../../shared/schemas/runs';
import { loadRunsConfig } from './queue-config';
import { sendRunFinishedMail } from './run-mail';

const TERMINAL: RunStatus[] = ['succeeded', 'partial', 'failed', 'cancelled'];

/**
 * Recompute a run's status from its jobs, under a row lock on the run (two workers finishing
 * the last two jobs at once must not leave a stale status behind). When the run has just
 * finished and took longer than RUN_MAIL_AFTER_SECONDS, notified_at is set in the same
 * transaction and the creator gets one e-mail (the guard makes it exactly one).
 */
export async function refreshRunStatus(deps: Pick<Deps, 'db' | 'models' | 'mailer' | 'config' | 'logger' | 'runHooks'>, runId: number): Promise<RunStatus | null> {
  const { Run, RunJob } = deps.models;
  const mailAfter = loadRunsConfig().RUN_MAIL_AFTER_SECONDS;
  let mailDue = false;
  const status = await deps.db.transaction(async (transaction) => {
    const run = await Run.findByPk(runId, { lock: transaction.LOCK.UPDATE, transaction });
    if (!run) return null;
    const jobs = await RunJob.findAll({ where: { runId }, attributes: ['status'], transaction });
    const next = deriveRunStatus(jobs.map((j) => j.get('status') as JobStatus), run.get('held') as boolean);
    const done = TERMINAL.includes(next);
    const changes: Record<string, unknown> = { status: next };
    const now = new Date();
    if (done && !run.get('finishedAt')) changes.finishedAt = now;
    if (!done) changes.finishedAt = null;
    if (done && !run.get('notifiedAt') && !run.get('deletedAt') && run.get('createdBy')) {
      const seconds = runSeconds({ status: next, createdAt: run.get('createdAt') as Date, releasedAt: run.get('releasedAt') as Date | null, finishedAt: now }, now.getTime()) ?? 0;
      if (seconds >= mailAfter) {
        changes.notifiedAt = now;
        mailDue = true;
      }
    }
    await Run.update(changes, { where: { id: runId }, transaction });
    return next;
  });
  if (mailDue) {
    try {
      await sendRunFinishedMail(deps, runId);
    } catch (err) {
      deps.logger.warn({ err, runId }, 'run-finished e-mail could not be sent');
    }
  }
  if (status && TERMINAL.includes(status)) {
    // Billing decides what a finished run means for its price (refund-rule.ts); a no-op for free runs.
    try {
      await deps.runHooks.runFinished(runId, status);
    } catch (err) {
      deps.logger.warn({ err, runId }, 'billing after a finished run did not go through; the billing page retries refunds');
    }
  }
  return status;
}
