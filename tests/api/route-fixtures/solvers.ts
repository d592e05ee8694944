import { createNetwork } from '../../../server/services/networks';
import type { FixtureContext, RouteFixtures } from './types';

const versions = new WeakMap<object, Promise<number>>();

/** One network version of organisation A per walk, for the size-based defaults. */
function versionOf(ctx: FixtureContext): Promise<number> {
  let v = versions.get(ctx.orgA);
  if (!v) {
    v = createNetwork(ctx.deps, { organisationId: ctx.orgA.organisationId, userId: ctx.orgA.users.owner.id }, {
      name: `Defaults walk ${ctx.marker}`,
      depots: [{ id: 'a', name: `Depot ${ctx.marker}` }, { id: 'b' }, { id: 'c' }],
      lanes: [{ from: 'a', to: 'b', weight: 1 }, { from: 'b', to: 'c', weight: 1 }],
    }, { source: 'api' }).then((r) => r.versionId);
    versions.set(ctx.orgA, v);
  }
  return v;
}

/** The solver listing needs no fixture; the defaults read one of organisation A's versions. */
export const fixtures: RouteFixtures = {
  'POST /solvers/defaults': async (ctx) => ({ body: { versionId: await versionOf(ctx), problem: { kind: 'maxcut' } } }),
};
