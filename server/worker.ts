/**
 * Solve worker process (`npm run worker`): takes jobs from the solve queue and runs the engine
 * in solve threads. Start any number of them, on any machine that reaches MariaDB and Redis.
 * A worker killed mid-job loses nothing: its queue lock lapses, another worker's stalled-job
 * check puts the job back, and the guarded result write keeps the outcome to exactly one.
 */
import { Worker, type Job } from 'bullmq';
import { Redis } from 'ioredis';
import { loadConfig, ConfigError } from './config';
import { createDeps, closeDeps, type Deps } from './deps';
import { databaseUp } from './db';
import { loadRunsConfig, type RunsConfig } from './services/queue-config';
import { cancelChannel, closeSolveQueue, reconcileQueue, type SolveJobData } from './services/queue';
import { CANCEL_GRACE_MS, createJobProcessor, markEntryFailed, workerName, type ProcessorEnv } from './workers/process-job';
import { createThreadSlot } from './workers/thread-slot';
import { SPREAD_CHILD, type ChildData, type ParentData } from './workers/spread-job';
import { billingRunHooks } from './services/billing-run-hooks';
import { startQueueReconciler } from './services/queue-reconciler';

export interface StartedWorker {
  deps: Deps;
  config: RunsConfig;
  stop: () => Promise<void>;
}

async function waitForTables(deps: Deps, seconds: number): Promise<void> {
  const deadline = Date.now() + seconds * 1000;
  for (;;) {
    if (await databaseUp(deps.db)) {
      try {
        await deps.db.query('SELECT 1 FROM run_jobs LIMIT 1');
        return;
      } catch {
        // tables come from the API server's migrations; wait for them
      }
    }
    if (Date.now() > deadline) throw new ConfigError(`MariaDB at ${deps.config.DB_HOST}:${deps.config.DB_PORT} is not reachable or not migrated after ${seconds} s; start the API server first (npm start does both)`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

export async function startWorker(): Promise<StartedWorker> {
  const config = loadConfig();
  const rc = loadRunsConfig();
  const deps = createDeps(config, { runHooks: billingRunHooks });
  await waitForTables(deps, 60);

  const env: ProcessorEnv = {
    deps,
    config: rc,
    slots: Array.from({ length: rc.WORKER_CONCURRENCY }, () => createThreadSlot()),
    running: new Map(),
    workerName: workerName(),
  };
  const allSlots = [...env.slots];
  const processor = createJobProcessor(env);

  const subscriber = new Redis(config.REDIS_URL, { maxRetriesPerRequest: null });
  subscriber.on('error', () => {});
  subscriber.on('message', (_channel: string, message: string) => {
    for (const handle of env.running.get(Number(message)) ?? []) handle.cancel(CANCEL_GRACE_MS);
  });
  await subscriber.subscribe(cancelChannel(rc.RUN_QUEUE_NAME));

  const connection = new Redis(config.REDIS_URL, { maxRetriesPerRequest: null });
  connection.on('error', () => {});
  const worker = new Worker<ParentData | ChildData>(rc.RUN_QUEUE_NAME, processor, {
    connection,
    // Recorded on each entry it takes (processedBy): which worker ran which child of a spread solve.
    name: env.workerName,
    concurrency: rc.WORKER_CONCURRENCY,
    lockDuration: rc.RUN_LOCK_MS,
    stalledInterval: rc.RUN_STALLED_INTERVAL_MS,
    maxStalledCount: rc.RUN_MAX_STALLED,
  });
  worker.on('error', (err) => deps.logger.warn({ err }, 'solve worker: queue error'));
  worker.on('failed', (entry, err) => {
    if (!entry) return;
    if (entry.name === SPREAD_CHILD) {
      // A batch of a spread solve failed for good: its parent entry fails with it (failParentOnFailure); record that on the job row.
      const child = entry as unknown as Job<ChildData>;
      const final = child.attemptsMade >= (child.opts.attempts ?? 1) || /stalled/i.test(err.message);
      deps.logger.warn({ err: err.message, job: child.data.parent.jobId, child: child.id, final }, 'solve worker: spread child entry failed');
      if (final) void markEntryFailed(deps, child.data.parent, "part of the solve spread over the workers could not be processed; the details are in the solve worker's log").catch(() => {});
      return;
    }
    const final = entry.attemptsMade >= (entry.opts.attempts ?? 1) || /stalled/i.test(err.message);
    deps.logger.warn({ err: err.message, job: entry.id, final }, 'solve worker: queue entry failed');
    // The queue error's text (database messages, paths) stays in the log above; members see a sentence.
    if (final) void markEntryFailed(deps, entry.data as ParentData, /stalled/i.test(err.message) ? 'the job was interrupted too many times (its worker kept stopping); retry it' : "the job could not be processed; the details are in the solve worker's log").catch(() => {});
  });
  await worker.waitUntilReady();
  await reconcileQueue(deps).catch((err) => deps.logger.warn({ err }, 'solve worker: reconcile failed'));
  // Then every RUN_RECONCILE_MS: lost entries come back without waiting for a restart.
  const reconciler = startQueueReconciler(deps, rc.RUN_RECONCILE_MS);
  deps.logger.info({ queue: rc.RUN_QUEUE_NAME, concurrency: rc.WORKER_CONCURRENCY, worker: env.workerName }, 'solve worker ready');

  const stop = async () => {
    await reconciler.stop();
    await worker.close();
    await Promise.allSettled(allSlots.map((s) => s.close()));
    subscriber.disconnect();
    connection.disconnect();
    await closeSolveQueue(deps);
    await closeDeps(deps);
  };
  return { deps, config: rc, stop };
}

if (require.main === module) {
  startWorker()
    .then(({ deps, stop }) => {
      console.log(`spinyard: solve worker ready (pid ${process.pid})`);
      let stopping = false;
      const shutdown = (signal: string) => {
        if (stopping) return;
        stopping = true;
        deps.logger.info({ signal }, 'solve worker stopping (running jobs finish or are picked up by another worker)');
        const force = setTimeout(() => process.exit(0), 10_000);
        force.unref();
        stop().then(() => process.exit(0), () => process.exit(1));
      };
      process.on('SIGINT', () => shutdown('SIGINT'));
      process.on('SIGTERM', () => shutdown('SIGTERM'));
    })
    .catch((err) => {
      console.error(`spinyard worker: ${err instanceof ConfigError ? err.message : err?.stack ?? err}`);
      process.exit(err instanceof ConfigError ? 2 : 1);
    });
}
