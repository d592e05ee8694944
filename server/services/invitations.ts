import { Op, type Transaction } from 'sequelize';
import type { Deps } from '../deps';
import { ROLE_LABELS, type Role } from '../../shared/permissions';
import { planLabel, seatLimit } from '../../shared/plans';
import type { Invitation, InvitationPreview } from '../../shared/schemas/auth';
import { HttpError, badRequest, forbidden, notFound, unauthorized } from '../lib/http-error';
import { checkCredentials, createUser, findUserByEmail, rememberOrganisation } from './accounts';
import { recordAudit } from './audit';
import { purchasedSeats } from './billing-seats';
import { newSecret, sha256Hex } from './tokens-secret';
import type { InvitationModel } from '../models/invitation';

export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

export interface Actor {
  userId: number;
  role: Role;
  ip: string | null;
}

const pendingWhere = (organisationId: number) => ({ organisationId, acceptedAt: { [Op.is]: null } });

/** Seats in use: members plus pending invitations that have not expired. */
export async function seatsInUse(deps: Pick<Deps, 'models'>, organisationId: number, transaction?: Transaction): Promise<number> {
  const members = await deps.models.Membership.count({ where: { organisationId }, transaction });
  const pending = await deps.models.Invitation.count({ where: { ...pendingWhere(organisationId), expiresAt: { [Op.gt]: new Date() } }, transaction });
  return members + pending;
}

function seatLimitError(plan: string, limit: number) {
  return new HttpError(402, `All ${limit} seats of the ${planLabel(plan)} plan are in use (members plus pending invitations). Cancel a pending invitation or remove a member, or add seats on the Billing page.`, { code: 'seat_limit', limit });
}

/** The organisation row, locked for the rest of the transaction so seat counts cannot race. */
async function lockOrganisation(deps: Deps, organisationId: number, transaction: Transaction) {
  const org = await deps.models.Organisation.findByPk(organisationId, { transaction, lock: transaction.LOCK.UPDATE });
  if (!org || org.closedAt) throw notFound('Organisation');
  return org;
}

function assertMayGrant(actor: Actor, role: Role) {
  if (role === 'owner') throw forbidden('Ownership is handed over with "Transfer ownership", not by invitation.');
  if (role === 'admin' && actor.role !== 'owner' && actor.role !== 'admin') throw forbidden('Only owners and admins can invite admins.');
}

function toInvitation(row: InvitationModel, inviterNames: Map<number, string>): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    invitedBy: row.invitedByUserId !== null ? (inviterNames.get(row.invitedByUserId) ?? null) : null,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    expired: row.expiresAt.getTime() < Date.now(),
  };
}

/** The invitation is stored first; if the mail then fails, say so plainly (Resend sends it later). */
async function sendInvitationMail(deps: Deps, to: string, token: string, orgName: string, inviterName: string, role: Role) {
  const link = `${deps.config.publicUrl}/invite?token=${encodeURIComponent(token)}`;
  await deps.mailer.send({
    to,
    subject: `${inviterName} invited you to ${orgName} on Spinyard`,
    text: `Hello,\n\n${inviterName} invited you to join ${orgName} on Spinyard as ${ROLE_LABELS[role]}.\nOpen this link to create your account or join with the one you have:\n\n${link}\n\nThe invitation is valid for 7 days and works once. If you did not expect it, ignore this e-mail.\n`,
  }).catch((err) => {
    deps.logger.error({ err, to }, 'invitation mail failed');
    throw new HttpError(503, `The invitation to ${to} is saved, but the e-mail could not be sent right now. Use "Resend" in the pending list in a few minutes.`, { code: 'mail_failed' });
  });
}

export async function createInvitation(deps: Deps, organisationId: number, actor: Actor, email: string, role: Role): Promise<Invitation> {
  assertMayGrant(actor, role);
  const normalised = email.trim().toLowerCase();
  const token = newSecret();
  const { row, orgName, inviterName } = await deps.db.transaction(async (transaction) => {
    const org = await lockOrganisation(deps, organisationId, transaction);
    const existingUser = await findUserByEmail(deps, normalised, transaction);
    if (existingUser && (await deps.models.Membership.findOne({ where: { organisationId, userId: existingUser.id }, transaction }))) {
      throw new HttpError(409, `${normalised} is already a member of ${org.name}.`, { code: 'already_member', fields: { email: ['Already a member.'] } });
    }
    const pending = await deps.models.Invitation.findOne({ where: { ...pendingWhere(organisationId), email: normalised }, transaction });
    if (pending && pending.expiresAt.getTime() >= Date.now()) {
      throw new HttpError(409, `${normalised} has already been invited. Resend that invitation from the pending list instead.`, { code: 'duplicate_invitation', fields: { email: ['Already invited.'] } });
    }
    const limit = seatLimit(org.plan, await purchasedSeats(deps, organisationId, transaction));
    if ((await seatsInUse(deps, organisationId, transaction)) >= limit) throw seatLimitError(org.plan, limit);
    if (pending) await pending.destroy({ transaction }); // an expired invitation to the same address is replaced
    const inviter = await deps.models.User.findByPk(actor.userId, { transaction });
    const created = await deps.models.Invitation.create(
      { organisationId, email: normalised, role, tokenHash: sha256Hex(token), invitedByUserId: actor.userId, expiresAt: new Date(Date.now() + INVITATION_TTL_MS) },
      { transaction },
    );
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'invitation.created', targetType: 'invitation', targetId: created.id, detail: { email: normalised, role }, ip: actor.ip }, { transaction });
    return { row: created, orgName: org.name, inviterName: inviter?.name ?? 'A colleague' };
  });
  await sendInvitationMail(deps, normalised, token, orgName, inviterName, role);
  return toInvitation(row, new Map([[actor.userId, inviterName]]));
}

export async function listInvitations(deps: Deps, organisationId: number): Promise<Invitation[]> {
  const rows = await deps.models.Invitation.findAll({ where: pendingWhere(organisationId), order: [['id', 'ASC']] });
  const ids = [...new Set(rows.map((r) => r.invitedByUserId).filter((x): x is number => x !== null))];
  const users = ids.length ? await deps.models.User.findAll({ where: { id: ids } }) : [];
  const names = new Map(users.map((u) => [u.id, u.name]));
  return rows.map((r) => toInvitation(r, names));
}

async function pendingInvitation(deps: Deps, organisationId: number, id: number, transaction: Transaction) {
  const row = await deps.models.Invitation.findOne({ where: { ...pendingWhere(organisationId), id }, transaction, lock: transaction.LOCK.UPDATE });
  if (!row) throw notFound('Invitation');
  return row;
}

export async function cancelInvitation(deps: Deps, organisationId: number, actor: Actor, id: number): Promise<void> {
  await deps.db.transaction(async (transaction) => {
    const row = await pendingInvitation(deps, organisationId, id, transaction);
    await row.destroy({ transaction });
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'invitation.cancelled', targetType: 'invitation', targetId: id, detail: { email: row.email, role: row.role }, ip: actor.ip }, { transaction });
  });
}

/** A fresh link (the old one stops working) and a fresh 7-day window. */
export async function resendInvitation(deps: Deps, organisationId: number, actor: Actor, id: number): Promise<Invitation> {
  const token = newSecret();
  const { row, orgName, inviterName } = await deps.db.transaction(async (transaction) => {
    const org = await lockOrganisation(deps, organisationId, transaction);
    const inv = await pendingInvitation(deps, organisationId, id, transaction);
    assertMayGrant(actor, inv.role);
    // An expired invitation no longer holds a seat; renewing it takes one again.
    if (inv.expiresAt.getTime() < Date.now()) {
      const limit = seatLimit(org.plan, await purchasedSeats(deps, organisationId, transaction));
      if ((await seatsInUse(deps, organisationId, transaction)) >= limit) throw seatLimitError(org.plan, limit);
    }
    await inv.update({ tokenHash: sha256Hex(token), expiresAt: new Date(Date.now() + INVITATION_TTL_MS) }, { transaction });
    await recordAudit(deps, { organisationId, actorUserId: actor.userId, action: 'invitation.resent', targetType: 'invitation', targetId: id, detail: { email: inv.email }, ip: actor.ip }, { transaction });
    const inviter = await deps.models.User.findByPk(actor.userId, { transaction });
    return { row: inv, orgName: org.name, inviterName: inviter?.name ?? 'A colleague' };
  });
  await sendInvitationMail(deps, row.email, token, orgName, inviterName, row.role);
  return toInvitation(row, new Map([[actor.userId, inviterName]]));
}

const invitationGone = () =>
  new HttpError(410, 'This invitation has expired, was cancelled, or was already used. Ask an admin of the organisation to send a new one.', { code: 'invitation_expired' });

async function usableInvitation(deps: Deps, token: string, transaction?: Transaction) {
  const row = await deps.models.Invitation.findOne({ where: { tokenHash: sha256Hex(token) }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!row || row.acceptedAt || row.expiresAt.getTime() < Date.now()) throw invitationGone();
  const org = await deps.models.Organisation.findByPk(row.organisationId, { transaction });
  if (!org || org.closedAt) throw invitationGone();
  return { row, org };
}

/** What the invite page shows before the visitor decides. */
export async function previewInvitation(deps: Deps, token: string): Promise<InvitationPreview> {
  const { row, org } = await usableInvitation(deps, token);
  const inviter = row.invitedByUserId !== null ? await deps.models.User.findByPk(row.invitedByUserId) : null;
  return {
    organisationName: org.name,
    email: row.email,
    role: row.role,
    invitedBy: inviter?.name ?? null,
    accountExists: !!(await findUserByEmail(deps, row.email)),
    expiresAt: row.expiresAt.toISOString(),
  };
}

/**
 * Join an organisation from an invitation. A signed-in user joins as themselves (holding the link
 * proves access to the invited mailbox); a visitor whose address has an account gives its
 * password; a new visitor gives a name and a new password and gets an account.
 */
export async function acceptInvitation(
  deps: Deps,
  input: { token: string; name?: string; password?: string; signedInUserId: number | null; ip: string | null },
): Promise<{ userId: number; organisationId: number }> {
  const result = await deps.db.transaction(async (transaction) => {
    const { row, org } = await usableInvitation(deps, input.token, transaction);
    let userId: number;
    if (input.signedInUserId !== null) userId = input.signedInUserId;
    else {
      const existing = await findUserByEmail(deps, row.email, transaction);
      if (existing) {
        if (!input.password) throw badRequest('Enter the password of your Spinyard account to join.', { password: ['Enter your password.'] });
        const ok = await checkCredentials(deps, row.email, input.password);
        if (!ok) throw unauthorized('The password is not correct.');
        userId = existing.id;
      } else {
        const fields: Record<string, string[]> = {};
        if (!input.name) fields.name = ['Enter your name.'];
        if (!input.password) fields.password = ['Choose a password.'];
        if (Object.keys(fields).length) throw badRequest('Enter your name and choose a password to create your account.', fields);
        userId = (await createUser(deps, { email: row.email, name: input.name!, password: input.password! }, transaction)).id;
      }
    }
    const already = await deps.models.Membership.findOne({ where: { organisationId: org.id, userId }, transaction });
    if (!already) await deps.models.Membership.create({ organisationId: org.id, userId, role: row.role }, { transaction });
    await row.update({ acceptedAt: new Date(), acceptedByUserId: userId }, { transaction });
    await recordAudit(deps, { organisationId: org.id, actorUserId: userId, action: 'invitation.accepted', targetType: 'invitation', targetId: row.id, detail: { email: row.email, role: row.role, alreadyMember: !!already }, ip: input.ip }, { transaction });
    if (!already) await recordAudit(deps, { organisationId: org.id, actorUserId: userId, action: 'member.joined', targetType: 'user', targetId: userId, detail: { role: row.role }, ip: input.ip }, { transaction });
    return { userId, organisationId: org.id };
  });
  await rememberOrganisation(deps, result.userId, result.organisationId);
  return result;
}

