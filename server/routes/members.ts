import type { Deps } from '../deps';
import type { RouteInput, RouteSpec } from '../lib/routes';
import { ChangeRoleSchema, CloseOrganisationSchema, IdParamsSchema, TransferSchema } from '../../shared/schemas/auth';
import { changeMemberRole, closeOrganisation, listMembers, removeMember, transferOwnership } from '../services/accounts-members';
import type { Actor } from '../services/invitations';
import { clientIp, hasSession, saveSession } from '../middleware/session';

/** The signed-in member acting on their current organisation (access checks already passed). */
export function actorOf(input: RouteInput): { organisationId: number; actor: Actor } {
  const auth = input.auth!;
  return { organisationId: auth.organisationId!, actor: { userId: auth.userId, role: auth.role!, ip: clientIp(input.req) } };
}

export function membersRoutes(deps: Deps): RouteSpec[] {
  return [
    {
      method: 'get',
      path: '/members',
      summary: 'Members of the current organisation with their roles, and seats in use',
      access: { kind: 'member', permission: 'members:read' },
      handler: (input) => listMembers(deps, actorOf(input).organisationId),
    },
    {
      method: 'patch',
      path: '/members/:id',
      summary: "Change a member's role (owners only for owner changes; the last owner stays)",
      access: { kind: 'member', permission: 'members:manage' },
      params: IdParamsSchema,
      body: ChangeRoleSchema,
      handler: async (input) => {
        const { organisationId, actor } = actorOf(input);
        await changeMemberRole(deps, organisationId, actor, input.params.id, input.body.role);
        return listMembers(deps, organisationId);
      },
    },
    {
      method: 'delete',
      path: '/members/:id',
      summary: 'Remove a member from the organisation (their API tokens stop working)',
      access: { kind: 'member', permission: 'members:manage' },
      params: IdParamsSchema,
      handler: async (input) => {
        const { organisationId, actor } = actorOf(input);
        await removeMember(deps, organisationId, actor, input.params.id);
        return undefined;
      },
    },
    {
      method: 'post',
      path: '/organisation/transfer',
      summary: 'Hand ownership to another member (you stay as admin)',
      access: { kind: 'member', permission: 'organisation:transfer' },
      body: TransferSchema,
      handler: async (input) => {
        const { organisationId, actor } = actorOf(input);
        await transferOwnership(deps, organisationId, actor, input.body.userId);
        return listMembers(deps, organisationId);
      },
    },
    {
      method: 'delete',
      path: '/organisation',
      summary: 'Close the organisation (type its name to confirm); members, invitations and tokens end',
      access: { kind: 'member', permission: 'organisation:close' },
      body: CloseOrganisationSchema,
      handler: async (input) => {
        const { organisationId, actor } = actorOf(input);
        await closeOrganisation(deps, organisationId, actor, input.body.confirmName);
        if (hasSession(input.req)) {
          input.req.session.organisationId = null;
          await saveSession(input.req);
        }
        return undefined;
      },
    },
  ];
}
