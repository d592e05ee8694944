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

/**
 * The page a signed-out visitor asked for, kept for the sign-in screen. expo-router drops the
 * query of a <Redirect> issued from a layout before its navigator mounts, so `?next=` cannot carry
 * it there; this one value (a path, never a secret) lives for the page's lifetime only.
 */
let requested: string | null = null;

export function rememberRequestedPage(pathname: string | null | undefined): void {
  if (pathname && pathname !== '/') requested = afterSignIn(pathname);
}

/** `?next=` when present, else the remembered page (both the form and the layout may ask). */
export function pageAfterSignIn(next: unknown): string {
  if (typeof next === 'string' && next) return afterSignIn(next);
  return requested ?? '/networks';
}
