import type { Transaction } from 'sequelize';
import type { Deps } from '../deps';
import type { Role } from '../../shared/permissions';
import { planLabel, seatLimit } from '../../shared/plans';
import type { MembersAnswer } from '../../shared/schemas/auth';
import { HttpError, badRequest, forbidden, notFound } from '../lib/http-error';
import { recordAudit } from './audit';
import { seatsInUse, type Actor } from './invitations';
import { purchasedSeats } from './billing-seats';

const lastOwner = () =>
  new HttpError(409, 'The organisation needs at least one owner. Make another member an owner (or transfer ownership) first.', { code: 'last_owner' });

export async function listMembers(deps: Deps, organisationId: number): Promise<MembersAnswer> {
  const { Membership, User, Organisation } = deps.models;
  const org = await Organisation.findByPk(organisationId);
  if (!org) throw notFound('Organisation');
  const memberships = await Membership.findAll({ where: { organisationId }, order: [['id', 'ASC']] });
  const users = memberships.length ? await User.findAll({ where: { id: memberships.map((m) => m.userId) } }) : [];
  const byId = new Map(users.map((u) => [u.id, u]));
  return {
    members: memberships
      .filter((m) => byId.has(m.userId))
      .map((m) => ({ id: m.id, userId: m.userId, email: byId.get(m.userId)!.email, name: byId.get(m.userId)!.name, role: m.role, joinedAt: m.createdAt.toISOString() })),
    seats: { used: await seatsInUse(deps, organisationId), limit: seatLimit(org.plan, await purchasedSeats(deps, organisationId)), plan: org.plan, planLabel: planLabel(org.plan) },
  };
}

/** All memberships of the organisation, locked: owner counts must not race. */
async function lockedMemberships(deps: Deps, organisationId: number, transaction: Transaction) {
  return deps.models.Membership.findAll({ where: { organisationId }, transaction, lock: transaction.LOCK.UPDATE });
}

function assertMayTouchOwner(actor: Actor, targetRole: Role, newRole: Role | null) {
  if ((targetRole === 'owner' || newRole === 'owner') && actor.role !== 'owner') {
    throw forbidden('Only an owner can change an owner, remove an owner, or make someone an owner.');
  }
}

export async function changeMemberRole(deps: Deps, organisationId: number, actor: Actor, membershipId: number, role: Role): Promise<void> {
  await deps.db.transaction(async (transaction) => {
    const all = await lockedMemberships(deps, organisationId, transaction);
    const target = all.find((m) => m.id === membershipId);
    if (!target) throw notFound('Member');
    assertMayTouchOwner(actor, target.role, role);
    if (target.role === role) return;
    if (target.role === 'owner' && all.filter((m) => m.role === 'owner').length === 1) throw lastOwner();
    const from = target.role;
    await target.update({ role }, { transaction });
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'member.role_changed', targetType: 'user', targetId: target.userId, detail: { from, to: role }, ip: actor.ip }, { transaction });
  });
}

/** Remove a member; their API tokens for this organisation stop working with them. */
export async function removeMember(deps: Deps, organisationId: number, actor: Actor, membershipId: number): Promise<void> {
  await deps.db.transaction(async (transaction) => {
    const all = await lockedMemberships(deps, organisationId, transaction);
    const target = all.find((m) => m.id === membershipId);
    if (!target) throw notFound('Member');
    assertMayTouchOwner(actor, target.role, null);
    if (target.role === 'owner' && all.filter((m) => m.role === 'owner').length === 1) throw lastOwner();
    await target.destroy({ transaction });
    await deps.models.ApiToken.update({ revokedAt: new Date() }, { where: { organisationId, userId: target.userId, revokedAt: null }, transaction });
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'member.removed', targetType: 'user', targetId: target.userId, detail: { role: target.role }, ip: actor.ip }, { transaction });
  });
}

/** The owner hands the organisation to another member, who becomes owner; the old owner stays as admin. */
export async function transferOwnership(deps: Deps, organisationId: number, actor: Actor, toUserId: number): Promise<void> {
  if (toUserId === actor.userId) throw badRequest('You already own this organisation; choose another member.', { userId: ['Choose another member.'] });
  await deps.db.transaction(async (transaction) => {
    const all = await lockedMemberships(deps, organisationId, transaction);
    const from = all.find((m) => m.userId === actor.userId);
    const to = all.find((m) => m.userId === toUserId);
    if (!to) throw notFound('Member');
    if (!from || from.role !== 'owner') throw forbidden('Only an owner can transfer ownership.');
    const previousRole = to.role;
    await to.update({ role: 'owner' }, { transaction });
    await from.update({ role: 'admin' }, { transaction });
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'organisation.ownership_transferred', targetType: 'user', targetId: toUserId, detail: { previousRole }, ip: actor.ip }, { transaction });
  });
}

/**
 * Close the organisation: the typed name must match. Members, invitations and tokens go; the
 * organisation row and its audit trail stay (closed), so history is not lost.
 */
export async function closeOrganisation(deps: Deps, organisationId: number, actor: Actor, confirmName: string): Promise<void> {
  await deps.db.transaction(async (transaction) => {
    const org = await deps.models.Organisation.findByPk(organisationId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!org || org.closedAt) throw notFound('Organisation');
    if (confirmName.trim() !== org.name) throw badRequest('Type the organisation name exactly to confirm.', { confirmName: [`Type "${org.name}" to confirm.`] });
    await org.update({ closedAt: new Date() }, { transaction });
    await deps.models.Membership.destroy({ where: { organisationId }, transaction });
    await deps.models.Invitation.destroy({ where: { organisationId }, transaction });
    await deps.models.ApiToken.update({ revokedAt: new Date() }, { where: { organisationId, revokedAt: null }, transaction });
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'organisation.closed', targetType: 'organisation', targetId: organisationId, detail: { name: org.name }, ip: actor.ip }, { transaction });
  });
}
