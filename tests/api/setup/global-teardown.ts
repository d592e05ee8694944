import fs from 'node:fs';
import path from 'node:path';
import { LOCK_FILE, USERS_DIR } from './global-setup';

/** Release the api-run lock if this run holds it. */
export default async function globalTeardown(): Promise<void> {
  fs.rmSync(path.join(USERS_DIR, String(process.pid)), { force: true });
  try {
    if ((JSON.parse(fs.readFileSync(LOCK_FILE, 'utf8')) as { pid: number }).pid === process.pid) fs.unlinkSync(LOCK_FILE);
  } catch {
    // no lock (or not ours): nothing to release
  }
}
