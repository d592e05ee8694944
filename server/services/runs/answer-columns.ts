/**
 * The ranked fields of a job's answer, stored beside its result (run_jobs.answer_value,
 * answer_feasible, answer_proven) so rankings across runs read three columns instead of whole
 * results. Written by the worker with every result and by the migration that added the columns.
 */
export interface AnswerColumns {
  answerValue: number | null;
  answerFeasible: boolean | null;
  answerProven: boolean | null;
}

export const NO_ANSWER: AnswerColumns = { answerValue: null, answerFeasible: null, answerProven: null };

export function answerColumnsOf(result: { value?: unknown; infeasible?: unknown; provenOptimal?: unknown } | null): AnswerColumns {
  if (!result || typeof result.value !== 'number' || !Number.isFinite(result.value)) return NO_ANSWER;
  return { answerValue: result.value, answerFeasible: result.infeasible !== true, answerProven: result.provenOptimal === true };
}
