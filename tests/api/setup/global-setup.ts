import fs from 'node:fs';
import path from 'node:path';
import { applyTestEnv } from '../../support/env';

export const LOCK_FILE = path.resolve(__dirname, '..', '..', '..', '.data', 'test', 'api-run.lock');

function lockHeldByLiveProcess(): boolean {
  try {
    const pid = Number(fs.readFileSync(LOCK_FILE, 'utf8'));
    if (!pid || pid === process.pid) return false;
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/**
 * Each api run starts from an empty `spinyard_test` database (drop, create, migrate). When another
 * api run on this machine is still going (a live lock holder), its data is left alone and only the
 * migrations run, so colleagues' suites are not pulled out from under them.
 */
export default async function globalSetup(): Promise<void> {
  applyTestEnv();
  const { loadConfig } = await import('../../../server/config');
  const { createDatabase } = await import('../../../server/db');
  const { migrate } = await import('../../../server/migrate');
  const config = loadConfig();
  const shared = lockHeldByLiveProcess();
  if (!shared) {
    fs.mkdirSync(path.dirname(LOCK_FILE), { recursive: true });
    fs.writeFileSync(LOCK_FILE, String(process.pid));
    const admin = createDatabase({ ...config, DB_NAME: 'mysql' });
    try {
      await admin.query(`DROP DATABASE IF EXISTS \`${config.DB_NAME}\``);
      await admin.query(`CREATE DATABASE \`${config.DB_NAME}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    } finally {
      await admin.close();
    }
  }
  const db = createDatabase(config);
  try {
    await migrate(db);
  } finally {
    await db.close();
  }
}
