import type { Transaction } from 'sequelize';
import type { RunPrice } from '../../shared/plans';
import type { RunStatus } from '../../shared/schemas/runs';

/**
 * What the run service asks of billing, injected as `deps.runHooks` (wired where each process
 * builds its Deps), so no run module imports billing and billing may import the run service
 * (it releases paid runs) without an import cycle. Types only here: this file imports no module
 * of either side.
 */
export interface RunHooks {
  /** Store the price with a run created held for payment (inside the run's creating transaction). */
  recordCharge(charge: { runId: number; organisationId: number; price: RunPrice }, transaction: Transaction): Promise<void>;
  /** A run's status was recomputed to a final one (after commit); billing may give its price back. */
  runFinished(runId: number, status: RunStatus): Promise<void>;
  /**
   * Failed or cancelled jobs of this run are about to run again (inside the retry's transaction,
   * the run row locked). True when the run must first be paid again: it stays held, awaiting payment.
   */
  rerunNeedsPayment(runId: number, transaction: Transaction): Promise<boolean>;
}

/** For processes that never run paid runs (tools, tests of other features): any use is an error. */
export const unwiredRunHooks: RunHooks = {
  recordCharge: () => Promise.reject(new Error('run billing hooks are not wired in this process (createDeps(config, { runHooks }))')),
  runFinished: () => Promise.reject(new Error('run billing hooks are not wired in this process (createDeps(config, { runHooks }))')),
  rerunNeedsPayment: () => Promise.reject(new Error('run billing hooks are not wired in this process (createDeps(config, { runHooks }))')),
};
