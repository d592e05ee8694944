import type { RunStatus } from '../../shared/schemas/runs';

/**
 * The refund rule, in one place: a paid run's price is given back only when the run failed and
 * no solver produced an answer — no job holds a result, whether it finished or was stopped early
 * (a cancelled solver keeps its best answer so far, and that answer can be downloaded).
 * A run the user cancelled before any answer is not refunded: cancelling was their choice.
 */
export function refundDue(status: RunStatus | string, jobsWithAnswer: number): boolean {
  return status === 'failed' && jobsWithAnswer === 0;
}
