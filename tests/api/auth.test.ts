import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import { createTestApp, sessionAgent, signedIn, uniqueTag, TEST_PASSWORD, type TestApp } from './setup/test-app';

let t: TestApp;
let mail: MailCatcher;

beforeAll(async () => {
  mail = await startMailCatcher({ smtpPort: 1026 });
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
  await mail?.close();
});

const newPerson = () => {
  const tag = uniqueTag();
  return { email: `ada.${tag}@harbour-test.example`, password: TEST_PASSWORD, name: 'Ada Kestrel', organisationName: `Kestrel Haulage ${tag}` };
};

describe('sign-up and sign-in', () => {
  test('sign-up creates the user and a new organisation with the user as owner, and signs in', async () => {
    const a = await sessionAgent(t.app);
    const p = newPerson();
    const res = await a.post('/auth/sign-up', p).expect(201);
    expect(res.body.user).toMatchObject({ email: p.email, name: p.name });
    expect(res.body.organisations).toEqual([{ id: expect.any(Number), name: p.organisationName, role: 'owner' }]);
    expect(res.body.current).toEqual(res.body.organisations[0]);
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/spinyard\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const me = await a.get('/auth/me').expect(200);
    expect(me.body.current.role).toBe('owner');
    const stored = await t.deps.models.User.findOne({ where: { email: p.email } });
    expect(stored!.passwordHash).toMatch(/^\$2[aby]\$1\d\$/); // bcrypt, cost ≥ 10 (common practice)
    expect(stored!.passwordHash).not.toContain(p.password);
  });

  test('a short or common password is refused with a field error, and nothing is written', async () => {
    const a = await sessionAgent(t.app);
    const p = newPerson();
    const short = await a.post('/auth/sign-up', { ...p, password: 'short' }).expect(400);
    expect(short.body.fields.password[0]).toMatch(/10 characters/);
    const common = await a.post('/auth/sign-up', { ...p, password: 'password123' }).expect(400);
    expect(common.body.fields.password[0]).toMatch(/common/);
    expect(await t.deps.models.User.count({ where: { email: p.email } })).toBe(0);
    expect(await t.deps.models.Organisation.count({ where: { name: p.organisationName } })).toBe(0);
  });

  test('a duplicate e-mail on sign-up is refused with 409', async () => {
    const p = newPerson();
    await (await sessionAgent(t.app)).post('/auth/sign-up', p).expect(201);
    const again = await (await sessionAgent(t.app)).post('/auth/sign-up', { ...p, organisationName: 'Other' }).expect(409);
    expect(again.body.code).toBe('email_taken');
  });

  test('wrong password and unknown e-mail get the same generic answer; the failure is audited', async () => {
    const p = newPerson();
    const owner = await sessionAgent(t.app);
    const created = await owner.post('/auth/sign-up', p).expect(201);
    const a = await sessionAgent(t.app);
    const wrong = await a.signIn(p.email, 'not-the-password-at-all');
    const unknown = await a.signIn(`nobody.${uniqueTag()}@harbour-test.example`, 'not-the-password-at-all');
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    const events = await t.deps.models.AuditEvent.findAll({ where: { organisationId: created.body.current.id, action: 'auth.sign_in_failed' } });
    expect(events).toHaveLength(1);
    expect(events[0].ip).toBeTruthy();
  });

  test('sign-in regenerates the session id, and sign-out ends the session', async () => {
    const p = newPerson();
    await (await sessionAgent(t.app)).post('/auth/sign-up', p).expect(201);
    const a = await sessionAgent(t.app);
    const pre = await a.get('/auth/csrf').expect(200); // the session exists before sign-in (it holds the CSRF token)
    const before = String(pre.headers['set-cookie']).match(/spinyard\.sid=([^;]+)/)?.[1];
    expect(before).toBeTruthy();
    const res = await a.signIn(p.email, p.password);
    expect(res.status).toBe(200);
    const after = String(res.headers['set-cookie']).match(/spinyard\.sid=([^;]+)/)?.[1];
    expect(after).toBeTruthy();
    expect(after).not.toBe(before);
    await a.get('/auth/me').expect(200);
    await a.post('/auth/sign-out').expect(204);
    await a.get('/auth/me').expect(401);
  });

  test('malformed bodies get 400 with zod field errors', async () => {
    const a = await sessionAgent(t.app);
    const res = await a.post('/auth/sign-in', { email: 'not-an-address' }).expect(400);
    expect(Object.keys(res.body.fields).sort()).toEqual(['email', 'password']);
  });
});

describe('CSRF', () => {
  test('a state-changing request without the token (or with a wrong one) is refused with code csrf', async () => {
    const p = newPerson();
    const a = await sessionAgent(t.app);
    await a.post('/auth/sign-up', p).expect(201);
    await a.refreshCsrf();
    const missing = await a.agent.post('/api/auth/password').send({ currentPassword: p.password, newPassword: 'a-new-lantern-77' }).expect(403);
    expect(missing.body.code).toBe('csrf');
    const wrong = await a.agent.post('/api/auth/password').set('x-csrf-token', 'forged-value-1234567890').send({ currentPassword: p.password, newPassword: 'a-new-lantern-77' }).expect(403);
    expect(wrong.body.code).toBe('csrf');
    // Reads need no token.
    await a.agent.get('/api/auth/me').expect(200);
    // The same request with the session's token goes through.
    await a.post('/auth/password', { currentPassword: p.password, newPassword: 'a-new-lantern-77' }).expect(204);
  });
});

describe('passwords', () => {
  test('change password needs the current one; the new one works afterwards', async () => {
    const p = newPerson();
    const a = await sessionAgent(t.app);
    await a.post('/auth/sign-up', p).expect(201);
    await a.refreshCsrf();
    const bad = await a.post('/auth/password', { currentPassword: 'wrong-current-pw', newPassword: 'a-fresh-beacon-31' }).expect(400);
    expect(bad.body.fields.currentPassword).toBeDefined();
    await a.post('/auth/password', { currentPassword: p.password, newPassword: 'a-fresh-beacon-31' }).expect(204);
    expect((await (await sessionAgent(t.app)).signIn(p.email, p.password)).status).toBe(401);
    await signedIn(t.app, p.email, 'a-fresh-beacon-31');
  });

  test('reset: always 202; the e-mailed link sets a new password once, then is refused; other sessions end', async () => {
    const p = newPerson();
    const first = await sessionAgent(t.app);
    await first.post('/auth/sign-up', p).expect(201);
    const a = await sessionAgent(t.app);
    const nobody = await a.post('/auth/reset/request', { email: `nobody.${uniqueTag()}@harbour-test.example` }).expect(202);
    const res = await a.post('/auth/reset/request', { email: p.email }).expect(202);
    expect(res.body).toEqual(nobody.body); // no hint whether the address exists
    const m = await mail.waitFor((x) => x.to.includes(p.email) && /reset/i.test(x.subject));
    const token = decodeURIComponent(m.text.match(/\/reset\?token=([^\s]+)/)![1]);
    await a.post('/auth/reset/confirm', { token, password: 'password123' }).expect(400);
    await a.post('/auth/reset/confirm', { token, password: 'tidewater-sparrow-8' }).expect(200);
    const again = await a.post('/auth/reset/confirm', { token, password: 'another-tidewater-9' }).expect(410);
    expect(again.body.code).toBe('link_expired');
    await first.get('/auth/me').expect(401); // the old session was ended
    await signedIn(t.app, p.email, 'tidewater-sparrow-8');
  });

  test('an expired reset link is refused', async () => {
    const p = newPerson();
    await (await sessionAgent(t.app)).post('/auth/sign-up', p).expect(201);
    const a = await sessionAgent(t.app);
    await a.post('/auth/reset/request', { email: p.email }).expect(202);
    const m = await mail.waitFor((x) => x.to.includes(p.email) && /reset/i.test(x.subject));
    const token = decodeURIComponent(m.text.match(/\/reset\?token=([^\s]+)/)![1]);
    const user = await t.deps.models.User.findOne({ where: { email: p.email } });
    await t.deps.models.PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user!.id } });
    const res = await a.post('/auth/reset/confirm', { token, password: 'tidewater-sparrow-8' }).expect(410);
    expect(res.body.error).toMatch(/Ask for a new one/);
  });
});

describe('rate limits', () => {
  test('repeated failed sign-ins for one e-mail are refused with 429 (even with the right password); another address from the same IP still signs in', async () => {
    const p = newPerson();
    await (await sessionAgent(t.app)).post('/auth/sign-up', p).expect(201);
    const a = await sessionAgent(t.app);
    const statuses: number[] = [];
    for (let i = 0; i < 10; i++) statuses.push((await a.signIn(p.email, `wrong-guess-number-${i}`)).status);
    expect(statuses.slice(0, 8)).toEqual(Array(8).fill(401));
    expect(statuses.slice(8)).toEqual([429, 429]);
    const blocked = await a.signIn(p.email, p.password);
    expect(blocked.status).toBe(429);
    expect(blocked.body.code).toBe('rate_limited');
    // Another address from the same IP is not blocked by this one's limit.
    const q = newPerson();
    await (await sessionAgent(t.app)).post('/auth/sign-up', q).expect(201);
    expect((await a.signIn(q.email, q.password)).status).toBe(200);
  });
});
