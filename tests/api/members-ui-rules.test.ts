import { ROLES, type Role } from '../../shared/permissions';
import { memberActions } from '../../components/team/member-actions';
import { createOrgWithRoles, createTestApp, signedIn, uniqueTag, type TestApp } from './setup/test-app';

/**
 * The team screen shows "Change role" / "Remove" exactly when the API would accept them: for every
 * acting role and every target role, the UI rule (components/team/member-actions.ts) is compared
 * with what the server answers.
 */
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t?.close();
});

/** Targets never sign in: a placeholder hash keeps this suite quick (no bcrypt per row). */
async function addMember(organisationId: number, role: Role) {
  const user = await t.deps.models.User.create({ email: `target.${uniqueTag()}@rules.example`, name: 'Target', passwordHash: '!' });
  return t.deps.models.Membership.create({ organisationId, userId: user.id, role });
}

test.each(ROLES)('acting as %s: the shown controls match the server for every target role', async (actor) => {
  const org = await createOrgWithRoles(t.deps, `Rules ${actor}`);
  const agent = await signedIn(t.app, org.users[actor].email);
  const mismatches: string[] = [];
  for (const targetRole of ROLES) {
    const owners = await t.deps.models.Membership.count({ where: { organisationId: org.organisationId, role: 'owner' } });
    const target = await addMember(org.organisationId, targetRole);
    const ui = memberActions(actor, { role: targetRole }, owners + (targetRole === 'owner' ? 1 : 0));
    const newRole: Role = targetRole === 'viewer' ? 'dispatcher' : 'viewer';
    const patch = await agent.patch(`/members/${target.id}`, { role: newRole });
    if ((patch.status === 200) !== ui.changeRole) mismatches.push(`change ${targetRole}: server ${patch.status}, UI shows ${ui.changeRole}`);
    const target2 = await addMember(org.organisationId, targetRole);
    const del = await agent.delete(`/members/${target2.id}`);
    if ((del.status === 204) !== ui.remove) mismatches.push(`remove ${targetRole}: server ${del.status}, UI shows ${ui.remove}`);
  }
  // "Owner" is offered as a new role exactly when the server accepts the promotion.
  const candidate = await addMember(org.organisationId, 'viewer');
  const promote = await agent.patch(`/members/${candidate.id}`, { role: 'owner' });
  const view = memberActions(actor, { role: 'viewer' }, 2);
  const offered = view.changeRole && view.roleOptions.includes('owner');
  if ((promote.status === 200) !== offered) mismatches.push(`promote to owner: server ${promote.status}, UI offers ${offered}`);
  // The last owner: no controls, and the server refuses too.
  if (actor === 'owner') {
    const solo = await createOrgWithRoles(t.deps, 'Rules solo');
    const soloOwner = await signedIn(t.app, solo.users.owner.email);
    expect(memberActions('owner', { role: 'owner' }, 1)).toMatchObject({ changeRole: false, remove: false });
    await soloOwner.patch(`/members/${solo.users.owner.membershipId}`, { role: 'admin' }).expect(409);
  }
  expect(mismatches).toEqual([]);
});
