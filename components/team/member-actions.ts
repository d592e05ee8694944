import { ROLES, can, type Role } from '../../shared/permissions';

/**
 * What the viewer may do to one member — the same rules the server enforces
 * (server/services/accounts-members.ts), so the team screen never shows a control that would be
 * refused. Checked against the API in tests/api/members-ui-rules.test.ts.
 */
export function memberActions(myRole: Role | null, target: { role: Role }, ownerCount: number): { changeRole: boolean; remove: boolean; roleOptions: Role[] } {
  const manage = can(myRole, 'members:manage');
  const owner = myRole === 'owner';
  const lastOwner = target.role === 'owner' && ownerCount <= 1; // the organisation always keeps an owner
  const mayTouch = manage && (target.role !== 'owner' || owner) && !lastOwner;
  return { changeRole: mayTouch, remove: mayTouch, roleOptions: ROLES.filter((r) => r !== 'owner' || owner) };
}
