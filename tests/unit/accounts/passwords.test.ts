import bcrypt from 'bcryptjs';
import { bcryptCost, hashPassword, passwordProblem, verifyPassword } from '../../../server/services/passwords';
import { COMMON_PASSWORDS, isCommonPassword } from '../../../server/services/passwords-common';
import { NewPasswordSchema, PASSWORD_MIN_LENGTH } from '../../../shared/schemas/auth';
import { DEMO_PASSWORD } from '../../../server/services/seed-demo';

/**
 * Password rules. Source for the shape of the rules: Grassi et al., NIST SP 800-63B "Digital
 * Identity Guidelines: Authentication and Lifecycle Management" (2017), §5.1.1.2 — a minimum
 * length and a check against commonly used passwords, no composition rules [memory]. Our minimum
 * is 10 (product decision).
 */
describe('length rule', () => {
  test('9 characters are refused, 10 are accepted (server rule and shared form schema agree)', () => {
    expect(PASSWORD_MIN_LENGTH).toBe(10);
    expect(passwordProblem('harbour-9')).toMatch(/at least 10/);
    expect(passwordProblem('harbour-10')).toBeNull();
    expect(NewPasswordSchema.safeParse('harbour-9').success).toBe(false);
    expect(NewPasswordSchema.safeParse('harbour-10').success).toBe(true);
  });

  test('length counts characters, not bytes: 9 accented letters are still too short', () => {
    const nine = 'ééééééééa'.slice(0, 9);
    expect([...nine].length).toBe(9);
    expect(Buffer.byteLength(nine)).toBeGreaterThan(10);
    expect(passwordProblem(nine)).toMatch(/at least 10/);
  });

  test('more than 200 characters are refused', () => {
    expect(passwordProblem('a1'.repeat(101))).toMatch(/at most 200/);
  });
});

describe('common-password list', () => {
  // Entries below are among the most-used passwords in every published leak analysis (common practice [memory]).
  test.each(['password123', '1234567890', 'qwertyuiop', '1q2w3e4r5t', 'iloveyou123', 'welcome123'])('%s is refused', (pw) => {
    expect(passwordProblem(pw)).toMatch(/common/);
  });

  test('the check ignores case and spaces', () => {
    expect(isCommonPassword('PassWord 123')).toBe(true);
    expect(isCommonPassword('QWERTY UIOP')).toBe(true);
  });

  test('one repeated character is refused however long', () => {
    expect(isCommonPassword('zzzzzzzzzzzzzz')).toBe(true);
    expect(passwordProblem('xxxxxxxxxxxxxxxxxxxxxxxx')).toMatch(/common/);
  });

  test('every list entry that passes the length rule is refused by passwordProblem', () => {
    const long = COMMON_PASSWORDS.filter((p) => [...p].length >= PASSWORD_MIN_LENGTH);
    expect(long.length).toBeGreaterThan(50);
    for (const p of long) expect(passwordProblem(p)).not.toBeNull();
  });

  test('a long uncommon passphrase and the demo password are accepted', () => {
    expect(passwordProblem('lantern-over-the-weir')).toBeNull();
    expect(passwordProblem(DEMO_PASSWORD)).toBeNull();
  });

  test('the e-mail address or its local part is refused as a password', () => {
    expect(passwordProblem('ines.fjord@carriers.example', { email: 'ines.fjord@carriers.example' })).toMatch(/e-mail/);
    expect(passwordProblem('ines.fjordsen', { email: 'ines.fjordsen@carriers.example' })).toMatch(/e-mail/);
  });
});

describe('hashing (bcrypt: Provos & Mazières, "A Future-Adaptable Password Scheme", USENIX 1999 [memory])', () => {
  test('the work factor is at least 10 everywhere and 12 in production', () => {
    expect(bcryptCost('test')).toBeGreaterThanOrEqual(10);
    expect(bcryptCost('development')).toBeGreaterThanOrEqual(10);
    expect(bcryptCost('production')).toBe(12);
  });

  test('hash → verify round trip; the hash records its cost and never contains the password', async () => {
    const hash = await hashPassword('lantern-over-the-weir', 10);
    expect(hash).toMatch(/^\$2[aby]\$10\$/);
    expect(bcrypt.getRounds(hash)).toBe(10);
    expect(hash).not.toContain('lantern');
    await expect(verifyPassword('lantern-over-the-weir', hash)).resolves.toBe(true);
    await expect(verifyPassword('lantern-over-the-weiR', hash)).resolves.toBe(false);
  });
});
