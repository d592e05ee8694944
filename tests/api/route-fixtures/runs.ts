import { createNetwork } from '../../../server/services/networks';
import type { FixtureContext, RouteFixtures } from './types';

const versions = new WeakMap<object, Promise<number>>();

/** One network version of organisation A per walk (its name carries the marker). */
function versionOf(ctx: FixtureContext): Promise<number> {
  let v = versions.get(ctx.orgA);
  if (!v) {
    v = createNetwork(ctx.deps, { organisationId: ctx.orgA.organisationId, userId: ctx.orgA.users.owner.id }, {
      name: `Walk network ${ctx.marker}`,
      depots: [{ id: 'a', name: `Depot ${ctx.marker}` }, { id: 'b' }, { id: 'c' }],
      lanes: [{ from: 'a', to: 'b', weight: 2 }, { from: 'b', to: 'c', weight: 1 }],
    }, { source: 'api' }).then((r) => r.versionId);
    versions.set(ctx.orgA, v);
  }
  return v;
}

/**
 * A finished run of organisation A (one succeeded job with a result, one failed job), written
 * straight to the tables: cancel answers 409 (nothing running), retry re-queues the failed job.
 */
async function freshRun(ctx: FixtureContext): Promise<number> {
  const versionId = await versionOf(ctx);
  const version = await ctx.deps.models.NetworkVersion.findByPk(versionId);
  const organisationId = ctx.orgA.organisationId;
  const run = await ctx.deps.models.Run.create({
    organisationId, networkId: version!.get('networkId') as number, versionId, createdBy: ctx.orgA.users.owner.id, problem: JSON.stringify({ kind: 'maxcut' }),
    status: 'partial', held: false, priority: 3, seed: 1, timeLimitSeconds: 5, depotCount: 3, finishedAt: new Date(),
  });
  const runId = run.get('id') as number;
  const result = { value: 3, assignment: [0, 1, 0], bound: 3, gap: 0, provenOptimal: true, energy: null, expectation: null, params: null, seconds: 0.01, evaluations: 8, shots: 0 };
  await ctx.deps.models.RunJob.bulkCreate([
    { runId, organisationId, position: 0, solver: 'exact', settings: '{}', status: 'succeeded', attempt: 1, progress: 1, result: JSON.stringify(result), finishedAt: new Date() },
    { runId, organisationId, position: 1, solver: 'greedy', settings: '{}', status: 'failed', attempt: 1, error: `walk failure ${ctx.marker}`, finishedAt: new Date() },
  ]);
  return runId;
}

const withRun = async (ctx: FixtureContext) => ({ params: { id: await freshRun(ctx) } });

export const fixtures: RouteFixtures = {
  'GET /runs/:id': withRun,
  'POST /runs/:id/cancel': withRun,
  'POST /runs/:id/retry': withRun,
  'DELETE /runs/:id': withRun,
  'GET /runs/:id/assignment.csv': withRun,
  'GET /runs/:id/report.json': withRun,
  'GET /runs/:id/events': withRun,
  'POST /runs/preview': async (ctx) => ({ body: { versionId: await versionOf(ctx), problem: { kind: 'maxcut' }, solvers: [{ solver: 'greedy' }] } }),
};
