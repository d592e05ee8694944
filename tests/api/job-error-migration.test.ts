/**
 * Job errors stored before faults were kept to the worker's log still showed server file paths to
 * every member; the 20261202-0600 migration rewrites them and leaves input-problem errors alone.
 */
import { appWithoutWorker, runOfFourJobs } from './runs-support';
import { up } from '../../server/migrations/20261202-0600-job-errors-without-paths';

const app = appWithoutWorker('job-error-migration');

test('old fault texts with paths become the sentence used now; other errors stay', async () => {
  const t = app();
  const { jobs } = await runOfFourJobs(t, 'Old errors');
  const old = [
    "internal error in the solver: Cannot find module '/srv/spinyard/shared/engine/classical/threads/pool' imported from /srv/spinyard/shared/engine/solvers/classical.ts",
    'the solver thread crashed: TypeError: x is undefined\n    at run (/srv/spinyard/server/workers/solve-thread.ts:30:5)',
    'the job could not be processed: connect ECONNREFUSED 10.0.0.5:3306',
    'tabu handles max-cut and balanced bisection, not k-way regions; use fm',
  ];
  for (let i = 0; i < jobs.length; i++) await t.deps.models.RunJob.update({ status: 'failed', error: old[i] }, { where: { id: jobs[i] } });
  await up(t.deps.db.getQueryInterface());
  const after = await Promise.all(jobs.map(async (id) => (await t.deps.models.RunJob.findByPk(id))!.get('error')));
  expect(after).toEqual([
    "internal error in the solver; the details are in the solve worker's log",
    "the solver thread crashed; the details are in the solve worker's log",
    "the job could not be processed; the details are in the solve worker's log",
    old[3],
  ]);
});
