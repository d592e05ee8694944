import type { QueryInterface } from 'sequelize';
import { answerColumnsOf } from '../services/runs/answer-columns';

/**
 * The ranked fields of a job's answer as columns of their own (`answer_value`, `answer_feasible`,
 * `answer_proven`), written with the result. "Best known answer" ranks a network version's jobs
 * by them; before, it searched the stored result's text, which only worked while the orchestrator
 * wrote `value` among the first characters. Existing results are read once, in batches, here.
 */
const BATCH = 200;

export async function up(qi: QueryInterface, S: typeof import('sequelize')) {
  const { DataTypes } = S;
  await qi.addColumn('run_jobs', 'answer_value', { type: DataTypes.DOUBLE, allowNull: true });
  await qi.addColumn('run_jobs', 'answer_feasible', { type: DataTypes.BOOLEAN, allowNull: true });
  await qi.addColumn('run_jobs', 'answer_proven', { type: DataTypes.BOOLEAN, allowNull: true });
  await backfillAnswerColumns(qi);
}

/** Reads every stored result once and writes its answer columns (exported for its api test). */
export async function backfillAnswerColumns(qi: QueryInterface) {
  let after = 0;
  for (;;) {
    const [rows] = (await qi.sequelize.query('SELECT id, result FROM run_jobs WHERE id > ? AND result IS NOT NULL ORDER BY id LIMIT ?', { replacements: [after, BATCH] })) as [Array<{ id: number; result: string }>, unknown];
    if (rows.length === 0) break;
    for (const row of rows) {
      const a = answerColumnsOf(parse(row.result));
      if (a.answerValue !== null) await qi.sequelize.query('UPDATE run_jobs SET answer_value = ?, answer_feasible = ?, answer_proven = ? WHERE id = ?', { replacements: [a.answerValue, a.answerFeasible, a.answerProven, row.id] });
    }
    after = rows[rows.length - 1].id;
  }
}

function parse(text: string): { value?: unknown; infeasible?: unknown; provenOptimal?: unknown } | null {
  try {
    return JSON.parse(text) as { value?: unknown };
  } catch {
    return null;
  }
}

export async function down(qi: QueryInterface) {
  await qi.removeColumn('run_jobs', 'answer_proven');
  await qi.removeColumn('run_jobs', 'answer_feasible');
  await qi.removeColumn('run_jobs', 'answer_value');
}
