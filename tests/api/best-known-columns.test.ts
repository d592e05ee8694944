/**
 * "Best known answer" ranks jobs by the answer columns stored beside each result
 * (20261202-0700 migration, server/services/runs/answer-columns.ts). Before, it searched the
 * first 240 characters of the stored text for `value`, so a result written with its keys in
 * another order (or an older one) was silently left out of the ranking.
 */
import { appWithoutWorker, runOfFourJobs } from './runs-support';
import { backfillAnswerColumns } from '../../server/migrations/20261202-0700-job-answer-columns';
import { bestKnownFor } from '../../server/services/runs/best-known';

const app = appWithoutWorker('best-known-columns');

test('stored results of any key order are backfilled into the columns and ranked; infeasible and unparsable ones are not', async () => {
  const t = app();
  const { org, net, jobs } = await runOfFourJobs(t, 'Answer columns');
  const padding = 'x'.repeat(400); // pushes `value` past the first 240 characters
  const stored = [
    JSON.stringify({ solver: 'greedy', sense: 'max', value: 2, assignment: [0, 1, 0, 0] }),
    JSON.stringify({ notes: [padding], solver: 'tabu', sense: 'max', assignment: [0, 1, 0, 1], value: 3, provenOptimal: false }),
    JSON.stringify({ solver: 'anneal', sense: 'max', value: 9, infeasible: true, assignment: [0, 0, 0, 0] }),
    '{"solver":"exact","value":', // cut short: no answer
  ];
  for (let i = 0; i < jobs.length; i++) {
    await t.deps.models.RunJob.update({ status: 'succeeded', result: stored[i], answerValue: null, answerFeasible: null, answerProven: null }, { where: { id: jobs[i] } });
  }
  await backfillAnswerColumns(t.deps.db.getQueryInterface());
  const rows = await Promise.all(jobs.map(async (id) => {
    const j = (await t.deps.models.RunJob.findByPk(id))!;
    return [j.get('answerValue'), j.get('answerFeasible') === null ? null : Boolean(j.get('answerFeasible'))];
  }));
  expect(rows).toEqual([[2, true], [3, true], [9, false], [null, null]]);
  const best = await bestKnownFor(t.deps, org.organisationId, net.versionId, { kind: 'maxcut' });
  expect(best).toMatchObject({ value: 3, solver: 'tabu', provenOptimal: false, runsCompared: 1 });
});
