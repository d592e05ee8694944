import { createNetwork } from '../../../server/services/networks';
import { recordRunCharge } from '../../../server/services/billing-runs';
import type { FixtureContext, RouteFixtures } from './types';

/**
 * A run of organisation A held awaiting payment with its price (written straight to the tables):
 * GET /billing/runs/:id shows it; POST /runs/:id/pay answers 402 (no credits) for admins and owners.
 */
async function heldRun(ctx: FixtureContext): Promise<number> {
  const organisationId = ctx.orgA.organisationId;
  const { id: networkId, versionId } = await createNetwork(ctx.deps, { organisationId, userId: ctx.orgA.users.owner.id }, {
    name: `Billing walk ${ctx.marker}`,
    depots: [{ id: 'a' }, { id: 'b' }],
    lanes: [{ from: 'a', to: 'b', weight: 1 }],
  }, { source: 'api' });
  const run = await ctx.deps.models.Run.create({
    organisationId, networkId, versionId, createdBy: ctx.orgA.users.owner.id, problem: JSON.stringify({ kind: 'maxcut' }),
    status: 'awaiting_payment', held: true, priority: 3, seed: 1, timeLimitSeconds: 5, depotCount: 2,
  });
  const runId = run.get('id') as number;
  await recordRunCharge(ctx.deps, { runId, organisationId, price: { amount: 575, currency: 'eur', lines: [{ label: 'Large solve', amount: 575 }] } });
  return runId;
}

const withHeldRun = async (ctx: FixtureContext) => ({ params: { id: await heldRun(ctx) } });

export const fixtures: RouteFixtures = {
  'GET /billing/runs/:id': withHeldRun,
  'POST /runs/:id/pay': withHeldRun,
};
