import { z } from 'zod';
import type { Price, RunPriceLine } from '../plans';

/** POST /api/billing/checkout. Credits: quantity = whole euros; seats: quantity = seats; run: runId. */
export const CheckoutBodySchema = z
  .object({
    purpose: z.enum(['credits', 'run', 'seats']),
    runId: z.coerce.number().int().positive().optional(),
    quantity: z.coerce.number().int().positive().max(1000).optional(),
  })
  .superRefine((b, ctx) => {
    if (b.purpose === 'run' && b.runId === undefined) ctx.addIssue({ code: 'custom', path: ['runId'], message: 'Say which run to pay for.' });
    if (b.purpose === 'credits' && (b.quantity === undefined || b.quantity < 5)) ctx.addIssue({ code: 'custom', path: ['quantity'], message: 'Buy at least 5 € of credits (quantity = whole euros).' });
    if (b.purpose === 'seats' && (b.quantity === undefined || b.quantity > 50)) ctx.addIssue({ code: 'custom', path: ['quantity'], message: 'Buy between 1 and 50 seats at once.' });
  });
export type CheckoutBody = z.infer<typeof CheckoutBodySchema>;

export const BillingRunParamsSchema = z.object({ id: z.coerce.number().int().positive() });

export const LedgerQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(500).default(100) });

/** POST /api/billing/quote: the price of a run of this size (the run-setup screen may ask before preview). */
export const QuoteBodySchema = z.object({
  depots: z.number().int().min(0),
  secondsPerSolver: z.number().min(0),
  solvers: z.array(z.object({ name: z.string().max(40).optional(), family: z.string(), qubits: z.number().int().min(0).nullable() })).max(20),
});
export type QuoteBody = z.infer<typeof QuoteBodySchema>;

export interface CheckoutView {
  paymentId: number;
  purpose: 'credits' | 'run' | 'seats';
  /** The provider's checkout session id and hosted page URL (open it in the browser). */
  sessionId: string;
  url: string;
  amount: number;
  currency: string;
}

export interface RunQuote {
  plan: { id: string; label: string };
  /** null = free. */
  price: (Price & { lines: RunPriceLine[] }) | null;
  balance: Price;
  /** The organisation's credits cover the price (false when free: nothing to cover). */
  affordable: boolean;
  runsThisMonth: number;
  monthlyFreeRuns: number;
  note: string;
  /** Why no run of this size can start on this plan (then `price` is null), or null. */
  refusal: string | null;
  /** The most any run can cost on this plan (runPriceCeiling); every price is at most this. */
  ceiling: Price;
}

export interface RunChargeView {
  runId: number;
  price: Price & { lines: RunPriceLine[] };
  status: 'awaiting' | 'paid' | 'refunded';
  paidWith: 'credits' | 'card' | null;
  /** Why the last card payment failed, when it did. */
  failureMessage: string | null;
  balance: Price;
  affordable: boolean;
  paidAt: string | null;
  refundedAt: string | null;
}

export interface BillingSummary {
  plan: { id: string; label: string; includedDepots: number; includedQubits: number; includedSeconds: number; monthlyFreeRuns: number };
  seats: { used: number; included: number; purchased: number; limit: number; price: Price };
  balance: Price;
  creditPacks: number[];
  runsThisMonth: number;
  awaitingRuns: Array<{ runId: number; amount: number; currency: string; failureMessage: string | null; createdAt: string }>;
}

export interface LedgerEntryView {
  id: number;
  kind: string;
  amount: number;
  currency: string;
  /** Balance after this entry (entries are summed oldest first). */
  balanceAfter: number;
  runId: number | null;
  paymentId: number | null;
  eventId: string | null;
  note: string | null;
  createdAt: string;
}

export interface PaymentView {
  id: number;
  purpose: 'credits' | 'run' | 'seats';
  quantity: number;
  amount: number;
  currency: string;
  status: string;
  runId: number | null;
  cardLast4: string | null;
  failureMessage: string | null;
  receiptNumber: string;
  receiptSent: boolean;
  paidAt: string | null;
  createdAt: string;
}
