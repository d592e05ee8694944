import type { Deps } from '../deps';
import type { RouteSpec } from '../lib/routes';
import { healthRoutes } from './health';
import { openApiRoutes } from './openapi';
import { networksRoutes } from './networks';
import { authRoutes } from './auth';
import { membersRoutes } from './members';
import { invitationsRoutes } from './invitations';
import { auditRoutes } from './audit';
import { tokensRoutes } from './tokens';
import { runsRoutes } from './runs';
import { circuitsRoutes } from './circuits';
import { operatorsRoutes } from './operators';
import { solversRoutes } from './solvers';
import { billingRoutes } from './billing';

/** The API's route table, in one list (mounted under /api; read by the OpenAPI and isolation tests). */
export function apiRoutes(deps: Deps): RouteSpec[] {
  const routes: RouteSpec[] = [
    ...healthRoutes(deps),
    ...openApiRoutes(() => routes, deps.config.publicUrl),
    ...authRoutes(deps),
    ...membersRoutes(deps),
    ...invitationsRoutes(deps),
    ...auditRoutes(deps),
    ...tokensRoutes(deps),
    ...networksRoutes(deps),
    ...runsRoutes(deps),
    ...circuitsRoutes(deps),
    ...operatorsRoutes(deps),
    ...solversRoutes(deps),
    ...billingRoutes(deps),
  ];
  return routes;
}
