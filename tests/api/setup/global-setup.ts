import { applyTestEnv } from '../../support/env';

/**
 * Each api run starts from an empty `spinyard_test` database (drop, create, migrate).
 *
 * Several people (and CI clones) may share the test MariaDB. Two named locks on the database server
 * keep runs from pulling the database out from under each other:
 *  - `spinyard_test_setup` serialises set-ups, so no two runs migrate at the same moment;
 *  - `spinyard_test_run` is held for the whole run by the run that reset the database (on a
 *    connection kept open until global teardown; a crashed run's locks vanish with its connection).
 * A run that finds `spinyard_test_run` taken leaves the database alone and only migrates (a no-op).
 */
const KEEP = '__spinyardTestRunLock';

export default async function globalSetup(): Promise<void> {
  applyTestEnv();
  const mariadb = await import('mariadb');
  const { loadConfig } = await import('../../../server/config');
  const { createDatabase } = await import('../../../server/db');
  const { migrate } = await import('../../../server/migrate');
  const config = loadConfig();
  const conn = await mariadb.createConnection({ host: config.DB_HOST, port: config.DB_PORT, user: config.DB_USER, password: config.DB_PASSWORD, connectTimeout: 5000 });
  const got = async (name: string, waitSeconds: number) => Number(Object.values((await conn.query('SELECT GET_LOCK(?, ?) AS got', [name, waitSeconds]))[0] as { got: unknown })[0]) === 1;
  if (!(await got('spinyard_test_setup', 180))) throw new Error('another test run kept the test database busy for 3 minutes; try again');
  try {
    const owner = await got('spinyard_test_run', 0);
    if (owner) {
      await conn.query(`DROP DATABASE IF EXISTS \`${config.DB_NAME}\``);
      await conn.query(`CREATE DATABASE \`${config.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    }
    const db = createDatabase(config);
    try {
      await migrate(db);
    } finally {
      await db.close();
    }
    if (owner) (globalThis as Record<string, unknown>)[KEEP] = conn;
  } finally {
    await conn.query('SELECT RELEASE_LOCK(?)', ['spinyard_test_setup']);
    if ((globalThis as Record<string, unknown>)[KEEP] !== conn) await conn.end();
  }
}
