import type { AuditEvent } from '../../shared/schemas/auth';
import { ROLE_LABELS, type Role } from '../../shared/permissions';

/** Dates as everywhere in the app (components/ui/dates.ts). */
export { formatDate, formatDateTime } from '../ui/dates';

const roleLabel = (r: unknown) => (typeof r === 'string' && r in ROLE_LABELS ? ROLE_LABELS[r as Role] : String(r ?? ''));

/** An audit event as a sentence a person reads ("Ivo changed a role: Viewer → Analyst"). */
export function describeAudit(e: AuditEvent): string {
  const d = (e.detail ?? {}) as Record<string, unknown>;
  const who = e.actor?.name ?? 'Someone';
  switch (e.action) {
    case 'auth.signed_in':
      return `${who} signed in`;
    case 'auth.sign_in_failed':
      return `Failed sign-in for ${String(d.email ?? 'an account')}`;
    case 'auth.password_changed':
      return `${who} changed their password`;
    case 'auth.reset_requested':
      return `${who} asked for a password reset link`;
    case 'auth.password_reset':
      return `${who} set a new password from a reset link`;
    case 'organisation.created':
      return `${who} created the organisation`;
    case 'organisation.ownership_transferred':
      return `${who} transferred ownership`;
    case 'organisation.closed':
      return `${who} closed the organisation`;
    case 'member.role_changed':
      return `${who} changed a role: ${roleLabel(d.from)} → ${roleLabel(d.to)}`;
    case 'member.removed':
      return `${who} removed a member (${roleLabel(d.role)})`;
    case 'member.joined':
      return `${who} joined as ${roleLabel(d.role)}`;
    case 'invitation.created':
      return `${who} invited ${String(d.email ?? '')} as ${roleLabel(d.role)}`;
    case 'invitation.resent':
      return `${who} resent the invitation to ${String(d.email ?? '')}`;
    case 'invitation.cancelled':
      return `${who} cancelled the invitation to ${String(d.email ?? '')}`;
    case 'invitation.accepted':
      return `${who} accepted an invitation as ${roleLabel(d.role)}`;
    case 'token.created':
      return `${who} created the API token "${String(d.name ?? '')}"`;
    case 'token.revoked':
      return `${who} revoked the API token "${String(d.name ?? '')}"`;
    default:
      return `${who}: ${e.action}`;
  }
}
