import fs from 'node:fs';
import { LOCK_FILE } from './global-setup';

/** Release the api-run lock if this run holds it. */
export default async function globalTeardown(): Promise<void> {
  try {
    if (Number(fs.readFileSync(LOCK_FILE, 'utf8')) === process.pid) fs.unlinkSync(LOCK_FILE);
  } catch {
    // no lock: nothing to release
  }
}
