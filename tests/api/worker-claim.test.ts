/**
 * The stored-once guard of the solve worker, driven through the real queue processor
 * (server/workers/process-job.ts) in this process: while a worker solves, another takes the job
 * over (as after a lapsed lock); the first may then store neither its outcome nor its progress.
 * Without the attempt guard on those UPDATEs the first worker's answer would overwrite the row.
 */
import request from 'supertest';
import type { Job } from 'bullmq';
import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import type { SolveJobData } from '../../server/services/queue';
import { applyRunsEnv, createTestApp, networkBody, orgWithTokens, randomEdges, saveNetwork, waitFor, type TestApp } from './runs-support';

const SMTP_PORT = 3184; // ports 3180–3189 belong to the solve-service suites
applyRunsEnv({ smtpPort: SMTP_PORT, queue: 'claim-test' });

let t: TestApp;
let mail: MailCatcher;
let org: Awaited<ReturnType<typeof orgWithTokens>>;

interface JobRow { status: string; attempt: number; worker: string | null; result: string | null; live: string | null; progress: number; generation: number; runId: number }
const jobRow = async (jobId: number) => (await t.deps.models.RunJob.findByPk(jobId))!.get({ plain: true }) as JobRow;

jest.setTimeout(120_000);

beforeAll(async () => {
  mail = await startMailCatcher({ smtpPort: SMTP_PORT });
  t = await createTestApp();
  const { migrate } = await import('../../server/migrate');
  await migrate(t.deps.db);
  org = await orgWithTokens(t.deps, 'Claim yard', 'team');
}, 60_000);

afterAll(async () => {
  const { closeSolveQueue } = await import('../../server/services/queue');
  if (t) await closeSolveQueue(t.deps);
  await t?.close();
  await mail?.close();
});

test('a worker whose claim was taken over mid-solve stores neither its result nor its progress', async () => {
  const { createJobProcessor } = await import('../../server/workers/process-job');
  const { createThreadSlot } = await import('../../server/workers/thread-slot');
  const { loadRunsConfig } = await import('../../server/services/queue-config');

  // No worker listens on this file's queue: the entry waits, and this test hands it to its own processor.
  const net = await saveNetwork(t.app, org.tokens.dispatcher, networkBody('Claim test', 200, randomEdges(200, 0.03, 43)));
  const created = await request(t.app).post('/api/runs').set('Authorization', `Bearer ${org.tokens.analyst}`) // a time limit is an analyst's setting
    .send({ versionId: net.versionId, problem: { kind: 'maxcut' }, solvers: [{ solver: 'tabu' }], timeLimitSeconds: 5 });
  expect(created.status).toBe(201);
  const detail = await request(t.app).get(`/api/runs/${created.body.id}`).set('Authorization', `Bearer ${org.tokens.viewer}`);
  const jobId: number = detail.body.jobs[0].id;
  const before = await jobRow(jobId);

  const slot = createThreadSlot();
  const processor = createJobProcessor({ deps: t.deps, config: loadRunsConfig(), slots: [slot], running: new Map(), workerName: 'claim-test-first#1' });
  const entry = { id: 'claim-test-entry', data: { jobId, runId: before.runId, organisationId: org.organisationId, generation: before.generation } } as unknown as Job<SolveJobData>;
  try {
    const outcome = processor(entry);
    const claimed = await waitFor('the first worker to claim the job', async () => {
      const row = await jobRow(jobId);
      return row.status === 'running' && row.worker === 'claim-test-first#1' ? row : null;
    }, 60_000, 50);

    // A second worker claims it the way process-job does (attempt + 1 on the attempt it saw).
    const [taken] = await t.deps.models.RunJob.update(
      { attempt: claimed.attempt + 1, worker: 'claim-test-second#2', progress: 0, live: null, startedAt: new Date() },
      { where: { id: jobId, attempt: claimed.attempt, status: 'running' } },
    );
    expect(taken).toBe(1);

    expect(await outcome).toBe('lost-claim'); // the first worker finished its solve …
    const after = await jobRow(jobId);
    expect(after).toMatchObject({ status: 'running', attempt: claimed.attempt + 1, worker: 'claim-test-second#2', result: null, live: null }); // … and wrote nothing
    expect(Number(after.progress)).toBe(0);
  } finally {
    await slot.close();
    await t.deps.models.RunJob.update({ status: 'cancelled', error: 'test over' }, { where: { id: jobId } });
  }
});
