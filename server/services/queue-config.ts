import { z } from 'zod';

/**
 * Settings of the solve service, read from the environment once per process (zod-validated like
 * server/config.ts; kept here so the queue's knobs live with the queue). Tests set short lock and
 * stalled intervals so a killed worker's job comes back within seconds.
 */
const RunsConfigSchema = z.object({
  /** BullMQ queue name (tests give each file its own so their workers never share jobs). */
  RUN_QUEUE_NAME: z.string().regex(/^[A-Za-z0-9_-]+$/, 'letters, digits, - and _ only').default('spinyard-solve'),
  /** A worker's lock on a job lasts this long unless renewed (renewed every half of it). */
  RUN_LOCK_MS: z.coerce.number().int().min(1000).max(600_000).default(30_000),
  /** How often workers look for jobs whose lock lapsed (their worker died). */
  RUN_STALLED_INTERVAL_MS: z.coerce.number().int().min(500).max(600_000).default(30_000),
  /** Times a job may be recovered from a dead worker before it is failed. */
  RUN_MAX_STALLED: z.coerce.number().int().min(1).max(20).default(3),
  /** Seconds past a solver's time limit (plus its bound computation) before the job is aborted. */
  RUN_GRACE_SECONDS: z.coerce.number().min(0).max(3600).default(30),
  /** Jobs one worker process runs at once (each in its own thread). */
  WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(64).default(1),
  /**
   * Threads one statevector layer (QAOA/VQE on 16 qubits or more, WebAssembly kernels) is split
   * over inside a solve thread: the solve thread plus SIM_THREADS − 1 workers started on first use.
   */
  SIM_THREADS: z.coerce.number().int().min(1).max(7).default(2),
  /** Runs that took longer than this get a "run finished" e-mail to their creator. */
  RUN_MAIL_AFTER_SECONDS: z.coerce.number().min(0).default(30),
  /** Minimum time between progress writes to the job row (pub/sub is every 200 ms). */
  RUN_PROGRESS_WRITE_MS: z.coerce.number().int().min(0).max(60_000).default(1000),
  /**
   * How often each worker process puts lost queue entries back (jobs queued in the database but
   * missing from Redis: a failed enqueue after commit or after a payment, a Redis restart).
   * At most 30 s, so a lost entry waits at most that long.
   */
  RUN_RECONCILE_MS: z.coerce.number().int().min(200).max(30_000).default(15_000),
  /**
   * Staged solves (qaoa-blocks): a stage with at least this many independent tasks (blocks) is
   * spread over all workers as child entries on the queue; smaller stages run in the job's own
   * thread. 0 = never spread.
   */
  RUN_SPREAD_MIN_TASKS: z.coerce.number().int().min(0).max(100_000).default(16),
  /** Most child entries per spread stage (tasks are batched to fit; fewer, larger batches cost less queue traffic). */
  RUN_SPREAD_CHILDREN: z.coerce.number().int().min(1).max(1000).default(24),
  /** Default per-solver time limit when a run does not give one. */
  RUN_DEFAULT_SECONDS: z.coerce.number().positive().max(3600).default(10),
});

export type RunsConfig = z.infer<typeof RunsConfigSchema>;

export function loadRunsConfig(env: NodeJS.ProcessEnv = process.env): RunsConfig {
  const parsed = RunsConfigSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message} (got ${JSON.stringify(env[String(i.path[0])])})`);
    throw new Error(`invalid solve-service configuration — ${lines.join('; ')}`);
  }
  return parsed.data;
}
