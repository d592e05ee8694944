import type { Deps } from '../deps';
import type { RouteSpec } from '../lib/routes';
import { CreateTokenSchema, IdParamsSchema } from '../../shared/schemas/auth';
import { createToken, listTokens, revokeToken } from '../services/tokens';
import { clientIp } from '../middleware/session';

export function tokensRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/tokens',
      summary: 'Your personal API tokens for the current organisation (never the secret)',
      access: { kind: 'member', permission: 'tokens:own' },
      handler: ({ auth }) => listTokens(deps, auth!.organisationId!, auth!.userId),
    },
    {
      method: 'post',
      path: '/tokens',
      summary: 'Create a personal API token for the current organisation; the token is in this answer only',
      access: { kind: 'member', permission: 'tokens:own' },
      body: CreateTokenSchema,
      status: 201,
      handler: ({ auth, body, req }) => createToken(deps, auth!.organisationId!, auth!.userId, body.name, clientIp(req)),
    },
    {
      method: 'delete',
      path: '/tokens/:id',
      summary: 'Revoke one of your API tokens',
      access: { kind: 'member', permission: 'tokens:own' },
      params: IdParamsSchema,
      handler: async ({ auth, params, req }) => {
        await revokeToken(deps, auth!.organisationId!, auth!.userId, params.id, clientIp(req));
        return undefined;
      },
    },
  ];
}
