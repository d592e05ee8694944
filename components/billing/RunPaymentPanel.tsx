import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { useLocalSearchParams } from 'expo-router';
import { can, type Role } from '../../shared/permissions';
import { useBillingCheckoutMutation, useRunChargeQuery, useRunPayMutation } from '../queries/billing';
import { colors, fonts, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Body, Heading, Small } from '../ui/Text';
import { euros, shortDate } from './format';

/**
 * The one message about the last card payment while the run still waits: coming back from a
 * successful payment page means "confirming" — an earlier attempt's decline is history then —
 * else a decline, else a payment page left without paying.
 */
export function paymentNotice(returned: string | undefined, failureMessage: string | null): 'confirming' | 'failed' | 'cancelled' | null {
  if (returned === 'success') return 'confirming';
  if (failureMessage) return 'failed';
  return returned === 'cancelled' ? 'cancelled' : null;
}

/**
 * The price of a held (paid) run on the run screen: what it costs and why, whether the credits
 * cover it, pay by card (anyone who may start runs) or from the credits (admins and owners).
 * Renders nothing for free runs.
 */
export function RunPaymentPanel(props: { runId: number; role: Role | null; awaiting: boolean }) {
  const { payment } = useLocalSearchParams<{ payment?: string }>();
  // Free runs have no charge: only ask while the run waits, or right after the payment page.
  const charge = useRunChargeQuery(props.runId, { enabled: props.awaiting || !!payment, confirming: payment === 'success' });
  const checkout = useBillingCheckoutMutation();
  const pay = useRunPayMutation(props.runId);
  if (!charge.data) return null; // free run (404) or still loading
  const c = charge.data;
  if (c.status === 'paid' || c.status === 'refunded') {
    return (
      <Notice tone={c.status === 'paid' ? 'success' : 'info'} testID="run-payment-done">
        {c.status === 'paid'
          ? `Paid ${euros(c.price.amount, c.price.currency)} ${c.paidWith === 'card' ? 'by card' : 'from credits'} on ${shortDate(c.paidAt)}.`
          : `No solver of this run produced an answer, so its price (${euros(c.price.amount, c.price.currency)}) was given back${c.paidWith === 'card' ? ' to the card' : ' to the credits'}. Retrying it asks for the price again.`}
      </Notice>
    );
  }
  if (!props.awaiting) return null;
  const error = checkout.error ?? pay.error;
  const notice = paymentNotice(payment, c.failureMessage);
  return (
    <Card testID="run-payment">
      <Heading>Payment needed</Heading>
      <Body style={styles.price} testID="run-price">{euros(c.price.amount, c.price.currency)}</Body>
      <View style={styles.lines}>
        {c.price.lines.map((l, i) => (
          <Small key={i}>{`${l.label}: ${euros(l.amount, c.price.currency)}`}</Small>
        ))}
      </View>
      <Small>This run is larger than your plan includes. It is queued once it is paid.</Small>
      {notice === 'confirming' ? (
        <View style={styles.confirm} testID="run-payment-confirming">
          <ActivityIndicator color={colors.ink} accessibilityLabel="Confirming the payment" />
          <Small>Confirming the payment…</Small>
        </View>
      ) : null}
      {notice === 'cancelled' ? <Notice tone="caution">The payment was not completed; nothing was charged.</Notice> : null}
      {notice === 'failed' ? <Notice tone="error" testID="run-payment-failed">{`${c.failureMessage} Try another card${c.affordable ? ', or pay from the credits' : ''}.`}</Notice> : null}
      <Small testID="run-credits">
        {c.affordable
          ? `The organisation's credits (${euros(c.balance.amount)}) cover it${can(props.role, 'billing:manage') ? '.' : ' — an admin or the owner can confirm paying from them.'}`
          : `The organisation's credits (${euros(c.balance.amount)}) do not cover it.`}
      </Small>
      <View style={styles.row}>
        {can(props.role, 'runs:start') ? (
          <Button
            label={`Pay ${euros(c.price.amount, c.price.currency)} by card`}
            busy={checkout.isPending}
            onPress={() => checkout.mutate({ purpose: 'run', runId: props.runId })}
            accessibilityHint="Opens the payment page"
            testID="run-pay-card"
          />
        ) : null}
        {can(props.role, 'billing:manage') ? (
          <Button label="Pay from credits" tone="secondary" busy={pay.isPending} disabled={!c.affordable} onPress={() => pay.mutate()} testID="run-pay-credits" />
        ) : null}
      </View>
      {error ? <Body style={styles.error}>{error.message}</Body> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  price: { fontFamily: fonts.bold, fontSize: 28, lineHeight: 36, color: colors.ink },
  lines: { gap: space.xs },
  confirm: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.sm },
  error: { color: colors.danger },
});
