import { applyTestEnv } from '../../support/env';

/**
 * Keep api set-ups (global-setup.ts) from resetting the shared test database while a suite that
 * does not go through that set-up (browser suites) is running: take the server-side lock
 * `spinyard_test_run` if it is free. When another run already holds it, nobody will reset the
 * database meanwhile anyway, so we simply go on. Call the returned function in afterAll.
 */
export async function holdTestDatabase(): Promise<() => Promise<void>> {
  applyTestEnv();
  const mariadb = await import('mariadb');
  const conn = await mariadb.createConnection({
    host: process.env.DB_HOST,
    port: Number(process.env.DB_PORT),
    user: process.env.DB_USER,
    password: process.env.DB_PASSWORD,
    connectTimeout: 5000,
  });
  // Wait for a set-up in progress to finish before the suite starts using the database.
  await conn.query('SELECT GET_LOCK(?, 180)', ['spinyard_test_setup']);
  await conn.query('SELECT GET_LOCK(?, 0)', ['spinyard_test_run']);
  await conn.query('SELECT RELEASE_LOCK(?)', ['spinyard_test_setup']);
  return () => conn.end().catch(() => {});
}
