import { startMailCatcher, type MailCatcher } from '../../server/fakes/mail/mail-catcher';
import { createOrgWithRoles, createTestApp, sessionAgent, signedIn, uniqueTag, TEST_PASSWORD, type TestApp } from './setup/test-app';

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

const linkToken = (text: string) => decodeURIComponent(text.match(/\/invite\?token=([^\s]+)/)![1]);

async function freeOrgOwner() {
  const a = await sessionAgent(t.app);
  const tag = uniqueTag();
  const email = `owner.${tag}@fjord-test.example`;
  const res = await a.post('/auth/sign-up', { email, password: TEST_PASSWORD, name: 'Ines Fjord', organisationName: `Fjord Carriers ${tag}` }).expect(201);
  await a.refreshCsrf();
  return { a, email, tag, organisationId: res.body.current.id as number, orgName: res.body.current.name as string };
}

describe('invitations', () => {
  test('the invitation e-mail arrives at the SMTP fake; its link makes a new account that joins with the invited role', async () => {
    const { a, tag, orgName, organisationId } = await freeOrgOwner();
    const invitee = `new.${tag}@fjord-test.example`;
    const inv = await a.post('/invitations', { email: invitee, role: 'dispatcher' }).expect(201);
    expect(inv.body).toMatchObject({ email: invitee, role: 'dispatcher', expired: false });
    const m = await mail.waitFor((x) => x.to.includes(invitee));
    expect(m.subject).toContain(orgName);
    expect(m.text).toMatch(/http:\/\/127\.0\.0\.1:\d+\/invite\?token=/);
    const token = linkToken(m.text);

    const visitor = await sessionAgent(t.app);
    const preview = await visitor.get(`/invitations/lookup?token=${encodeURIComponent(token)}`).expect(200);
    expect(preview.body).toMatchObject({ organisationName: orgName, email: invitee, role: 'dispatcher', accountExists: false });
    const missing = await visitor.post('/invitations/accept', { token }).expect(400);
    expect(Object.keys(missing.body.fields).sort()).toEqual(['name', 'password']);
    const joined = await visitor.post('/invitations/accept', { token, name: 'Noor Tarn', password: 'harbour-crane-lights' }).expect(200);
    expect(joined.body.current).toEqual({ id: organisationId, name: orgName, role: 'dispatcher' });
    await visitor.refreshCsrf();
    const members = await visitor.get('/members').expect(200);
    expect(members.body.members.map((x: { email: string; role: string }) => [x.email, x.role])).toContainEqual([invitee, 'dispatcher']);
    // Single use.
    const again = await (await sessionAgent(t.app)).post('/invitations/accept', { token, name: 'X', password: 'harbour-crane-lights' }).expect(410);
    expect(again.body.code).toBe('invitation_expired');
    // Audited.
    const actions = (await a.get('/audit').expect(200)).body.items.map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['invitation.created', 'invitation.accepted', 'member.joined']));
  });

  test('an existing account joins with its password, or while signed in; a wrong password is refused', async () => {
    const { a, tag } = await freeOrgOwner();
    const other = await freeOrgOwner();
    await a.post('/invitations', { email: other.email, role: 'analyst' }).expect(201);
    const token = linkToken((await mail.waitFor((x) => x.to.includes(other.email))).text);
    const visitor = await sessionAgent(t.app);
    expect((await visitor.get(`/invitations/lookup?token=${encodeURIComponent(token)}`)).body.accountExists).toBe(true);
    await visitor.post('/invitations/accept', { token, password: 'wrong-password-here' }).expect(401);
    const joined = await visitor.post('/invitations/accept', { token, password: TEST_PASSWORD }).expect(200);
    expect(joined.body.organisations).toHaveLength(2);
    expect(joined.body.current.role).toBe('analyst');

    // Signed in: only the token is needed.
    const third = await freeOrgOwner();
    await a.post('/invitations', { email: `someone.${tag}@fjord-test.example`, role: 'viewer' }).expect(201);
    const t3 = linkToken((await mail.waitFor((x) => x.to.includes(`someone.${tag}@fjord-test.example`))).text);
    const res = await third.a.post('/invitations/accept', { token: t3 }).expect(200);
    expect(res.body.current.role).toBe('viewer');
  });

  test('seats: the free plan has 3; the invitation beyond the limit is refused with seat_limit and a way forward', async () => {
    const { a, tag } = await freeOrgOwner(); // 1 member
    await a.post('/invitations', { email: `s1.${tag}@fjord-test.example`, role: 'viewer' }).expect(201); // 2
    await a.post('/invitations', { email: `s2.${tag}@fjord-test.example`, role: 'viewer' }).expect(201); // 3 = limit
    const over = await a.post('/invitations', { email: `s3.${tag}@fjord-test.example`, role: 'viewer' }).expect(402);
    expect(over.body.code).toBe('seat_limit');
    expect(over.body.error).toMatch(/Billing/);
    const seats = (await a.get('/members').expect(200)).body.seats;
    expect(seats).toMatchObject({ used: 3, limit: 3, plan: 'free' });
    // Cancelling frees the seat.
    const pending = (await a.get('/invitations').expect(200)).body;
    await a.delete(`/invitations/${pending[0].id}`).expect(204);
    await a.post('/invitations', { email: `s3.${tag}@fjord-test.example`, role: 'viewer' }).expect(201);
  });

  test('a duplicate invitation is refused politely with 409; resend sends a fresh link and retires the old one', async () => {
    const { a, tag } = await freeOrgOwner();
    const email = `dup.${tag}@fjord-test.example`;
    const first = await a.post('/invitations', { email, role: 'viewer' }).expect(201);
    const oldToken = linkToken((await mail.waitFor((x) => x.to.includes(email))).text);
    const dup = await a.post('/invitations', { email: email.toUpperCase(), role: 'admin' }).expect(409);
    expect(dup.body.code).toBe('duplicate_invitation');
    const before = mail.messages.length;
    await a.post(`/invitations/${first.body.id}/resend`).expect(200);
    const resent = await mail.waitFor((x) => x.to.includes(email) && mail.messages.indexOf(x) >= before);
    const newToken = linkToken(resent.text);
    expect(newToken).not.toBe(oldToken);
    await (await sessionAgent(t.app)).get(`/invitations/lookup?token=${encodeURIComponent(oldToken)}`).expect(410);
    await (await sessionAgent(t.app)).get(`/invitations/lookup?token=${encodeURIComponent(newToken)}`).expect(200);
  });

  test('when the mail cannot be sent, the invitation is kept and the answer says to resend', async () => {
    const { a, tag } = await freeOrgOwner();
    const email = `nomail.${tag}@fjord-test.example`;
    const send = t.deps.mailer.send;
    t.deps.mailer.send = async () => {
      throw new Error('SMTP down');
    };
    try {
      const res = await a.post('/invitations', { email, role: 'viewer' }).expect(503);
      expect(res.body).toMatchObject({ code: 'mail_failed', error: expect.stringMatching(/Resend/) });
    } finally {
      t.deps.mailer.send = send;
    }
    const pending = (await a.get('/invitations').expect(200)).body;
    expect(pending.map((i: { email: string }) => i.email)).toContain(email);
    await a.post(`/invitations/${pending.find((i: { email: string }) => i.email === email).id}/resend`).expect(200);
    await mail.waitFor((x) => x.to.includes(email));
  });

  test('an expired invitation link leads to a clear 410', async () => {
    const { a, tag, organisationId } = await freeOrgOwner();
    const email = `late.${tag}@fjord-test.example`;
    await a.post('/invitations', { email, role: 'viewer' }).expect(201);
    const token = linkToken((await mail.waitFor((x) => x.to.includes(email))).text);
    await t.deps.models.Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { organisationId, email } });
    const res = await (await sessionAgent(t.app)).post('/invitations/accept', { token, name: 'Late', password: 'harbour-crane-lights' }).expect(410);
    expect(res.body.error).toMatch(/Ask an admin/);
  });
});

describe('members and roles', () => {
  test('the last owner cannot be demoted or removed; with a second owner it can', async () => {
    const org = await createOrgWithRoles(t.deps, 'Owner Guard');
    const owner = await signedIn(t.app, org.users.owner.email);
    const demote = await owner.patch(`/members/${org.users.owner.membershipId}`, { role: 'admin' }).expect(409);
    expect(demote.body.code).toBe('last_owner');
    await owner.delete(`/members/${org.users.owner.membershipId}`).expect(409);
    await owner.patch(`/members/${org.users.admin.membershipId}`, { role: 'owner' }).expect(200);
    await owner.patch(`/members/${org.users.owner.membershipId}`, { role: 'admin' }).expect(200);
  });

  test('an admin cannot change or remove an owner, nor make someone an owner', async () => {
    const org = await createOrgWithRoles(t.deps, 'Admin Limits');
    const admin = await signedIn(t.app, org.users.admin.email);
    await admin.patch(`/members/${org.users.owner.membershipId}`, { role: 'viewer' }).expect(403);
    await admin.delete(`/members/${org.users.owner.membershipId}`).expect(403);
    await admin.patch(`/members/${org.users.viewer.membershipId}`, { role: 'owner' }).expect(403);
    const ok = await admin.patch(`/members/${org.users.viewer.membershipId}`, { role: 'analyst' }).expect(200);
    expect(ok.body.members.find((m: { id: number }) => m.id === org.users.viewer.membershipId).role).toBe('analyst');
    const audit = (await admin.get('/audit?page=1&pageSize=5').expect(200)).body;
    expect(audit.items[0]).toMatchObject({ action: 'member.role_changed', detail: { from: 'viewer', to: 'analyst' }, actor: { email: org.users.admin.email } });
  });

  test('a removed member loses access at once (the role is read on every request)', async () => {
    const org = await createOrgWithRoles(t.deps, 'Removal');
    const viewer = await signedIn(t.app, org.users.viewer.email);
    await viewer.get('/members').expect(200);
    const admin = await signedIn(t.app, org.users.admin.email);
    await admin.delete(`/members/${org.users.viewer.membershipId}`).expect(204);
    const after = await viewer.get('/members').expect(403);
    expect(after.body.error).toMatch(/organisation/);
    expect((await viewer.get('/auth/me').expect(200)).body.current).toBeNull();
  });

  test('ownership transfer: the new owner owns, the old owner becomes admin; only owners may', async () => {
    const org = await createOrgWithRoles(t.deps, 'Transfer');
    const admin = await signedIn(t.app, org.users.admin.email);
    await admin.post('/organisation/transfer', { userId: org.users.admin.id }).expect(403);
    const owner = await signedIn(t.app, org.users.owner.email);
    const res = await owner.post('/organisation/transfer', { userId: org.users.dispatcher.id }).expect(200);
    const roles = Object.fromEntries(res.body.members.map((m: { userId: number; role: string }) => [m.userId, m.role]));
    expect(roles[org.users.dispatcher.id]).toBe('owner');
    expect(roles[org.users.owner.id]).toBe('admin');
  });

  test('closing the organisation needs the typed name, and then nobody is a member', async () => {
    const org = await createOrgWithRoles(t.deps, 'Closing');
    const owner = await signedIn(t.app, org.users.owner.email);
    const wrong = await owner.delete('/organisation', { confirmName: 'not the name' }).expect(400);
    expect(wrong.body.fields.confirmName).toBeDefined();
    await owner.delete('/organisation', { confirmName: org.name }).expect(204);
    expect((await owner.get('/auth/me').expect(200)).body.organisations).toEqual([]);
    expect(await t.deps.models.Membership.count({ where: { organisationId: org.organisationId } })).toBe(0);
  });

  test('switching organisation: only to one you belong to', async () => {
    const a = await createOrgWithRoles(t.deps, 'Switch A');
    const b = await createOrgWithRoles(t.deps, 'Switch B');
    await t.deps.models.Membership.create({ organisationId: b.organisationId, userId: a.users.viewer.id, role: 'analyst' });
    const viewer = await signedIn(t.app, a.users.viewer.email);
    const res = await viewer.post('/auth/switch', { organisationId: b.organisationId }).expect(200);
    expect(res.body.current).toMatchObject({ id: b.organisationId, role: 'analyst' });
    await viewer.post('/auth/switch', { organisationId: (await createOrgWithRoles(t.deps, 'Switch C')).organisationId }).expect(403);
  });
});

describe('audit log', () => {
  test('paginated, newest first, visible to admins only', async () => {
    const org = await createOrgWithRoles(t.deps, 'Audit Pages');
    for (const role of ['viewer', 'analyst'] as const) await signedIn(t.app, org.users[role].email); // two sign-ins
    const admin = await signedIn(t.app, org.users.admin.email);
    const p1 = (await admin.get('/audit?page=1&pageSize=2').expect(200)).body;
    const p2 = (await admin.get('/audit?page=2&pageSize=2').expect(200)).body;
    expect(p1.total).toBe(3);
    expect(p1.items).toHaveLength(2);
    expect(p2.items).toHaveLength(1);
    expect(p1.items[0].id).toBeGreaterThan(p1.items[1].id);
    expect(p1.items[0]).toMatchObject({ action: 'auth.signed_in', actor: { email: org.users.admin.email } });
    expect(p1.items[0].ip).toBeTruthy();
    await (await signedIn(t.app, org.users.analyst.email)).get('/audit').expect(403);
    await admin.get('/audit?pageSize=1000').expect(400);
  });
});
