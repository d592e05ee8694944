import type { Transaction } from 'sequelize';
import type { Deps } from '../deps';
import type { AuditEvent, AuditPage } from '../../shared/schemas/auth';

/** What happened, to whom, by whom, from where. Other features call this too (runs, payments). */
export interface AuditEntry {
  organisationId: number | null;
  actorUserId: number | null;
  action: string; // dotted, e.g. "member.role_changed", "run.started"
  targetType?: string;
  targetId?: string | number;
  detail?: Record<string, unknown>;
  ip?: string | null;
}

export async function recordAudit(deps: Pick<Deps, 'models'>, entry: AuditEntry, opts: { transaction?: Transaction } = {}): Promise<void> {
  await deps.models.AuditEvent.create(
    {
      organisationId: entry.organisationId,
      actorUserId: entry.actorUserId,
      action: entry.action,
      targetType: entry.targetType ?? null,
      targetId: entry.targetId === undefined ? null : String(entry.targetId),
      detail: entry.detail ? JSON.stringify(entry.detail) : null,
      ip: entry.ip ? entry.ip.slice(0, 64) : null,
    },
    { transaction: opts.transaction },
  );
}

/** One page of an organisation's audit log, newest first. */
export async function listAudit(deps: Pick<Deps, 'models'>, organisationId: number, page: number, pageSize: number): Promise<AuditPage> {
  const { AuditEvent, User } = deps.models;
  const { rows, count } = await AuditEvent.findAndCountAll({
    where: { organisationId },
    order: [['id', 'DESC']],
    limit: pageSize,
    offset: (page - 1) * pageSize,
  });
  const targetUserId = (r: { targetType: string | null; targetId: string | null }) => (r.targetType === 'user' && r.targetId !== null && /^\d+$/.test(r.targetId) ? Number(r.targetId) : null);
  const actorIds = [...new Set([...rows.map((r) => r.actorUserId), ...rows.map(targetUserId)].filter((x): x is number => x !== null))];
  const actors = actorIds.length ? await User.findAll({ where: { id: actorIds } }) : [];
  const byId = new Map(actors.map((u) => [u.id, { id: u.id, name: u.name, email: u.email }]));
  const items: AuditEvent[] = rows.map((r) => ({
    id: Number(r.id),
    action: r.action,
    actor: r.actorUserId !== null ? (byId.get(r.actorUserId) ?? null) : null,
    target: targetUserId(r) !== null ? (byId.get(targetUserId(r)!) ?? null) : null,
    targetType: r.targetType,
    targetId: r.targetId,
    detail: r.detail ? (safeJson(r.detail) as Record<string, unknown> | null) : null,
    ip: r.ip,
    createdAt: r.createdAt.toISOString(),
  }));
  return { items, page, pageSize, total: count };
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return { text };
  }
}
