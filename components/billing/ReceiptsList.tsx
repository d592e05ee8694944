import { StyleSheet, View } from 'react-native';
import type { PaymentView } from '../../shared/schemas/billing';
import { colors, fonts, space } from '../theme';
import { Card } from '../ui/Card';
import { Body, Heading, Small } from '../ui/Text';
import { PURPOSE_LABELS, STATUS_LABELS, euros, shortDate } from './format';

/** Card payments with their receipt numbers (receipts are e-mailed to whoever paid). */
export function ReceiptsList(props: { payments: PaymentView[] }) {
  const shown = props.payments.filter((p) => p.status !== 'open');
  return (
    <Card testID="receipts">
      <Heading>Payments and receipts</Heading>
      {shown.length === 0 ? <Small>No card payments yet.</Small> : null}
      {shown.map((p) => (
        <View key={p.id} style={styles.item} testID={`payment-${p.id}`}>
          <View style={styles.top}>
            <Body style={styles.what}>{`${PURPOSE_LABELS[p.purpose]}${p.purpose === 'seats' ? ` × ${p.quantity}` : ''}${p.runId ? ` · run #${p.runId}` : ''}`}</Body>
            <Body style={styles.amount}>{euros(p.amount, p.currency)}</Body>
          </View>
          <Small>
            {[STATUS_LABELS[p.status] ?? p.status, shortDate(p.paidAt ?? p.createdAt), p.status === 'paid' || p.status === 'refunded' ? `receipt ${p.receiptNumber}${p.receiptSent ? ' (e-mailed)' : ''}` : null, p.cardLast4 ? `card •••• ${p.cardLast4}` : null, p.failureMessage]
              .filter(Boolean)
              .join(' · ')}
          </Small>
        </View>
      ))}
    </Card>
  );
}

const styles = StyleSheet.create({
  item: { paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line, gap: space.xs },
  top: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm },
  what: { flex: 1, fontFamily: fonts.medium },
  amount: { fontFamily: fonts.semibold },
});
