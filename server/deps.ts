import { Redis } from 'ioredis';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { createDatabase } from './db';
import { createLogger, type Logger } from './logger';
import { defineModels, type Models } from './models';
import { createMailer, type Mailer } from './services/mailer';
import { unwiredRunHooks, type RunHooks } from './services/run-hooks';

/** Everything a request handler, service or worker may need, created once per process. */
export interface Deps {
  config: Config;
  db: Sequelize;
  models: Models;
  redis: Redis;
  mailer: Mailer;
  logger: Logger;
  /** Billing as the run service sees it (injected: see services/run-hooks.ts). */
  runHooks: RunHooks;
}

export interface DepsWiring {
  /** Build the run service's billing hooks from the finished Deps (billingRunHooks in processes that run paid runs). */
  runHooks?: (deps: Deps) => RunHooks;
}

export function createDeps(config: Config, wiring: DepsWiring = {}): Deps {
  const logger = createLogger(config.NODE_ENV === 'test' ? (process.env.LOG_LEVEL ?? 'silent') : config.LOG_LEVEL);
  const db = createDatabase(config);
  const models = defineModels(db);
  const redis = new Redis(config.REDIS_URL, { maxRetriesPerRequest: null, enableOfflineQueue: true, lazyConnect: true, disconnectTimeout: 200, retryStrategy: (n) => Math.min(n * 200, 2000) });
  redis.on('error', () => {}); // health checks report Redis state; reconnects happen in the background
  const mailer = createMailer(config, logger);
  const deps: Deps = { config, db, models, redis, mailer, logger, runHooks: unwiredRunHooks };
  if (wiring.runHooks) deps.runHooks = wiring.runHooks(deps);
  return deps;
}

export async function closeDeps(deps: Deps): Promise<void> {
  const redisClosed = deps.redis.status === 'ready' ? deps.redis.quit().catch(() => deps.redis.disconnect()) : Promise.resolve(deps.redis.disconnect());
  await Promise.allSettled([deps.db.close(), redisClosed, deps.mailer.close()]);
}
