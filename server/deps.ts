import { Redis } from 'ioredis';
import type { Sequelize } from 'sequelize';
import type { Config } from './config';
import { createDatabase } from './db';
import { createLogger, type Logger } from './logger';
import { defineModels, type Models } from './models';
import { createMailer, type Mailer } from './services/mailer';

/** Everything a request handler, service or worker may need, created once per process. */
export interface Deps {
  config: Config;
  db: Sequelize;
  models: Models;
  redis: Redis;
  mailer: Mailer;
  logger: Logger;
}

export function createDeps(config: Config): Deps {
  const logger = createLogger(config.NODE_ENV === 'test' ? (process.env.LOG_LEVEL ?? 'silent') : config.LOG_LEVEL);
  const db = createDatabase(config);
  const models = defineModels(db);
  const redis = new Redis(config.REDIS_URL, { maxRetriesPerRequest: null, enableOfflineQueue: true, lazyConnect: true, disconnectTimeout: 200, retryStrategy: (n) => Math.min(n * 200, 2000) });
  redis.on('error', () => {}); // health checks report Redis state; reconnects happen in the background
  const mailer = createMailer(config, logger);
  return { config, db, models, redis, mailer, logger };
}

export async function closeDeps(deps: Deps): Promise<void> {
  const redisClosed = deps.redis.status === 'ready' ? deps.redis.quit().catch(() => deps.redis.disconnect()) : Promise.resolve(deps.redis.disconnect());
  await Promise.allSettled([deps.db.close(), redisClosed, deps.mailer.close()]);
}
