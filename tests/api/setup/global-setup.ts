import fs from 'node:fs';
import path from 'node:path';
import { applyTestEnv } from '../../support/env';

export const LOCK_FILE = path.resolve(__dirname, '..', '..', '..', '.data', 'test', 'api-run.lock');
/**
 * Every api run (not only the lock holder) leaves its pid here while it runs, so a run that
 * starts after the lock holder finished does not drop the database under a run still going.
 */
export const USERS_DIR = path.resolve(__dirname, '..', '..', '..', '.data', 'test', 'api-run.users');

interface Lock {
  pid: number;
  ready: boolean; // the holder has finished dropping, creating and migrating
}

function readLock(): Lock | null {
  try {
    const lock = JSON.parse(fs.readFileSync(LOCK_FILE, 'utf8')) as Lock;
    return typeof lock.pid === 'number' ? lock : null;
  } catch {
    return null;
  }
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch {
    return false;
  }
}

/** True when another live api run uses the database (stale entries are removed). */
function otherLiveUsers(): boolean {
  let found = false;
  for (const name of fs.existsSync(USERS_DIR) ? fs.readdirSync(USERS_DIR) : []) {
    const pid = Number(name);
    if (!pid || pid === process.pid) continue;
    if (alive(pid)) found = true;
    else fs.rmSync(path.join(USERS_DIR, name), { force: true });
  }
  return found;
}

const writeLock = (lock: Lock) => {
  fs.mkdirSync(path.dirname(LOCK_FILE), { recursive: true });
  fs.writeFileSync(LOCK_FILE, JSON.stringify(lock));
};

/**
 * Each api run starts from an empty `spinyard_test` database (drop, create, migrate). Several people
 * share this machine: when another api run is still going (a live lock holder), its database is
 * left alone — this run waits until that run's migrations are done and then only migrates (a no-op).
 */
export default async function globalSetup(): Promise<void> {
  applyTestEnv();
  const { loadConfig } = await import('../../../server/config');
  const { createDatabase } = await import('../../../server/db');
  const { migrate } = await import('../../../server/migrate');
  const config = loadConfig();
  const held = readLock();
  const holderLive = !!held && held.pid !== process.pid && alive(held.pid);
  const shared = holderLive || otherLiveUsers();
  fs.mkdirSync(USERS_DIR, { recursive: true });
  fs.writeFileSync(path.join(USERS_DIR, String(process.pid)), '');
  if (shared) {
    const deadline = Date.now() + 120_000;
    while (holderLive && !readLock()?.ready && Date.now() < deadline && alive(held!.pid)) await new Promise((r) => setTimeout(r, 250));
  } else {
    writeLock({ pid: process.pid, ready: false });
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
  if (!shared) writeLock({ pid: process.pid, ready: true });
}
