import type { AuditEvent } from '../../shared/schemas/auth';
import { ROLE_LABELS, type Role } from '../../shared/permissions';
import { euros, PURPOSE_LABELS } from '../billing/format';

/** Dates as everywhere in the app (components/ui/dates.ts). */
export { formatDate, formatDateTime } from '../ui/dates';

const money = (cents: unknown) => (typeof cents === 'number' ? euros(cents) : 'an amount');
const purpose = (d: Record<string, unknown>) => (d.purpose === 'run' && d.runId ? `run #${String(d.runId)}` : (PURPOSE_LABELS[String(d.purpose)] ?? 'a purchase').toLowerCase());
const run = (e: AuditEvent, capital = false) => (e.targetType === 'run' && e.targetId ? `${capital ? 'Run' : 'run'} #${e.targetId}` : capital ? 'A run' : 'a run');

const roleLabel = (r: unknown) => (typeof r === 'string' && r in ROLE_LABELS ? ROLE_LABELS[r as Role] : String(r ?? ''));

/** An audit event as a sentence a person reads ("Ivo changed a role: Viewer → Analyst"). */
export function describeAudit(e: AuditEvent): string {
  const d = (e.detail ?? {}) as Record<string, unknown>;
  const who = e.actor?.name ?? 'Someone';
  const whom = e.target ? `${e.target.name} (${e.target.email})` : 'a member';
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
      return `${who} changed the role of ${whom}: ${roleLabel(d.from)} → ${roleLabel(d.to)}`;
    case 'member.removed':
      return `${who} removed ${whom} (${roleLabel(d.role)})`;
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
    case 'billing.checkout_started':
      return `${who} opened a card payment of ${money(d.amount)} for ${purpose(d)}`;
    case 'billing.payment_succeeded':
      return `Card payment of ${money(d.amount)} for ${purpose(d)} went through`;
    case 'billing.payment_failed':
      return `A card payment was declined${d.message ? `: ${String(d.message)}` : ''}`;
    case 'billing.run_paid':
      return `${who} paid ${run(e)} (${money(d.amount)}) from the credits`;
    case 'billing.run_refunded':
      return `${run(e, true)} failed, so its price (${money(d.amount)}) went back to the ${d.to === 'card' ? 'card' : 'credits'}`;
    default:
      // An event this screen does not know yet: its code in words, never the raw code.
      return `${who}: ${e.action.replace(/[._]/g, ' ')}`;
  }
}
