import type { Deps } from '../deps';
import { formatMoney } from '../../shared/plans';
import type { PaymentRow } from '../models/payment';

/** Receipt numbers are derived from the payment id (stable, no second counter to keep). */
export const receiptNumber = (paymentId: number) => `SY-${String(paymentId).padStart(6, '0')}`;

const WHAT: Record<PaymentRow['purpose'], (p: PaymentRow) => string> = {
  credits: (p) => `Credits: ${formatMoney({ amount: p.amount, currency: p.currency })}`,
  run: (p) => `Large solve, run #${p.runId}`,
  seats: (p) => `${p.quantity} additional seat${p.quantity === 1 ? '' : 's'}`,
};

/**
 * E-mail the receipt for a paid payment, once: receipt_sent_at is claimed by a conditional
 * update before sending, so concurrent webhook deliveries send one e-mail.
 */
export async function sendReceipt(deps: Pick<Deps, 'models' | 'mailer' | 'logger' | 'config'>, paymentId: number): Promise<boolean> {
  const [claimed] = await deps.models.Payment.update({ receiptSentAt: new Date() }, { where: { id: paymentId, status: 'paid', receiptSentAt: null } });
  if (!claimed) return false;
  const p = (await deps.models.Payment.findByPk(paymentId))!.get({ plain: true }) as PaymentRow;
  const org = await deps.models.Organisation.findByPk(p.organisationId, { attributes: ['name'] });
  const user = p.createdBy ? await deps.models.User.findByPk(p.createdBy, { attributes: ['email', 'name'] }) : null;
  const to = p.payerEmail ?? user?.email;
  if (!to) return false;
  const total = formatMoney({ amount: p.amount, currency: p.currency });
  const number = receiptNumber(p.id);
  const lines = [
    `Receipt ${number} — Spinyard`,
    '',
    `Organisation: ${org?.name ?? p.organisationId}`,
    `Paid: ${(p.paidAt ?? new Date()).toISOString().slice(0, 10)}`,
    `Item: ${WHAT[p.purpose](p)}`,
    `Quantity: ${p.quantity}`,
    `Total: ${total}`,
    p.cardLast4 ? `Card: •••• ${p.cardLast4}` : null,
    '',
    `Billing history and receipts: ${deps.config.publicUrl}/billing`,
  ].filter((l): l is string => l !== null);
  try {
    await deps.mailer.send({ to, subject: `Your Spinyard receipt ${number} (${total})`, text: lines.join('\n') + '\n' });
    return true;
  } catch (err) {
    // Give it back so a later delivery of the event can try again.
    await deps.models.Payment.update({ receiptSentAt: null }, { where: { id: paymentId } });
    deps.logger.warn({ err, paymentId }, 'receipt e-mail could not be sent');
    return false;
  }
}
