import type { Deps } from '../deps';
import { NoBodySchema, type RouteInput, type RouteSpec } from '../lib/routes';
import { HttpError, badRequest, forbidden, unauthorized } from '../lib/http-error';
import {
  ChangePasswordSchema,
  ProfileSchema,
  ResetConfirmSchema,
  ResetRequestSchema,
  SignInSchema,
  SignUpSchema,
  SwitchSchema,
  type Me,
} from '../../shared/schemas/auth';
import { changePassword, checkCredentials, findUserByEmail, landingOrganisation, loadMe, rememberOrganisation, roleIn, signUp, updateProfile } from '../services/accounts';
import { auditForUser } from '../services/accounts-audit';
import { confirmPasswordReset, endSessionsOf, requestPasswordReset } from '../services/accounts-reset';
import { createAuthLimits } from '../middleware/rate-limits';
import { clientIp, csrfTokenOf, endSession, hasSession, saveSession, startSignedInSession } from '../middleware/session';

const WRONG_CREDENTIALS = 'The e-mail or the password is not correct.';

function needsSession(req: RouteInput['req']) {
  if (!hasSession(req)) throw badRequest('This route works with the browser session; API tokens need no sign-in.');
}

export async function meOrThrow(deps: Deps, auth: RouteInput['auth']): Promise<Me> {
  if (!auth) throw unauthorized();
  const me = await loadMe(deps, auth.userId, auth.organisationId);
  if (!me) throw unauthorized();
  return me;
}

export function authRoutes(deps: Deps): RouteSpec[] {
  const limits = createAuthLimits();
  return [
    {
      method: 'get',
      path: '/auth/csrf',
      summary: 'The CSRF token that cookie-session clients send as X-CSRF-Token on state-changing requests',
      access: { kind: 'public' },
      handler: async ({ req }) => {
        if (!hasSession(req)) return { csrfToken: '' }; // Bearer clients need none
        return { csrfToken: await csrfTokenOf(req) };
      },
    },
    {
      method: 'post',
      path: '/auth/sign-up',
      summary: 'Create an account and a new organisation (you become its owner); signs you in',
      access: { kind: 'public' },
      body: SignUpSchema,
      status: 201,
      before: [limits.signUpPerIp],
      handler: async ({ body, req }) => {
        needsSession(req);
        const { userId, organisationId } = await signUp(deps, body, clientIp(req));
        await startSignedInSession(req, userId, organisationId);
        return loadMe(deps, userId, organisationId);
      },
    },
    {
      method: 'post',
      path: '/auth/sign-in',
      summary: 'Sign in with e-mail and password (rate-limited per IP and per e-mail)',
      access: { kind: 'public' },
      body: SignInSchema,
      before: [limits.signInPerIp, limits.signInPerEmail],
      handler: async ({ body, req }) => {
        needsSession(req);
        const ip = clientIp(req);
        const user = await checkCredentials(deps, body.email, body.password);
        if (!user) {
          const known = await findUserByEmail(deps, body.email);
          await auditForUser(deps, known?.id ?? null, { actorUserId: null, action: 'auth.sign_in_failed', targetType: 'user', targetId: known?.id, detail: { email: body.email }, ip });
          throw new HttpError(401, WRONG_CREDENTIALS, { code: 'wrong_credentials' });
        }
        const organisationId = await landingOrganisation(deps, user);
        await startSignedInSession(req, user.id, organisationId);
        await auditForUser(deps, user.id, { actorUserId: user.id, action: 'auth.signed_in', targetType: 'user', targetId: user.id, ip });
        return loadMe(deps, user.id, organisationId);
      },
    },
    {
      method: 'post',
      path: '/auth/sign-out',
      summary: 'Sign out (ends the session)',
      access: { kind: 'public' },
      body: NoBodySchema,
      handler: async ({ req, res }) => {
        await endSession(req);
        res.clearCookie('spinyard.sid' /* SESSION_COOKIE in server/app.ts */, { path: '/', httpOnly: true, sameSite: 'lax' });
        return undefined;
      },
    },
    {
      method: 'get',
      path: '/auth/me',
      summary: 'The signed-in user, their organisations and the current one',
      access: { kind: 'user' },
      handler: ({ auth }) => meOrThrow(deps, auth),
    },
    {
      method: 'patch',
      path: '/auth/me',
      summary: 'Change your display name',
      access: { kind: 'user' },
      body: ProfileSchema,
      handler: async ({ auth, body }) => {
        await updateProfile(deps, auth!.userId, body.name);
        return meOrThrow(deps, auth);
      },
    },
    {
      method: 'post',
      path: '/auth/switch',
      summary: 'Switch the current organisation of this session',
      access: { kind: 'user' },
      body: SwitchSchema,
      handler: async ({ auth, body, req }) => {
        if (auth!.via === 'token') throw badRequest('An API token belongs to one organisation; create a token in the other organisation instead.');
        const role = await roleIn(deps, auth!.userId, body.organisationId);
        if (!role) throw forbidden('You are not a member of that organisation.');
        req.session.organisationId = body.organisationId;
        await saveSession(req);
        await rememberOrganisation(deps, auth!.userId, body.organisationId);
        return loadMe(deps, auth!.userId, body.organisationId);
      },
    },
    {
      method: 'post',
      path: '/auth/password',
      summary: 'Change your password (needs the current one)',
      access: { kind: 'user' },
      body: ChangePasswordSchema,
      handler: async ({ auth, body, req }) => {
        await changePassword(deps, auth!.userId, body.currentPassword, body.newPassword);
        await auditForUser(deps, auth!.userId, { actorUserId: auth!.userId, action: 'auth.password_changed', targetType: 'user', targetId: auth!.userId, ip: clientIp(req) });
        // Other browsers signed in as this user are signed out; this one goes on under a new session id.
        await endSessionsOf(deps, auth!.userId);
        if (auth!.via === 'session' && hasSession(req)) await startSignedInSession(req, auth!.userId, req.session.organisationId ?? null);
        return undefined;
      },
    },
    {
      method: 'post',
      path: '/auth/reset/request',
      summary: 'E-mail a one-time password reset link (always 202, whether or not the address has an account)',
      access: { kind: 'public' },
      body: ResetRequestSchema,
      status: 202,
      before: [limits.resetPerIp, limits.resetPerEmail],
      handler: async ({ body, req }) => {
        // In the background: the answer must not take longer when the address has an account.
        void requestPasswordReset(deps, body.email, clientIp(req)).catch((err) => deps.logger.error({ err }, 'password reset request failed'));
        return { accepted: true, message: 'If an account uses this address, a reset link is on its way. It works once, for one hour.' };
      },
    },
    {
      method: 'post',
      path: '/auth/reset/confirm',
      summary: 'Set a new password from a reset link (single use, expires after an hour; ends all sessions)',
      access: { kind: 'public' },
      body: ResetConfirmSchema,
      before: [limits.resetConfirmPerIp],
      handler: async ({ body, req }) => {
        await confirmPasswordReset(deps, body.token, body.password, clientIp(req));
        return { reset: true };
      },
    },
  ];
}
