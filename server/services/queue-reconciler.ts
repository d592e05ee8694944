import type { Deps } from '../deps';
import { reconcileQueue } from './queue';

export interface QueueReconciler {
  /** Resolves once a pass that is under way has finished; no pass starts afterwards. */
  stop(): Promise<void>;
}

/**
 * Run reconcileQueue every `intervalMs` (RUN_RECONCILE_MS, ≤ 30 s) in this process: each solve
 * worker runs one, so an entry lost while the API enqueued (after a commit, a payment or a
 * retry) is back on the queue within one interval without a restart. A pass never overlaps the
 * next; a pass that fails (Redis or MariaDB away) is logged and the next one tries again.
 * Several workers reconciling at once is harmless: an entry id is one per job and generation,
 * so a second add of the same entry is ignored by the queue.
 */
export function startQueueReconciler(deps: Pick<Deps, 'redis' | 'models' | 'logger'>, intervalMs: number): QueueReconciler {
  let stopped = false;
  let timer: NodeJS.Timeout | null = null;
  let pass: Promise<void> = Promise.resolve();
  const schedule = () => {
    if (stopped) return;
    timer = setTimeout(() => {
      pass = reconcileQueue(deps)
        .then(() => undefined, (err) => deps.logger.warn({ err }, 'periodic queue reconcile failed; trying again next interval'))
        .finally(schedule);
    }, intervalMs);
    timer.unref();
  };
  schedule();
  return {
    async stop() {
      stopped = true;
      if (timer) clearTimeout(timer);
      await pass;
    },
  };
}
