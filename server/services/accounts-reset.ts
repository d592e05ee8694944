import { Op } from 'sequelize';
import type { Deps } from '../deps';
import { HttpError } from '../lib/http-error';
import { assertGoodPassword, findUserByEmail } from './accounts';
import { auditForUser } from './accounts-audit';
import { bcryptCost, hashPassword } from './passwords';
import { newSecret, sha256Hex } from './tokens-secret';

export const RESET_LINK_TTL_MS = 60 * 60 * 1000; // one hour: long enough to find the mail, short enough to be stale soon

export const linkExpired = () =>
  new HttpError(410, 'This reset link has expired or was already used. Ask for a new one from the sign-in page.', { code: 'link_expired' });

/**
 * Start a password reset. Always succeeds from the caller's view (the route answers 202 whether
 * or not the address has an account); the mail goes out in the background so timing tells nothing.
 */
export async function requestPasswordReset(deps: Deps, email: string, ip: string | null): Promise<void> {
  const user = await findUserByEmail(deps, email);
  if (!user) return;
  const token = newSecret();
  await deps.models.PasswordReset.create({ userId: user.id, tokenHash: sha256Hex(token), expiresAt: new Date(Date.now() + RESET_LINK_TTL_MS) });
  await auditForUser(deps, user.id, { actorUserId: user.id, action: 'auth.reset_requested', targetType: 'user', targetId: user.id, ip });
  const link = `${deps.config.publicUrl}/reset?token=${encodeURIComponent(token)}`;
  deps.mailer
    .send({
      to: user.email,
      subject: 'Reset your Spinyard password',
      text: `Hello ${user.name},\n\nsomeone (hopefully you) asked to reset the password of your Spinyard account.\nOpen this link within one hour to choose a new password:\n\n${link}\n\nThe link works once. If you did not ask for this, ignore this e-mail; your password stays as it is.\n`,
    })
    .catch((err) => deps.logger.error({ err }, 'password reset mail failed'));
}

/** Set a new password from a reset link; the link works once, and every session of the user ends. */
export async function confirmPasswordReset(deps: Deps, token: string, password: string, ip: string | null): Promise<void> {
  const { PasswordReset, User } = deps.models;
  const userId = await deps.db.transaction(async (transaction) => {
    const row = await PasswordReset.findOne({ where: { tokenHash: sha256Hex(token) }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row || row.usedAt || row.expiresAt.getTime() < Date.now()) throw linkExpired();
    const user = await User.findByPk(row.userId, { transaction });
    if (!user) throw linkExpired();
    assertGoodPassword(password, 'password', { email: user.email, name: user.name });
    await user.update({ passwordHash: await hashPassword(password, bcryptCost(deps.config.NODE_ENV)) }, { transaction });
    const now = new Date();
    await PasswordReset.update({ usedAt: now }, { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction });
    await auditForUser(deps, user.id, { actorUserId: user.id, action: 'auth.password_reset', targetType: 'user', targetId: user.id, ip }, { transaction });
    return user.id;
  });
  await endSessionsOf(deps, userId);
}

/** Sign a user out everywhere (after a reset): delete the stored sessions that carry their id. */
export async function endSessionsOf(deps: Pick<Deps, 'db'>, userId: number): Promise<void> {
  const id = Math.trunc(userId);
  await deps.db.query(`DELETE FROM sessions WHERE data LIKE ? OR data LIKE ?`, { replacements: [`%"userId":${id},%`, `%"userId":${id}}%`] });
}
