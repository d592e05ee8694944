import type { RunControl } from '../../shared/engine/classical/run-control';

/**
 * A RunControl on this process's CPU time (user + system): "20 s on one core" even when the
 * shared cores give the benchmark only part of a core.
 */
export function cpuControl(limitSeconds: number): RunControl {
  const t0 = process.cpuUsage();
  let lastYield = Date.now();
  // process.cpuUsage is a system call: read it at most every 2 ms of wall time (a stale value
  // only lets a run go on a few ms longer), or the reading itself eats a share of the budget.
  let lastRead = -Infinity, cached = 0;
  const elapsed = (): number => {
    const now = performance.now();
    if (now - lastRead >= 2) {
      lastRead = now;
      const u = process.cpuUsage(t0);
      cached = (u.user + u.system) / 1e6;
    }
    return cached;
  };
  const control: RunControl = {
    elapsed,
    shouldStop: () => elapsed() >= limitSeconds,
    fraction: () => Math.min(1, elapsed() / limitSeconds),
    async tick() {
      if (Date.now() - lastYield >= 50) {
        lastYield = Date.now();
        await new Promise((resolve) => setTimeout(resolve, 0));
      }
      return control.shouldStop();
    },
  };
  return control;
}
