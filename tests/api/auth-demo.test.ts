import { ROLES } from '../../shared/permissions';
import { DEMO_ORGANISATION_NAME, DEMO_PASSWORD, DEMO_USERS, ensureDemoOrganisation } from '../../server/services/seed-demo';
import { createTestApp, signedIn, type TestApp } from './setup/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

/** Rows of the demo organisation only (other suites may write to the same database meanwhile). */
async function counts() {
  const m = t.deps.models;
  const orgs = await m.Organisation.findAll({ where: { name: DEMO_ORGANISATION_NAME } });
  const organisationId = orgs.map((o) => o.id);
  return {
    users: await m.User.count({ where: { email: DEMO_USERS.map((u) => u.email) } }),
    orgs: orgs.length,
    memberships: await m.Membership.count({ where: { organisationId } }),
    audit: await m.AuditEvent.count({ where: { organisationId } }),
  };
}

test('the demo seed creates one user per role in the invented organisation, and a second run changes nothing', async () => {
  const first = await ensureDemoOrganisation(t.deps);
  const after1 = await counts();
  const second = await ensureDemoOrganisation(t.deps);
  expect(await counts()).toEqual(after1);
  expect(second).toEqual(first);
  expect(Object.keys(first.users).sort()).toEqual([...ROLES].sort());
  const org = await t.deps.models.Organisation.findByPk(first.organisationId);
  expect(org!.name).toBe(DEMO_ORGANISATION_NAME);
  for (const demo of DEMO_USERS) {
    const a = await signedIn(t.app, demo.email, DEMO_PASSWORD);
    const me = (await a.get('/auth/me').expect(200)).body;
    expect(me.current).toEqual({ id: first.organisationId, name: DEMO_ORGANISATION_NAME, role: demo.role });
  }
});
