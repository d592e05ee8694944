import { createNetwork } from '../../../server/services/networks';
import type { FixtureContext, RouteFixtures } from './types';

/** A fresh two-version network in organisation A, named with the marker (leaks would show it). */
async function freshNetwork(ctx: FixtureContext) {
  const actor = { organisationId: ctx.orgA.organisationId, userId: ctx.orgA.users.owner.id };
  const body = {
    name: `Walker yard ${ctx.marker}`,
    depots: [{ id: 'A', name: `Alder ${ctx.marker}` }, { id: 'B' }, { id: 'C' }],
    lanes: [{ from: 'A', to: 'B', weight: 2 }, { from: 'B', to: 'C', weight: 3 }],
  };
  const v1 = await createNetwork(ctx.deps, actor, body, { source: 'api' });
  const { addVersion } = await import('../../../server/services/networks');
  const v2 = await addVersion(ctx.deps, actor, v1.id, { ...body, lanes: [...body.lanes, { from: 'A', to: 'C', weight: 1 }] }, { source: 'drawn' });
  return { id: v1.id, v1: v1.versionId, v2: v2.versionId };
}

const square = { name: 'Walker square', depots: [{ id: 'A' }, { id: 'B' }], lanes: [{ from: 'A', to: 'B', weight: 1 }] };

export const fixtures: RouteFixtures = {
  'GET /networks': () => ({ query: { sort: 'name' } }),
  'POST /networks': () => ({ body: square }),
  'POST /networks/demos': () => ({ body: { key: 'quillmere-core' } }),
  'GET /networks/:id': async (ctx) => ({ params: { id: (await freshNetwork(ctx)).id } }),
  'PATCH /networks/:id': async (ctx) => ({ params: { id: (await freshNetwork(ctx)).id }, body: { name: `Renamed ${ctx.marker}` } }),
  'DELETE /networks/:id': async (ctx) => ({ params: { id: (await freshNetwork(ctx)).id } }),
  'GET /networks/:id/versions': async (ctx) => ({ params: { id: (await freshNetwork(ctx)).id } }),
  'POST /networks/:id/versions': async (ctx) => ({ params: { id: (await freshNetwork(ctx)).id }, body: { depots: square.depots, lanes: square.lanes } }),
  'GET /networks/:id/versions/:versionId': async (ctx) => {
    const n = await freshNetwork(ctx);
    return { params: { id: n.id, versionId: n.v1 } };
  },
  'POST /networks/:id/versions/:versionId/duplicate': async (ctx) => {
    const n = await freshNetwork(ctx);
    return { params: { id: n.id, versionId: n.v1 } };
  },
  'GET /networks/:id/versions/:versionId/export.csv': async (ctx) => {
    const n = await freshNetwork(ctx);
    return { params: { id: n.id, versionId: n.v2 }, query: { part: 'depots' } };
  },
  'GET /networks/:id/versions/:versionId/export.geojson': async (ctx) => {
    const n = await freshNetwork(ctx);
    return { params: { id: n.id, versionId: n.v2 } };
  },
  'GET /networks/:id/compare': async (ctx) => {
    const n = await freshNetwork(ctx);
    return { params: { id: n.id }, query: { from: n.v1, to: n.v2 } };
  },
};
