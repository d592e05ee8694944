import request from 'supertest';
import { applyTestEnv } from '../../support/env';
import type { Deps } from '../../../server/deps';
import type { Role } from '../../../shared/permissions';

/**
 * The real Express app on the test database, without listening (supertest drives it). Shared by
 * the api suites: `const t = await createTestApp(); … await t.close();`
 */
export async function createTestApp() {
  applyTestEnv();
  const { loadConfig } = await import('../../../server/config');
  const { createDeps, closeDeps } = await import('../../../server/deps');
  const { createApp } = await import('../../../server/app');
  const { serverExtras } = await import('../../../server/bootstrap');
  const { billingRunHooks } = await import('../../../server/services/billing-run-hooks');
  const deps = createDeps(loadConfig(), { runHooks: billingRunHooks });
  const { app } = createApp(deps, serverExtras(deps));
  return { deps, app, close: () => closeDeps(deps) };
}

export type TestApp = Awaited<ReturnType<typeof createTestApp>>;

/** A short unique tag, so suites can share one database without colliding. */
export const uniqueTag = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;

export const TEST_PASSWORD = 'yard-lantern-velvet-9';

/** A supertest agent with a session and its CSRF token; `send` adds the header on writes. */
export async function sessionAgent(app: TestApp['app']) {
  const agent = request.agent(app);
  const csrf = async () => (await agent.get('/api/auth/csrf').expect(200)).body.csrfToken as string;
  let token = await csrf();
  const write = (method: 'post' | 'patch' | 'put' | 'delete', path: string, body?: unknown) => {
    const r = agent[method](`/api${path}`).set('x-csrf-token', token);
    return body === undefined ? r : r.send(body as object);
  };
  return {
    agent,
    get: (path: string) => agent.get(`/api${path}`),
    post: (path: string, body?: unknown) => write('post', path, body ?? {}),
    patch: (path: string, body?: unknown) => write('patch', path, body ?? {}),
    put: (path: string, body?: unknown) => write('put', path, body ?? {}),
    delete: (path: string, body?: unknown) => write('delete', path, body),
    /** After sign-in the session id and CSRF token change. */
    refreshCsrf: async () => {
      token = await csrf();
    },
    async signIn(email: string, password: string) {
      const res = await write('post', '/auth/sign-in', { email, password });
      token = await csrf();
      return res;
    },
  };
}
export type SessionAgent = Awaited<ReturnType<typeof sessionAgent>>;

/**
 * An organisation with one member per role, written straight through the services (no e-mail):
 * for suites that need signed-in people of every role. `plan` defaults to 'team' (10 seats).
 */
export async function createOrgWithRoles(deps: Deps, label: string, plan = 'team') {
  const { createUser } = await import('../../../server/services/accounts');
  const tag = uniqueTag();
  const roles: Role[] = ['owner', 'admin', 'analyst', 'dispatcher', 'viewer'];
  return deps.db.transaction(async (transaction) => {
    const org = await deps.models.Organisation.create({ name: `${label} ${tag}`, plan }, { transaction });
    const users = {} as Record<Role, { id: number; email: string; password: string; membershipId: number }>;
    for (const role of roles) {
      const email = `${role}.${tag}@${label.toLowerCase().replace(/[^a-z0-9]+/g, '-')}.example`;
      const user = await createUser(deps, { email, name: `${label} ${role}`, password: TEST_PASSWORD }, transaction);
      await user.update({ lastOrganisationId: org.id }, { transaction });
      const m = await deps.models.Membership.create({ organisationId: org.id, userId: user.id, role }, { transaction });
      users[role] = { id: user.id, email, password: TEST_PASSWORD, membershipId: m.id };
    }
    return { organisationId: org.id, name: org.name, tag, users };
  });
}

export type OrgWithRoles = Awaited<ReturnType<typeof createOrgWithRoles>>;

/** A signed-in agent for one person. */
export async function signedIn(app: TestApp['app'], email: string, password = TEST_PASSWORD): Promise<SessionAgent> {
  const a = await sessionAgent(app);
  const res = await a.signIn(email, password);
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return a;
}
