import crypto from 'node:crypto';

/**
 * In-memory state of the local payment fake: checkout sessions, payment intents, refunds and the
 * events it delivered. Plain records shaped like the SDK's objects (only the fields we read).
 */

export interface FakeCheckoutSession {
  id: string;
  object: 'checkout.session';
  mode: 'payment';
  status: 'open' | 'complete' | 'expired';
  payment_status: 'unpaid' | 'paid';
  amount_total: number;
  currency: string;
  /** What the payer sees on the hosted page (first line item's product name). */
  description: string;
  quantity: number;
  success_url: string;
  cancel_url: string;
  client_reference_id: string | null;
  customer_email: string | null;
  metadata: Record<string, string>;
  /** Metadata copied onto the payment intent (payment_intent_data[metadata]). */
  payment_intent_metadata: Record<string, string>;
  payment_intent: string | null;
  url: string | null;
  created: number;
  expires_at: number;
  livemode: false;
}

export interface FakePaymentIntent {
  id: string;
  object: 'payment_intent';
  amount: number;
  amount_received: number;
  currency: string;
  status: 'succeeded' | 'requires_payment_method' | 'canceled';
  metadata: Record<string, string>;
  last_payment_error: { code: string; decline_code?: string; message: string } | null;
  /** Card brand/last4 of the test card used (for receipts). */
  payment_method_details: { card: { brand: string; last4: string } } | null;
  latest_charge: string | null;
  created: number;
  livemode: false;
}

export interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  currency: string;
  payment_intent: string;
  status: 'succeeded';
  metadata: Record<string, string>;
  created: number;
}

export interface FakeEvent {
  id: string;
  object: 'event';
  type: string;
  created: number;
  livemode: false;
  api_version: string;
  data: { object: unknown };
  /** Delivery attempts to the webhook endpoint and their HTTP statuses (0 = no answer). Not part of the payload sent. */
  deliveries: number[];
}

export interface FakeState {
  sessions: Map<string, FakeCheckoutSession>;
  intents: Map<string, FakePaymentIntent>;
  refunds: Map<string, FakeRefund>;
  events: FakeEvent[];
  /** Idempotency-Key → the JSON answered the first time (the SDK retries POSTs with the same key). */
  idempotent: Map<string, { status: number; body: unknown }>;
}

export function createFakeState(): FakeState {
  return { sessions: new Map(), intents: new Map(), refunds: new Map(), events: [], idempotent: new Map() };
}

/** `prefix_` + 24 random characters (the shape the SDK's objects have; callers never parse them). */
export function fakeId(prefix: string): string {
  return `${prefix}_${crypto.randomBytes(12).toString('hex')}`;
}

export const nowSeconds = (): number => Math.floor(Date.now() / 1000);

/**
 * Test cards for the hosted page (numbers without spaces). Anything else that is 12–19 digits
 * pays; these two decline with the reason shown.
 */
export const TEST_CARDS = {
  pays: '4242424242424242',
  declined: '4000000000000002',
  insufficientFunds: '4000000000009995',
} as const;

export function cardOutcome(number: string): { ok: true; last4: string } | { ok: false; code: string; declineCode: string; message: string } {
  const digits = number.replace(/\D/g, '');
  if (digits.length < 12 || digits.length > 19) return { ok: false, code: 'incorrect_number', declineCode: 'incorrect_number', message: 'The card number is not valid.' };
  if (digits === TEST_CARDS.declined) return { ok: false, code: 'card_declined', declineCode: 'generic_decline', message: 'Your card was declined.' };
  if (digits === TEST_CARDS.insufficientFunds) return { ok: false, code: 'card_declined', declineCode: 'insufficient_funds', message: 'Your card has insufficient funds.' };
  return { ok: true, last4: digits.slice(-4) };
}
