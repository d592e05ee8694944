import { Op, QueryTypes, UniqueConstraintError, type Transaction } from 'sequelize';
import type { Deps } from '../deps';
import type { Role } from '../../shared/permissions';
import type { Me, SignUp } from '../../shared/schemas/auth';
import { DEFAULT_PLAN } from '../../shared/plans';
import { HttpError, badRequest } from '../lib/http-error';
import { bcryptCost, hashPassword, passwordProblem, verifyAgainstNothing, verifyPassword } from './passwords';
import { recordAudit } from './audit';
import type { UserModel } from '../models/user';

export type AccountDeps = Pick<Deps, 'models' | 'db' | 'config'>;

/** Refuse a weak new password with the field error beside the password box. */
export function assertGoodPassword(password: string, field: string, context: { email?: string; name?: string } = {}): void {
  const problem = passwordProblem(password, context);
  if (problem) throw badRequest(problem, { [field]: [problem] });
}

export function findUserByEmail(deps: AccountDeps, email: string, transaction?: Transaction): Promise<UserModel | null> {
  return deps.models.User.findOne({ where: { email: email.trim().toLowerCase() }, transaction });
}

const emailTaken = () => new HttpError(409, 'An account with this e-mail already exists. Sign in instead, or reset the password.', { code: 'email_taken', fields: { email: ['An account with this e-mail already exists.'] } });

/** Create a user inside a transaction (sign-up and invitation acceptance). */
export async function createUser(deps: AccountDeps, input: { email: string; name: string; password: string }, transaction: Transaction): Promise<UserModel> {
  assertGoodPassword(input.password, 'password', { email: input.email, name: input.name });
  if (await findUserByEmail(deps, input.email, transaction)) throw emailTaken();
  const passwordHash = await hashPassword(input.password, bcryptCost(deps.config.NODE_ENV));
  try {
    return await deps.models.User.create({ email: input.email.trim().toLowerCase(), name: input.name.trim(), passwordHash }, { transaction });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw emailTaken();
    throw err;
  }
}

/** Sign-up: a new user, a new organisation on the free plan, the user its owner — all or nothing. */
export async function signUp(deps: AccountDeps, input: SignUp, ip: string | null): Promise<{ userId: number; organisationId: number }> {
  return deps.db.transaction(async (transaction) => {
    const user = await createUser(deps, input, transaction);
    const org = await deps.models.Organisation.create({ name: input.organisationName.trim(), plan: DEFAULT_PLAN }, { transaction });
    await deps.models.Membership.create({ organisationId: org.id, userId: user.id, role: 'owner' }, { transaction });
    await user.update({ lastOrganisationId: org.id }, { transaction });
    await recordAudit(deps, { organisationId: org.id, actorUserId: user.id, action: 'organisation.created', targetType: 'organisation', targetId: org.id, detail: { name: org.name }, ip }, { transaction });
    return { userId: user.id, organisationId: org.id };
  });
}

/** The user when e-mail and password match, else null (same work either way). */
export async function checkCredentials(deps: AccountDeps, email: string, password: string): Promise<UserModel | null> {
  const user = await findUserByEmail(deps, email);
  if (!user) return verifyAgainstNothing(password, bcryptCost(deps.config.NODE_ENV)).then(() => null);
  return (await verifyPassword(password, user.passwordHash)) ? user : null;
}

export interface OrganisationOfUser {
  id: number;
  name: string;
  role: Role;
}

/** The open organisations a user belongs to, oldest membership first. */
export async function organisationsOf(deps: AccountDeps, userId: number): Promise<OrganisationOfUser[]> {
  const { Membership, Organisation } = deps.models;
  const memberships = await Membership.findAll({ where: { userId }, order: [['id', 'ASC']] });
  if (!memberships.length) return [];
  const orgs = await Organisation.findAll({ where: { id: memberships.map((m) => m.organisationId), closedAt: { [Op.is]: null } } });
  const byId = new Map(orgs.map((o) => [o.id, o]));
  return memberships.filter((m) => byId.has(m.organisationId)).map((m) => ({ id: m.organisationId, name: byId.get(m.organisationId)!.name, role: m.role }));
}

/** The user's role in an open organisation, or null. */
export async function roleIn(deps: AccountDeps, userId: number, organisationId: number): Promise<Role | null> {
  // One statement: this runs on every authenticated request (session and token alike).
  const rows = await deps.db.query<{ role: Role }>(
    'SELECT m.role AS role FROM memberships m JOIN organisations o ON o.id = m.organisation_id WHERE m.user_id = ? AND m.organisation_id = ? AND o.closed_at IS NULL LIMIT 1',
    { replacements: [userId, organisationId], type: QueryTypes.SELECT },
  );
  return rows[0]?.role ?? null;
}

/** GET /api/auth/me for a user and the organisation the session points at (if still a member). */
export async function loadMe(deps: AccountDeps, userId: number, organisationId: number | null): Promise<Me | null> {
  const user = await deps.models.User.findByPk(userId);
  if (!user) return null;
  const organisations = await organisationsOf(deps, userId);
  const current = organisations.find((o) => o.id === organisationId) ?? null;
  return { user: { id: user.id, email: user.email, name: user.name }, organisations, current };
}

/** Which organisation a fresh session opens: the last one used if still a member, else the first. */
export async function landingOrganisation(deps: AccountDeps, user: UserModel): Promise<number | null> {
  const orgs = await organisationsOf(deps, user.id);
  return (orgs.find((o) => o.id === user.lastOrganisationId) ?? orgs[0])?.id ?? null;
}

export async function rememberOrganisation(deps: AccountDeps, userId: number, organisationId: number): Promise<void> {
  await deps.models.User.update({ lastOrganisationId: organisationId }, { where: { id: userId } });
}

export async function changePassword(deps: AccountDeps, userId: number, currentPassword: string, newPassword: string): Promise<void> {
  const user = await deps.models.User.findByPk(userId);
  if (!user) throw new HttpError(401, 'Sign in to continue.');
  if (!(await verifyPassword(currentPassword, user.passwordHash))) {
    throw badRequest('The current password is not correct.', { currentPassword: ['The current password is not correct.'] });
  }
  assertGoodPassword(newPassword, 'newPassword', { email: user.email, name: user.name });
  if (await verifyPassword(newPassword, user.passwordHash)) throw badRequest('Choose a password different from the current one.', { newPassword: ['Choose a password different from the current one.'] });
  await user.update({ passwordHash: await hashPassword(newPassword, bcryptCost(deps.config.NODE_ENV)) });
}

export async function updateProfile(deps: AccountDeps, userId: number, name: string): Promise<void> {
  await deps.models.User.update({ name: name.trim() }, { where: { id: userId } });
}
