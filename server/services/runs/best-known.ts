/**
 * "Best known answer" for a run, as the scorecard shows it: the best balanced answer any run of
 * this organisation has found for the same question (kind, k, tolerance, pins) on the same
 * network version — this run included. Ranked by shared/engine/problem/compare.ts; among equal
 * values a proven-optimal answer, then the earliest run, is named. It is what the team has seen,
 * not a certified optimum (unless `provenOptimal`): the app says so beside it.
 */
import { Op } from 'sequelize';
import { better, senseOf } from '../../../shared/engine/problem/compare';
import type { BestKnownView, ProblemInput } from '../../../shared/schemas/runs';
import type { Deps } from '../../deps';

/** Key-order independent key of a question: two runs ask the same when their keys match. */
export function questionKey(p: ProblemInput): string {
  const pins = Object.entries(p.pins ?? {}).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return JSON.stringify([p.kind, p.kind === 'kway' ? p.k ?? null : null, p.kind === 'maxcut' ? null : p.tolerance ?? null, pins]);
}

const parse = (text: string | null): ProblemInput | null => {
  try {
    return text ? (JSON.parse(text) as ProblemInput) : null;
  } catch {
    return null;
  }
};

export async function bestKnownFor(deps: Pick<Deps, 'models'>, organisationId: number, versionId: number, problem: ProblemInput): Promise<BestKnownView | null> {
  const runs = (await deps.models.Run.findAll({ where: { organisationId, versionId, deletedAt: null }, attributes: ['id', 'problem'], raw: true })) as unknown as Array<{ id: number; problem: string }>;
  const key = questionKey(problem);
  const ids = runs.filter((r) => { const q = parse(r.problem); return q !== null && questionKey(q) === key; }).map((r) => r.id);
  if (ids.length === 0) return null;
  const rows = (await deps.models.RunJob.findAll({
    where: { organisationId, runId: { [Op.in]: ids }, status: 'succeeded', answerValue: { [Op.ne]: null }, answerFeasible: true },
    attributes: ['runId', 'solver', 'answerValue', 'answerProven'],
    order: [['runId', 'ASC'], ['position', 'ASC']],
    raw: true,
  })) as unknown as Array<{ runId: number; solver: string; answerValue: number; answerProven: boolean | number }>;
  const sense = senseOf(problem.kind);
  let best: BestKnownView | null = null;
  for (const r of rows) {
    const value = Number(r.answerValue);
    const proven = Boolean(Number(r.answerProven));
    const candidate = { value, runId: r.runId, solver: r.solver, provenOptimal: proven, runsCompared: ids.length };
    const rank = (v: number) => ({ value: v, feasible: true });
    const equal = best !== null && !better(sense, rank(value), rank(best.value)) && !better(sense, rank(best.value), rank(value));
    if (!best || better(sense, rank(value), rank(best.value)) || (equal && proven && !best.provenOptimal)) best = candidate;
  }
  return best;
}
