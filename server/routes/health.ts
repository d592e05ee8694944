import type { RouteSpec } from '../lib/routes';
import type { Deps } from '../deps';
import { databaseUp } from '../db';
import { APP_VERSION } from '../version';

async function redisUp(deps: Deps): Promise<boolean> {
  try {
    if (deps.redis.status === 'wait') await deps.redis.connect();
    const pong = await Promise.race([deps.redis.ping(), new Promise<string>((_, reject) => setTimeout(() => reject(new Error('timeout')), 1000))]);
    return pong === 'PONG';
  } catch {
    return false;
  }
}

export function healthRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/health',
      summary: 'Service health: database and queue state, version',
      access: { kind: 'public' },
      handler: async ({ res }) => {
        const [db, queue] = await Promise.all([databaseUp(deps.db), redisUp(deps)]);
        const body = { status: db && queue ? 'ok' : 'degraded', db: db ? 'up' : 'down', queue: queue ? 'up' : 'down', version: APP_VERSION };
        res.status(db && queue ? 200 : 503).json(body);
        return undefined;
      },
    },
  ];
}
