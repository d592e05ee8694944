import type { Deps } from '../deps';
import type { RouteSpec } from '../lib/routes';
import { healthRoutes } from './health';
import { openApiRoutes } from './openapi';
import { networksRoutes } from './networks';

/** The API's route table, in one list (mounted under /api; read by the OpenAPI and isolation tests). */
export function apiRoutes(deps: Deps): RouteSpec[] {
  const routes: RouteSpec[] = [
    ...healthRoutes(deps),
    ...openApiRoutes(() => routes, deps.config.publicUrl),
    ...networksRoutes(deps),
  ];
  return routes;
}
