import type { Deps } from '../deps';
import type { RunHooks } from './run-hooks';
import { chargeAgainIfRefunded, recordRunCharge, refundFailedRun } from './billing-runs';
import { refundDue } from './refund-rule';

/**
 * Billing's side of the run service's hooks (run-hooks.ts). Passed to createDeps by each process
 * that runs the service (API server, solve worker, test app), so the run modules never import billing.
 */
export function billingRunHooks(deps: Pick<Deps, 'db' | 'models' | 'config' | 'logger'>): RunHooks {
  return {
    recordCharge: (charge, transaction) => recordRunCharge(deps, charge, transaction),
    runFinished: async (runId, status) => {
      // Most finished runs cannot be due a refund whatever their answers; only those take the row locks.
      if (refundDue(status, 0)) await refundFailedRun(deps, runId);
    },
    rerunNeedsPayment: (runId, transaction) => chargeAgainIfRefunded(deps, runId, transaction),
  };
}
