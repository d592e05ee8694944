import { ActivityIndicator, StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can } from '../../shared/permissions';
import { useMeQuery } from '../queries/auth';
import { useBillingLedgerQuery, useBillingPaymentsQuery, useBillingQuery } from '../queries/billing';
import { colors, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { EmptyState } from '../ui/EmptyState';
import { Notice, QueryError } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Heading, Small } from '../ui/Text';
import { CreditsCard } from './CreditsCard';
import { LedgerHistory } from './LedgerHistory';
import { PlanCard } from './PlanCard';
import { ReceiptsList } from './ReceiptsList';
import { SeatsCard } from './SeatsCard';
import { euros } from './format';

/** Billing for admins and owners: credits, seats, plan, runs waiting for payment, history, receipts. */
export function BillingScreen(props: { checkout?: string }) {
  const router = useRouter();
  const me = useMeQuery();
  const role = me.data?.current?.role ?? null;
  const allowed = can(role, 'billing:read');
  const canBuy = can(role, 'billing:manage');
  const confirming = props.checkout === 'success';
  const summary = useBillingQuery(allowed, confirming);
  const ledger = useBillingLedgerQuery(allowed, confirming);
  const payments = useBillingPaymentsQuery(allowed, confirming);
  const wide = useWindowDimensions().width >= WIDE_BREAKPOINT;
  if (me.data && !allowed) {
    return (
      <Screen title="Billing">
        <EmptyState title="Billing is for admins and owners" message="You see the price of a large run before you start it. Ask an admin of your organisation about credits and seats." />
      </Screen>
    );
  }
  if (!summary.data) {
    return (
      <Screen title="Billing">
        {summary.isError ? (
          <QueryError error={summary.error} onRetry={() => summary.refetch()} />
        ) : (
          <View style={styles.center}>
            <ActivityIndicator color={colors.ink} accessibilityLabel="Loading billing" />
          </View>
        )}
      </Screen>
    );
  }
  const s = summary.data;
  return (
    <Screen title="Billing" subtitle={`${s.plan.label} plan · ${euros(s.balance.amount)} credits`} testID="billing-screen">
      {props.checkout === 'success' ? <Notice tone="success" testID="checkout-success">Payment received. Credits and seats appear here as soon as the payment service confirms it (usually at once).</Notice> : null}
      {props.checkout === 'cancelled' ? <Notice tone="caution" testID="checkout-cancelled">The payment was not completed; nothing was charged. You can try again.</Notice> : null}
      <View style={[styles.cards, wide && styles.row]}>
        <View style={wide ? styles.grow : undefined}>
          <CreditsCard summary={s} canBuy={canBuy} />
        </View>
        <View style={wide ? styles.grow : undefined}>
          <SeatsCard summary={s} canBuy={canBuy} />
        </View>
        <View style={wide ? styles.grow : undefined}>
          <PlanCard summary={s} />
        </View>
      </View>
      {s.awaitingRuns.length > 0 ? (
        <Card testID="awaiting-runs">
          <Heading>Runs waiting for payment</Heading>
          {s.awaitingRuns.map((r) => (
            <View key={r.runId} style={styles.awaiting}>
              <View style={styles.grow}>
                <Body>{`Run #${r.runId} · ${euros(r.amount, r.currency)}`}</Body>
                {r.failureMessage ? <Small style={styles.error}>{r.failureMessage}</Small> : null}
              </View>
              <Button label={`Open run ${r.runId}`} tone="secondary" onPress={() => router.push(`/runs/${r.runId}`)} testID={`awaiting-run-${r.runId}`} />
            </View>
          ))}
        </Card>
      ) : null}
      <View style={[styles.cards, wide && styles.row]}>
        <View style={wide ? styles.grow : undefined}>{ledger.data ? <LedgerHistory entries={ledger.data.entries} /> : null}</View>
        <View style={wide ? styles.grow : undefined}>{payments.data ? <ReceiptsList payments={payments.data} /> : null}</View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  center: { padding: space.xl, alignItems: 'center' },
  cards: { gap: space.lg },
  row: { flexDirection: 'row', alignItems: 'flex-start' },
  grow: { flex: 1, minWidth: 0 },
  awaiting: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line, flexWrap: 'wrap' },
  error: { color: colors.danger },
});
