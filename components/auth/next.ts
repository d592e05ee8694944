/**
 * Where to go after signing in: the signed-in page a visitor first asked for (a shared run link,
 * say), passed as ?next=. Only paths inside this app count — "//host" and absolute URLs would send
 * the visitor elsewhere — and the auth pages themselves fall back to the networks list.
 */
export function afterSignIn(next: unknown): string {
  if (typeof next !== 'string' || !next.startsWith('/') || next.startsWith('//') || next.includes('\\')) return '/networks';
  if (/^\/(sign-in|sign-up|reset|invite)(\/|\?|$)/.test(next)) return '/networks';
  return next;
}
