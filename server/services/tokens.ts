import { Op } from 'sequelize';
import type { Deps } from '../deps';
import type { ApiToken, CreatedToken } from '../../shared/schemas/auth';
import type { AuthContext } from '../lib/routes';
import { HttpError, notFound } from '../lib/http-error';
import { roleIn } from './accounts';
import { recordAudit } from './audit';
import { newSecret, sha256Hex } from './tokens-secret';
import type { ApiTokenModel } from '../models/api-token';

/** Tokens start with this, so leaked ones are easy to spot in logs and secret scanners. */
export const TOKEN_PREFIX = 'spy_';
const PREFIX_SHOWN = 12;
const MAX_TOKENS_PER_MEMBER = 25;
/** last_used_at is written at most this often per token (not on every request). */
const LAST_USED_GRANULARITY_MS = 60_000;

const toApiToken = (t: ApiTokenModel): ApiToken => ({
  id: t.id,
  name: t.name,
  prefix: t.prefix,
  createdAt: t.createdAt.toISOString(),
  lastUsedAt: t.lastUsedAt ? t.lastUsedAt.toISOString() : null,
});

export async function createToken(deps: Deps, organisationId: number, userId: number, name: string, ip: string | null): Promise<CreatedToken> {
  const live = await deps.models.ApiToken.count({ where: { organisationId, userId, revokedAt: { [Op.is]: null } } });
  if (live >= MAX_TOKENS_PER_MEMBER) throw new HttpError(409, `You already have ${MAX_TOKENS_PER_MEMBER} tokens for this organisation; revoke one you no longer use.`, { code: 'token_limit' });
  const token = newSecret(TOKEN_PREFIX);
  const row = await deps.models.ApiToken.create({ organisationId, userId, name: name.trim(), prefix: token.slice(0, PREFIX_SHOWN), tokenHash: sha256Hex(token) });
  await recordAudit(deps, { organisationId, actorUserId: userId, action: 'token.created', targetType: 'token', targetId: row.id, detail: { name: row.name }, ip });
  return { ...toApiToken(row), token };
}

/** The caller's own live tokens for the current organisation. */
export async function listTokens(deps: Deps, organisationId: number, userId: number): Promise<ApiToken[]> {
  const rows = await deps.models.ApiToken.findAll({ where: { organisationId, userId, revokedAt: { [Op.is]: null } }, order: [['id', 'DESC']] });
  return rows.map(toApiToken);
}

export async function revokeToken(deps: Deps, organisationId: number, userId: number, id: number, ip: string | null): Promise<void> {
  const row = await deps.models.ApiToken.findOne({ where: { id, organisationId, userId, revokedAt: { [Op.is]: null } } });
  if (!row) throw notFound('Token');
  await row.update({ revokedAt: new Date() });
  await recordAudit(deps, { organisationId, actorUserId: userId, action: 'token.revoked', targetType: 'token', targetId: id, detail: { name: row.name }, ip });
}

/**
 * Who a Bearer token speaks for: its user, in its organisation, with the user's role there NOW
 * (a demoted user's token is demoted too; a removed member's token stops working). Null = refuse.
 */
export async function authenticateBearer(deps: Deps, token: string): Promise<AuthContext | null> {
  if (!token.startsWith(TOKEN_PREFIX) || token.length > 200) return null;
  const row = await deps.models.ApiToken.findOne({ where: { tokenHash: sha256Hex(token), revokedAt: { [Op.is]: null } } });
  if (!row) return null;
  const role = await roleIn(deps, row.userId, row.organisationId);
  if (!role) return null;
  const now = Date.now();
  if (!row.lastUsedAt || now - row.lastUsedAt.getTime() > LAST_USED_GRANULARITY_MS) {
    await deps.models.ApiToken.update({ lastUsedAt: new Date(now) }, { where: { id: row.id } });
  }
  return { userId: row.userId, organisationId: row.organisationId, role, via: 'token', tokenId: row.id };
}
