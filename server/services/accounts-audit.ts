import type { Transaction } from 'sequelize';
import type { AccountDeps } from './accounts';
import { organisationsOf } from './accounts';
import { recordAudit, type AuditEntry } from './audit';

/**
 * Record an event about a person rather than an organisation (sign-ins, password changes): one
 * row in each organisation they belong to, so every admin who may see them sees it; one row with
 * no organisation when they belong to none.
 */
export async function auditForUser(deps: AccountDeps, userId: number | null, entry: Omit<AuditEntry, 'organisationId'>, opts: { transaction?: Transaction } = {}): Promise<void> {
  const orgs = userId === null ? [] : await organisationsOf(deps, userId);
  if (!orgs.length) return recordAudit(deps, { ...entry, organisationId: null }, opts);
  for (const o of orgs) await recordAudit(deps, { ...entry, organisationId: o.id }, opts);
}
