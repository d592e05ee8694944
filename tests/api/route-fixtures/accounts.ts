import { createToken } from '../../../server/services/tokens';
import { sha256Hex } from '../../../server/services/tokens-secret';
import { uniqueTag } from '../setup/test-app';
import type { FixtureContext, OpenRoutes, RouteFixtures } from './types';

/** A fresh viewer in organisation A (to be re-roled or removed); never signs in, so no bcrypt. */
async function freshMember(ctx: FixtureContext) {
  const user = await ctx.deps.models.User.create({ email: `walker.${uniqueTag()}.${ctx.marker}@walk.example`, name: `Walker ${ctx.marker}`, passwordHash: '!' });
  return ctx.deps.models.Membership.create({ organisationId: ctx.orgA.organisationId, userId: user.id, role: 'viewer' });
}

/** A fresh pending invitation in organisation A. */
async function freshInvitation(ctx: FixtureContext) {
  return ctx.deps.models.Invitation.create({
    organisationId: ctx.orgA.organisationId,
    email: `invitee.${uniqueTag()}.${ctx.marker}@walk.example`,
    role: 'viewer',
    tokenHash: sha256Hex(uniqueTag() + Math.random()),
    invitedByUserId: ctx.orgA.users.owner.id,
    expiresAt: new Date(Date.now() + 86400_000),
  });
}

export const fixtures: RouteFixtures = {
  'GET /members': () => ({}),
  'PATCH /members/:id': async (ctx) => ({ params: { id: (await freshMember(ctx)).id }, body: { role: 'dispatcher' } }),
  'DELETE /members/:id': async (ctx) => ({ params: { id: (await freshMember(ctx)).id } }),
  // Transfer to oneself is refused with 400 (after the permission check): no ownership really moves.
  'POST /organisation/transfer': (_ctx, caller) => ({ body: { userId: caller.userId } }),
  // A wrong confirmation: the permission check runs, nothing is closed.
  'DELETE /organisation': () => ({ body: { confirmName: 'not the organisation name' } }),
  'GET /invitations': () => ({}),
  'POST /invitations': () => ({ body: { email: `new.${uniqueTag()}@walk.example`, role: 'viewer' } }),
  'DELETE /invitations/:id': async (ctx) => ({ params: { id: (await freshInvitation(ctx)).id } }),
  // Resend e-mails the invitee; the test's mailer is told to accept without a server (see permissions.test.ts).
  'POST /invitations/:id/resend': async (ctx) => ({ params: { id: (await freshInvitation(ctx)).id } }),
  'GET /audit': () => ({ query: { page: 1, pageSize: 10 } }),
  'GET /tokens': () => ({}),
  'POST /tokens': () => ({ body: { name: 'walker bridge' } }),
  // Callers of A revoke their own token; the outsider tries one of A's owner's tokens.
  'DELETE /tokens/:id': async (ctx, caller) => {
    const holder = caller.outsider ? ctx.orgA.users.owner.id : caller.userId;
    const created = await createToken(ctx.deps, ctx.orgA.organisationId, holder, `walk ${ctx.marker}`, null);
    return { params: { id: created.id } };
  },
};

export const openRoutes: OpenRoutes = {
  'GET /auth/csrf': 'hands out the CSRF token of the caller\'s own session',
  'POST /auth/sign-up': 'creates a new account and organisation',
  'POST /auth/sign-in': 'rate-limited; one generic answer on failure',
  'POST /auth/sign-out': 'ends the caller\'s own session',
  'GET /auth/me': 'signed in: the caller\'s own user and memberships',
  'PATCH /auth/me': 'signed in: the caller\'s own name',
  'POST /auth/switch': 'signed in: checks membership of the target organisation',
  'POST /auth/password': 'signed in: needs the current password',
  'POST /auth/reset/request': 'rate-limited; always 202',
  'POST /auth/reset/confirm': 'needs the e-mailed one-time token',
  'GET /invitations/lookup': 'needs the e-mailed invitation token',
  'POST /invitations/accept': 'needs the e-mailed invitation token',
};
