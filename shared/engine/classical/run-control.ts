import type { SolveContext } from '../solvers/types';

/**
 * Time, cancellation and progress for anytime solvers. Loops call `tick()` often; it is cheap
 * and only every ~50 ms does it report progress and give the event loop a turn (so a cancel
 * flag set by a message handler, or a worker's answer, can arrive).
 */
export interface RunControl {
  /** Seconds since the run started. */
  elapsed(): number;
  /** True once the time limit has passed or the run was cancelled. */
  shouldStop(): boolean;
  /** Share of the time budget used, 0…1. */
  fraction(): number;
  /** Report progress and yield when due; resolves true when the run must stop. */
  tick(bestValue?: number, iteration?: number): Promise<boolean>;
}

const now = (): number => (typeof performance !== 'undefined' ? performance.now() : Date.now());

const yieldToLoop = (): Promise<void> => new Promise((resolve) => setTimeout(resolve, 0));

export function createRunControl(ctx: SolveContext, limitSeconds: number = ctx.timeLimitSeconds): RunControl {
  const start = now();
  let lastYield = start;
  const limitMs = Math.max(0, limitSeconds) * 1000;
  const elapsedMs = (): number => now() - start;
  const control: RunControl = {
    elapsed: () => elapsedMs() / 1000,
    shouldStop: () => elapsedMs() >= limitMs || ctx.cancel?.cancelled === true,
    fraction: () => (limitMs > 0 ? Math.min(1, elapsedMs() / limitMs) : 1),
    async tick(bestValue, iteration) {
      const t = now();
      if (t - lastYield >= 50) {
        lastYield = t;
        ctx.onProgress?.({ fraction: control.fraction(), bestValue, iteration });
        await yieldToLoop();
      }
      return control.shouldStop();
    },
  };
  return control;
}
