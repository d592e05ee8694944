import { createNetwork } from '../../../server/services/networks';
import { qaoaCircuit } from '../../../shared/engine/circuits/qaoa';
import { circuitSummary } from '../../../shared/engine/circuits/summary';
import type { FixtureContext, RouteFixtures } from './types';

/**
 * A finished QAOA job of organisation A (3 depots, p = 1), written straight to the tables with the
 * circuit spec and parameters the OpenQASM and device routes rebuild the circuit from.
 */
async function qaoaRun(ctx: FixtureContext): Promise<number> {
  const { versionId } = await createNetwork(ctx.deps, { organisationId: ctx.orgA.organisationId, userId: ctx.orgA.users.owner.id }, {
    name: `Circuit walk ${ctx.marker}`,
    depots: [{ id: 'a', name: `Depot ${ctx.marker}` }, { id: 'b' }, { id: 'c' }],
    lanes: [{ from: 'a', to: 'b', weight: 2 }, { from: 'b', to: 'c', weight: 1 }],
  }, { source: 'api' });
  const version = await ctx.deps.models.NetworkVersion.findByPk(versionId);
  const organisationId = ctx.orgA.organisationId;
  const run = await ctx.deps.models.Run.create({
    organisationId, networkId: version!.get('networkId') as number, versionId, createdBy: ctx.orgA.users.owner.id, problem: JSON.stringify({ kind: 'maxcut' }),
    status: 'succeeded', held: false, priority: 3, seed: 1, timeLimitSeconds: 5, depotCount: 3, finishedAt: new Date(),
  });
  const runId = run.get('id') as number;
  const operator = { numQubits: 3, offset: -1.5, linear: new Float64Array(3), quadI: Int32Array.of(0, 1), quadJ: Int32Array.of(1, 2), quadCoeff: Float64Array.of(1, 0.5) };
  const result = {
    value: 3, assignment: [0, 1, 0], bound: 3, gap: 0, provenOptimal: true, energy: -2.5, expectation: 2.5, params: [0.3, 0.2], seconds: 0.01, evaluations: 8, shots: 0,
    circuit: circuitSummary(qaoaCircuit({ operator, layers: 1 })),
    circuitSpec: { ansatz: 'qaoa', layers: 1, encoding: 'direct', penaltyRule: 'lucas' },
  };
  await ctx.deps.models.RunJob.create({ runId, organisationId, position: 0, solver: 'qaoa', settings: '{}', status: 'succeeded', attempt: 1, progress: 1, result: JSON.stringify(result), finishedAt: new Date() });
  return runId;
}

const withQaoaRun = async (ctx: FixtureContext) => ({ params: { id: await qaoaRun(ctx) } });

export const fixtures: RouteFixtures = {
  'GET /runs/:id/circuit.qasm': withQaoaRun,
  'POST /runs/:id/device': async (ctx) => ({ params: { id: await qaoaRun(ctx) }, body: { assumptions: { readoutError: 0.01 } } }),
};
