import bcrypt from 'bcryptjs';
import { PASSWORD_MIN_LENGTH } from '../../shared/schemas/auth';
import { isCommonPassword } from './passwords-common';

/** bcrypt work factor: 12 in production, 10 (the floor we allow) elsewhere so tests stay quick. */
export const bcryptCost = (env: string): number => (env === 'production' ? 12 : 10);

export const PASSWORD_MAX_LENGTH = 200;

/**
 * Why a new password is refused, or null when it is acceptable. Length counts characters (code
 * points), not bytes. bcrypt reads only the first 72 bytes; longer passphrases are still fine.
 */
export function passwordProblem(password: string, context: { email?: string; name?: string } = {}): string | null {
  const length = [...password].length;
  if (length < PASSWORD_MIN_LENGTH) return `Use at least ${PASSWORD_MIN_LENGTH} characters.`;
  if (length > PASSWORD_MAX_LENGTH) return `Use at most ${PASSWORD_MAX_LENGTH} characters.`;
  if (isCommonPassword(password)) return 'This password is on the list of common passwords; choose another.';
  const lower = password.toLowerCase();
  if (context.email && lower === context.email.toLowerCase()) return 'Do not use your e-mail address as the password.';
  if (context.email && lower === context.email.toLowerCase().split('@')[0]) return 'Do not use your e-mail name as the password.';
  return null;
}

export function hashPassword(password: string, cost: number): Promise<string> {
  return bcrypt.hash(password, cost);
}

export function verifyPassword(password: string, hash: string): Promise<boolean> {
  return bcrypt.compare(password, hash);
}

/**
 * Compare against a placeholder hash of the same cost when the e-mail is unknown, so "no such
 * account" takes as long as "wrong password". The placeholder is made once per cost (a memo).
 */
const placeholderHashes = new Map<number, Promise<string>>();
export async function verifyAgainstNothing(password: string, cost: number): Promise<false> {
  if (!placeholderHashes.has(cost)) placeholderHashes.set(cost, bcrypt.hash('no-such-account-placeholder', cost));
  await bcrypt.compare(password, await placeholderHashes.get(cost)!);
  return false;
}
