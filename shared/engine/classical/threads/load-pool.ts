/**
 * The worker-thread pool, loaded on first use (pure engine code never loads node:worker_threads
 * until a solver asks for a second thread).
 *
 * Loaded with require(), not import(): project TypeScript is always loaded as CommonJS — by the
 * tsx require hook in the CLI and in worker threads, by jest's transform in tests. A dynamic
 * import() goes to Node's ESM loader instead, which has no TypeScript hooks in those places
 * (Node 20 does not apply loader hooks to worker threads: nodejs/node#47747), so it failed as
 * deployed while passing in jest. tests/unit/server/module-loading.test.ts keeps import() out.
 */
import type * as Pool from './pool';

export function loadPool(): typeof Pool {
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  return require('./pool') as typeof Pool;
}
