import { Linking } from 'react-native';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client';
import type { BillingSummary, CheckoutBody, CheckoutView, LedgerEntryView, PaymentView, RunChargeView } from '../../shared/schemas/billing';
import type { Price } from '../../shared/plans';
import { runKeys } from './runs';
import { STALE } from './staleTimes';

export const billingKeys = {
  root: ['billing'] as const,
  summary: () => [...billingKeys.root, 'summary'] as const,
  ledger: () => [...billingKeys.root, 'ledger'] as const,
  payments: () => [...billingKeys.root, 'payments'] as const,
  run: (runId: number) => [...billingKeys.root, 'run', runId] as const,
};

/** Right after the payment page sent the payer back, the provider's event may land a moment later: poll briefly. */
const confirmingPoll = (confirming: boolean) => (query: { state: { dataUpdateCount: number } }) => (confirming && query.state.dataUpdateCount < 10 ? 1000 : false);

export function useBillingQuery(enabled = true, confirming = false) {
  return useQuery({ queryKey: billingKeys.summary(), staleTime: STALE.detail, enabled, refetchInterval: confirmingPoll(confirming), queryFn: () => api.get<BillingSummary>('/billing') });
}

export function useBillingLedgerQuery(enabled = true, confirming = false) {
  return useQuery({ queryKey: billingKeys.ledger(), staleTime: STALE.list, enabled, refetchInterval: confirmingPoll(confirming), queryFn: () => api.get<{ balance: number; entries: LedgerEntryView[] }>('/billing/ledger') });
}

export function useBillingPaymentsQuery(enabled = true, confirming = false) {
  return useQuery({ queryKey: billingKeys.payments(), staleTime: STALE.list, enabled, refetchInterval: confirmingPoll(confirming), queryFn: () => api.get<PaymentView[]>('/billing/payments') });
}

/**
 * The price of a held run and how it stands (404 = a free run: no charge). `confirming` polls
 * while it is still awaiting — after the payment page sent the payer back, the provider's event
 * may land a moment later — and refreshes the run once it is paid.
 */
export function useRunChargeQuery(runId: number, opts: { enabled?: boolean; confirming?: boolean } = {}) {
  const qc = useQueryClient();
  return useQuery({
    queryKey: billingKeys.run(runId),
    staleTime: STALE.live,
    enabled: opts.enabled ?? true,
    retry: false,
    refetchInterval: (query) => (opts.confirming && query.state.data?.status === 'awaiting' ? 1000 : false),
    queryFn: async () => {
      const charge = await api.get<RunChargeView>(`/billing/runs/${runId}`);
      if (charge.status !== 'awaiting') void qc.invalidateQueries({ queryKey: runKeys.detail(runId) });
      return charge;
    },
  });
}

/** Open the provider's payment page in this tab (on the web) or the browser (native). */
function openPaymentPage(url: string): Promise<void> {
  return (Linking.openURL as (url: string, target?: string) => Promise<void>)(url, '_self');
}

/** Start a checkout and go to its payment page; the provider sends the payer back to Billing or the run. */
export function useBillingCheckoutMutation() {
  return useMutation({
    mutationFn: (body: CheckoutBody) => api.post<CheckoutView>('/billing/checkout', body),
    onSuccess: (checkout) => openPaymentPage(checkout.url),
  });
}

/** Pay a held run from the credits (admins and owners); the run is queued. */
export function useRunPayMutation(runId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<{ runId: number; status: 'paid'; balance: Price }>(`/runs/${runId}/pay`),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: billingKeys.root }), qc.invalidateQueries({ queryKey: runKeys.detail(runId) }), qc.invalidateQueries({ queryKey: runKeys.lists() })]),
  });
}
