import type { Deps } from '../deps';
import type { RouteSpec } from '../lib/routes';
import { AuditQuerySchema } from '../../shared/schemas/auth';
import { listAudit } from '../services/audit';

export function auditRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/audit',
      summary: 'The audit log of the current organisation, newest first (page, pageSize ≤ 100)',
      access: { kind: 'member', permission: 'audit:read' },
      query: AuditQuerySchema,
      handler: ({ auth, query }) => listAudit(deps, auth!.organisationId!, query.page, query.pageSize),
    },
  ];
}
