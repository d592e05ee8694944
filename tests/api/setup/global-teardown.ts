import fs from 'node:fs';
import { LOCK_FILE } from './global-setup';

/** Release the api-run lock if this run holds it. */
export default async function globalTeardown(): Promise<void> {
  try {
    if ((JSON.parse(fs.readFileSync(LOCK_FILE, 'utf8')) as { pid: number }).pid === process.pid) fs.unlinkSync(LOCK_FILE);
  } catch {
    // no lock (or not ours): nothing to release
  }
}
