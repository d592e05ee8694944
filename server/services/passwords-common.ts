/**
 * A short list of passwords that are long enough for our length rule yet guessed first by anyone
 * trying (keyboard runs, "password" with digits, repeated words). Compared case-insensitively and
 * after removing spaces, so "Password 123!" is caught as "password123!". Shorter well-known
 * passwords need no entry: the length rule already refuses them.
 */
export const COMMON_PASSWORDS: readonly string[] = [
  '1234567890', '0123456789', '12345678910', '123456789012', '1234567890a', '0987654321', '1111111111', '0000000000',
  '1q2w3e4r5t', '1q2w3e4r5t6y', 'q1w2e3r4t5', 'qwertyuiop', 'qwertyuiop1', 'qwerty1234', 'qwerty12345', 'qwerty123456',
  'asdfghjkl1', 'asdfghjkl;', 'zxcvbnm123', '1qaz2wsx3edc', 'qazwsxedc123', 'qazwsxedcrfv', 'abcdefghij', 'abcd123456',
  'abc1234567', 'a123456789', 'password12', 'password123', 'password1234', 'password123!', 'password2024', 'password2025',
  'password2026', 'passw0rd123', 'p@ssw0rd123', 'p@ssword123', 'passwordpassword', 'iloveyou123', 'iloveyou12', 'letmein123',
  'letmeinnow', 'welcome123', 'welcome1234', 'welcome2024', 'welcome2025', 'welcome2026', 'changeme123', 'changemenow',
  'administrator', 'admin12345', 'admin123456', 'adminadmin', 'rootroot12', 'trustno1234', 'sunshine123', 'princess123',
  'football123', 'baseball123', 'basketball', 'superman123', 'batman1234', 'starwars123', 'dragon12345', 'monkey12345',
  'master12345', 'shadow12345', 'michael123', 'jennifer123', 'computer123', 'internet123', 'whatever123', 'freedom123',
  'secret12345', 'mypassword', 'mypassword1', 'mypassword123', 'newpassword', 'newpassword1', 'thisismypassword',
  'qwertyqwerty', 'aaaaaaaaaa', 'abcabcabc1', 'azertyuiop', 'summer2024', 'summer2025', 'summer2026', 'winter2024',
  'winter2025', 'winter2026', 'spring2025', 'spring2026', 'autumn2025', 'autumn2026', 'december2026', 'january2026',
  'spinyard123', 'spinyard2026', 'spinyardspinyard',
];

const COMMON = new Set(COMMON_PASSWORDS.map((p) => normalisePassword(p)));

/** The comparison form: lower case, no white space. */
export function normalisePassword(password: string): string {
  return password.toLowerCase().replace(/\s+/g, '');
}

export function isCommonPassword(password: string): boolean {
  const n = normalisePassword(password);
  // One repeated character, however long, is as weak as any entry.
  if (n.length > 0 && /^(.)\1*$/.test(n)) return true;
  return COMMON.has(n);
}
