import type { Request } from 'express';
import { newSecret } from '../services/tokens-secret';

declare module 'express-session' {
  interface SessionData {
    userId: number;
    organisationId: number | null;
    csrfToken: string; // synchroniser token for cookie-session requests
  }
}

/** The session cookie is meaningless to Bearer-token requests; they have none (see authenticate). */
export function hasSession(req: Request): boolean {
  return !!(req as { session?: unknown }).session;
}

/**
 * Start a signed-in session under a NEW session id (so an id planted before sign-in is worthless)
 * with a fresh CSRF token, and wait until it is stored.
 */
export async function startSignedInSession(req: Request, userId: number, organisationId: number | null): Promise<void> {
  await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
  req.session.userId = userId;
  req.session.organisationId = organisationId;
  req.session.csrfToken = newSecret();
  await saveSession(req);
}

export function saveSession(req: Request): Promise<void> {
  return new Promise<void>((resolve, reject) => req.session.save((err) => (err ? reject(err) : resolve())));
}

export function endSession(req: Request): Promise<void> {
  if (!hasSession(req)) return Promise.resolve();
  return new Promise<void>((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}

/** The CSRF token of this session, created on first ask. */
export async function csrfTokenOf(req: Request): Promise<string> {
  if (!req.session.csrfToken) {
    req.session.csrfToken = newSecret();
    await saveSession(req);
  }
  return req.session.csrfToken;
}

/** Where a request came from (Express applies `trust proxy` in production). */
export function clientIp(req: Request): string | null {
  return req.ip ?? req.socket?.remoteAddress ?? null;
}
