import { z } from 'zod';
import type { Deps } from '../deps';
import { NoBodySchema, type RouteSpec } from '../lib/routes';
import { AcceptInvitationSchema, IdParamsSchema, InviteSchema, LinkTokenSchema } from '../../shared/schemas/auth';
import { acceptInvitation, cancelInvitation, createInvitation, listInvitations, previewInvitation, resendInvitation } from '../services/invitations';
import { loadMe } from '../services/accounts';
import { clientIp, hasSession, saveSession, startSignedInSession } from '../middleware/session';
import { actorOf } from './members';
import { createAuthLimits } from '../middleware/rate-limits';

export function invitationsRoutes(deps: Deps): RouteSpec[] {
  const limits = createAuthLimits();
  return [
    {
      method: 'get',
      path: '/invitations',
      summary: 'Pending invitations of the current organisation',
      access: { kind: 'member', permission: 'members:manage' },
      handler: (input) => listInvitations(deps, actorOf(input).organisationId),
    },
    {
      method: 'post',
      path: '/invitations',
      summary: 'Invite someone by e-mail with a role (takes a seat; 402 seat_limit when all are used)',
      access: { kind: 'member', permission: 'members:manage' },
      body: InviteSchema,
      status: 201,
      handler: (input) => {
        const { organisationId, actor } = actorOf(input);
        return createInvitation(deps, organisationId, actor, input.body.email, input.body.role);
      },
    },
    {
      method: 'delete',
      path: '/invitations/:id',
      summary: 'Cancel a pending invitation (frees its seat; the link stops working)',
      access: { kind: 'member', permission: 'members:manage' },
      params: IdParamsSchema,
      handler: async (input) => {
        const { organisationId, actor } = actorOf(input);
        await cancelInvitation(deps, organisationId, actor, input.params.id);
        return undefined;
      },
    },
    {
      method: 'post',
      path: '/invitations/:id/resend',
      summary: 'Send a pending invitation again with a fresh link and a fresh 7 days',
      access: { kind: 'member', permission: 'members:manage' },
      params: IdParamsSchema,
      body: NoBodySchema,
      handler: (input) => {
        const { organisationId, actor } = actorOf(input);
        return resendInvitation(deps, organisationId, actor, input.params.id);
      },
    },
    {
      method: 'get',
      path: '/invitations/lookup',
      summary: 'What an invitation link is for (organisation, role, whether the address has an account)',
      access: { kind: 'public' },
      query: z.object({ token: LinkTokenSchema }),
      handler: ({ query }) => previewInvitation(deps, query.token),
    },
    {
      method: 'post',
      path: '/invitations/accept',
      summary: 'Accept an invitation: signed in → join; otherwise give your password (existing account) or name + new password',
      access: { kind: 'public' },
      body: AcceptInvitationSchema,
      before: [limits.acceptPerIp], // an existing account's password is checked here too
      handler: async ({ body, auth, req }) => {
        const signedInUserId = auth?.via === 'session' ? auth.userId : null;
        const { userId, organisationId } = await acceptInvitation(deps, { ...body, signedInUserId, ip: clientIp(req) });
        if (hasSession(req)) {
          if (signedInUserId === null) await startSignedInSession(req, userId, organisationId);
          else {
            req.session.organisationId = organisationId;
            await saveSession(req);
          }
        }
        return loadMe(deps, userId, organisationId);
      },
    },
  ];
}
