import { startTestServer } from '../support/server';
import { createOrgWithRoles, TEST_PASSWORD } from './setup/test-app';

const PORT = 3160;

/** A tiny cookie-keeping client over real HTTP (the server runs as in production, on a port). */
function client(base: string) {
  let cookie = '';
  let csrf = '';
  const call = async (method: string, path: string, body?: unknown) => {
    const res = await fetch(`${base}/api${path}`, {
      method,
      headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}), ...(method !== 'GET' && csrf ? { 'x-csrf-token': csrf } : {}) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const set = res.headers.get('set-cookie');
    if (set) cookie = set.split(';')[0];
    return res;
  };
  return {
    call,
    get cookie() {
      return cookie;
    },
    async fetchCsrf() {
      csrf = ((await (await call('GET', '/auth/csrf')).json()) as { csrfToken: string }).csrfToken;
    },
    setBase(next: string) {
      base = next;
    },
  };
}

test('a signed-in session survives a server restart (sessions live in MariaDB)', async () => {
  let server = await startTestServer(PORT);
  try {
    const org = await createOrgWithRoles(server.deps, 'Restart');
    const c = client(server.url);
    await c.fetchCsrf();
    expect((await c.call('POST', '/auth/sign-in', { email: org.users.viewer.email, password: TEST_PASSWORD })).status).toBe(200);
    const cookie = c.cookie;
    expect((await c.call('GET', '/auth/me')).status).toBe(200);
    await server.stop();
    server = await startTestServer(PORT);
    const me = await c.call('GET', '/auth/me');
    expect(me.status).toBe(200);
    expect(((await me.json()) as { user: { email: string } }).user.email).toBe(org.users.viewer.email);
    expect(c.cookie).toBe(cookie);
    // The CSRF token stored in the session survives too.
    await c.fetchCsrf();
    expect((await c.call('POST', '/auth/sign-out')).status).toBe(204);
    expect((await c.call('GET', '/auth/me')).status).toBe(401);
  } finally {
    await server.stop();
  }
});
