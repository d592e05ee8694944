import crypto from 'node:crypto';

/**
 * High-entropy secrets for links and API tokens: 32 random bytes, base64url (43 characters).
 * Only the sha256 is stored — enough for random secrets (no dictionary to try), and it lets us look
 * a presented secret up by its hash.
 */
export function newSecret(prefix = ''): string {
  return prefix + crypto.randomBytes(32).toString('base64url');
}

export function sha256Hex(secret: string): string {
  return crypto.createHash('sha256').update(secret, 'utf8').digest('hex');
}
