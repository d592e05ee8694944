/**
 * Job errors stored before faults were kept to the worker's log still showed server file paths to
 * every member; the 20261202-0600 migration rewrites them and leaves input-problem errors alone.
 */
import request from 'supertest';
import { createTestApp, orgWithTokens, networkBody, saveNetwork, type TestApp } from './runs-support';
import { up } from '../../server/migrations/20261202-0600-job-errors-without-paths';

let t: TestApp;
beforeAll(async () => {
  process.env.RUN_QUEUE_NAME = `job-error-migration-${Date.now().toString(36)}`; // no worker takes these jobs
  process.env.LOG_LEVEL = 'silent';
  t = await createTestApp();
});
afterAll(async () => {
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
});

test('old fault texts with paths become the sentence used now; other errors stay', async () => {
  const org = await orgWithTokens(t.deps, 'Old errors yard', 'team');
  const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Old errors', 4, [[0, 1, 1], [1, 2, 1], [2, 3, 1]]));
  const created = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${org.tokens.dispatcher}`)
    .send({ versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }, { solver: 'tabu' }, { solver: 'anneal' }, { solver: 'exact' }] });
  expect(created.status).toBe(201);
  const jobs = (await t.deps.models.RunJob.findAll({ where: { runId: created.body.id }, order: [['position', 'ASC']] })).map((j) => j.get('id') as number);
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
