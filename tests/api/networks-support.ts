import type { NextFunction, Request, Response } from 'express';
import { applyTestEnv } from '../support/env';
import { loadConfig } from '../../server/config';
import { createDeps, closeDeps, type Deps } from '../../server/deps';
import { createApp } from '../../server/app';
import { migrate } from '../../server/migrate';
import type { Role } from '../../shared/permissions';

/**
 * The networks API on the real test MariaDB, with a stand-in for the accounts middleware:
 * `x-test-org` / `x-test-role` headers set req.auth the way the real one does, so these tests
 * exercise the route table's access rules without depending on sign-in.
 */
export async function startNetworksApi() {
  applyTestEnv();
  const deps: Deps = createDeps(loadConfig());
  await migrate(deps.db);
  const authenticate = (req: Request, _res: Response, next: NextFunction) => {
    const org = req.header('x-test-org');
    if (org) req.auth = { userId: Number(req.header('x-test-user') ?? 1), organisationId: Number(org), role: (req.header('x-test-role') ?? 'dispatcher') as Role, via: 'session' };
    next();
  };
  const created = createApp(deps, { authenticate }) as ReturnType<typeof createApp> & { dispose?: () => void };
  const stop = async () => {
    created.dispose?.();
    (created.sessionStore as { stopExpiringSessions?: () => void }).stopExpiringSessions?.();
    await closeDeps(deps);
  };
  return { app: created.app, deps, stop };
}

/** A fresh organisation id per test file, far above anything the seed or other suites create. */
export const freshOrg = () => 700_000 + Math.floor(Math.random() * 200_000);

export async function rowCounts(deps: Deps, organisationId: number) {
  const [networks, versions] = await Promise.all([
    deps.models.Network.count({ where: { organisationId } }),
    deps.models.NetworkVersion.count({ where: { organisationId } }),
  ]);
  return { networks, versions };
}
