import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { applyTestEnv } from './env';

const ROOT = path.resolve(__dirname, '..', '..');

/**
 * A real solve worker (`tsx server/worker.ts`) as a child process on the test profile, for
 * suites that need runs to finish. `stop()` ends exactly this child (SIGTERM, then SIGKILL).
 */
export function startWorkerProcess(extraEnv: Record<string, string> = {}): { child: ChildProcess; output: () => string; stop: () => Promise<void> } {
  applyTestEnv();
  let log = '';
  const child = spawn(path.join(ROOT, 'node_modules', '.bin', 'tsx'), ['server/worker.ts'], {
    cwd: ROOT,
    env: { ...process.env, ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (d) => (log += String(d)));
  child.stderr?.on('data', (d) => (log += String(d)));
  const stop = () =>
    new Promise<void>((resolve) => {
      if (child.exitCode !== null || child.signalCode !== null) return resolve();
      const kill = setTimeout(() => child.kill('SIGKILL'), 5000);
      child.once('exit', () => {
        clearTimeout(kill);
        resolve();
      });
      child.kill('SIGTERM');
    });
  return { child, output: () => log, stop };
}
