import crypto from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);
/** Paths (under /api) that outside systems call with their own signature check instead. */
const EXEMPT = ['/billing/webhook'];

function same(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && crypto.timingSafeEqual(x, y);
}

/**
 * Synchroniser-token CSRF check: every state-changing cookie-session request must echo the
 * session's token in `X-CSRF-Token` (from GET /api/auth/csrf). Bearer requests carry no ambient
 * credential, so they need none. Runs after authenticate.
 */
export function csrfCheck(req: Request, res: Response, next: NextFunction) {
  if (SAFE.has(req.method) || req.auth?.via === 'token' || EXEMPT.some((p) => req.path === p || req.path.startsWith(`${p}/`))) return next();
  const expected = (req as { session?: { csrfToken?: string } | null }).session?.csrfToken;
  const sent = req.get('x-csrf-token');
  if (!expected || !sent || !same(expected, sent)) {
    res.status(403).json({ error: 'The security token of this page is missing or out of date. Reload the page and try again.', code: 'csrf' });
    return;
  }
  next();
}
