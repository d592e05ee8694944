import { applyTestEnv } from './env';

/**
 * A database and Redis index of an e2e file's own: api suites drop and recreate `spinyard_test`
 * when they start, and other suites' workers serve the shared queue, so a run in the shared ones
 * could lose its rows or its jobs mid-test. One table, so no two files share an index.
 */
const REDIS_INDEX = { runs: 7, billing: 8, circuits: 9, runview: 10, large: 11, web: 12 } as const;

export type OwnDatabase = keyof typeof REDIS_INDEX;

/** Sets the test environment to `spinyard_e2e_<name>` and its Redis index (plus `extra`), creating the database when missing. */
export async function useOwnDatabase(name: OwnDatabase, extra: Record<string, string> = {}): Promise<void> {
  applyTestEnv();
  const database = `spinyard_e2e_${name}`;
  Object.assign(process.env, { DB_NAME: database, REDIS_URL: `redis://127.0.0.1:6391/${REDIS_INDEX[name]}`, ...extra });
  const { loadConfig } = await import('../../server/config');
  const { createDatabase } = await import('../../server/db');
  const admin = createDatabase({ ...loadConfig(), DB_NAME: 'mysql' });
  try {
    await admin.query(`CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  } finally {
    await admin.close();
  }
}
