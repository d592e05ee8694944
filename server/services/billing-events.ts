import { z } from 'zod';
import { HttpError } from '../lib/http-error';

/**
 * The parts of a provider event that billing reads, checked after the signature: a signed event
 * can still be malformed (an SDK version change, a hand-made test event), and that is the
 * sender's fault — 400 `bad_event`, never a crash. Unknown fields are kept (passthrough).
 */
const metadata = z.record(z.string(), z.string()).nullish();

const SessionSchema = z.looseObject({
  id: z.string().min(1),
  payment_status: z.string().nullish(),
  amount_total: z.number().int().nullish(),
  currency: z.string().nullish(),
  payment_intent: z.union([z.string(), z.looseObject({ id: z.string() })]).nullish(),
  metadata,
});
export type EventSession = z.infer<typeof SessionSchema>;

const IntentSchema = z.looseObject({
  id: z.string().min(1),
  last_payment_error: z.looseObject({ message: z.string().nullish() }).nullish(),
  metadata,
});
export type EventIntent = z.infer<typeof IntentSchema>;

const objectOf = <T extends z.ZodType>(schema: T) => z.looseObject({ data: z.looseObject({ object: schema }) });

const HANDLED = {
  'checkout.session.completed': objectOf(SessionSchema),
  'checkout.session.async_payment_succeeded': objectOf(SessionSchema),
  'checkout.session.expired': objectOf(SessionSchema),
  'payment_intent.payment_failed': objectOf(IntentSchema),
} as const;

export type BillingEvent =
  | { id: string; type: 'checkout.session.completed' | 'checkout.session.async_payment_succeeded' | 'checkout.session.expired'; session: EventSession }
  | { id: string; type: 'payment_intent.payment_failed'; intent: EventIntent }
  | { id: string; type: 'ignored'; name: string };

const EnvelopeSchema = z.looseObject({ id: z.string().min(1), type: z.string().min(1) });

/** The event as billing uses it; 400 naming the problem when a handled type lacks its object. */
export function parseBillingEvent(event: unknown): BillingEvent {
  const envelope = EnvelopeSchema.safeParse(event);
  if (!envelope.success) throw badEvent('the event has no id or type');
  const { id, type } = envelope.data;
  if (!(type in HANDLED)) return { id, type: 'ignored', name: type };
  const parsed = HANDLED[type as keyof typeof HANDLED].safeParse(event);
  if (!parsed.success) {
    const where = parsed.error.issues[0]?.path.join('.') || 'data';
    throw badEvent(`${type} event without a usable ${where}`);
  }
  const object = parsed.data.data.object;
  if (type === 'payment_intent.payment_failed') return { id, type, intent: object as EventIntent };
  return { id, type: type as 'checkout.session.completed', session: object as EventSession };
}

function badEvent(why: string): HttpError {
  return new HttpError(400, `Webhook rejected: ${why}.`, { code: 'bad_event' });
}
