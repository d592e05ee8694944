import type { NextFunction, Request, Response } from 'express';
import type { Deps } from '../deps';
import { roleIn } from '../services/accounts';
import { authenticateBearer } from '../services/tokens';

const BEARER = /^Bearer\s+(\S+)\s*$/i;

/**
 * Sets req.auth. A request with `Authorization: Bearer …` is judged by the token alone — its
 * session is detached so it can neither read nor write one. Otherwise the session's user and
 * organisation are used, with the role read fresh from the membership on every request.
 */
export function createAuthenticate(deps: Deps) {
  return async function authenticate(req: Request, res: Response, next: NextFunction) {
    try {
      const header = req.get('authorization');
      if (header !== undefined) {
        const m = BEARER.exec(header);
        (req as { session?: unknown }).session = null;
        const auth = m ? await authenticateBearer(deps, m[1]) : null;
        if (!auth) {
          res.status(401).json({ error: 'This API token is not valid: it is unknown or revoked, or its user left the organisation. Create a new one on the Account page.', code: 'token_invalid' });
          return;
        }
        req.auth = auth;
        return next();
      }
      const s = req.session;
      if (s?.userId) {
        const organisationId = s.organisationId ?? null;
        const role = organisationId !== null ? await roleIn(deps, s.userId, organisationId) : null;
        req.auth = { userId: s.userId, organisationId: role ? organisationId : null, role, via: 'session' };
      }
      next();
    } catch (err) {
      next(err);
    }
  };
}
