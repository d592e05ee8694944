import { StyleSheet, View, useWindowDimensions } from 'react-native';
import type { LedgerEntryView } from '../../shared/schemas/billing';
import { colors, fonts, space, WIDE_BREAKPOINT } from '../theme';
import { Card } from '../ui/Card';
import { Body, Heading, Label, Small } from '../ui/Text';
import { LEDGER_KIND_LABELS, euros, shortDate, signedEuros } from './format';
import { ledgerLines, type LedgerLine } from './ledger-lines';

/** A card payment that went straight to a run did not move the balance: no sign. */
const amountText = (l: LedgerLine) => (l.byCard !== null ? `${euros(l.byCard, l.currency)} by card` : signedEuros(l.amount, l.currency));

/** The credits ledger: cards on a phone, a table on a wide screen; newest first. */
export function LedgerHistory(props: { entries: LedgerEntryView[] }) {
  const wide = useWindowDimensions().width >= WIDE_BREAKPOINT;
  return (
    <Card testID={wide ? 'ledger-table' : 'ledger-list'}>
      <Heading>History</Heading>
      {props.entries.length === 0 ? <Small>No credit movements yet.</Small> : null}
      {wide && props.entries.length > 0 ? (
        <View style={[styles.tr, styles.th]} accessibilityRole="header">
          <Label style={styles.cDate}>Date</Label>
          <Label style={styles.cWhat}>What</Label>
          <Label style={[styles.cMoney, styles.right]}>Amount</Label>
          <Label style={[styles.cMoney, styles.right]}>Balance</Label>
        </View>
      ) : null}
      {ledgerLines(props.entries).map((e) =>
        wide ? (
          <View key={e.key} style={styles.tr} testID={`ledger-${e.key}`}>
            <Body style={styles.cDate}>{shortDate(e.createdAt)}</Body>
            <View style={styles.cWhat}>
              <Body>{LEDGER_KIND_LABELS[e.kind] ?? e.kind}</Body>
              {e.note ? <Small>{e.note}</Small> : null}
            </View>
            <Body style={[styles.cMoney, styles.right, e.amount <= 0 ? styles.minus : styles.plus]}>{amountText(e)}</Body>
            <Body style={[styles.cMoney, styles.right]}>{euros(e.balanceAfter, e.currency)}</Body>
          </View>
        ) : (
          <View key={e.key} style={styles.item} testID={`ledger-${e.key}`}>
            <View style={styles.itemTop}>
              <Body style={styles.itemWhat}>{LEDGER_KIND_LABELS[e.kind] ?? e.kind}</Body>
              <Body style={e.amount <= 0 ? styles.minus : styles.plus}>{amountText(e)}</Body>
            </View>
            <Small>{`${shortDate(e.createdAt)} · balance ${euros(e.balanceAfter, e.currency)}${e.note ? ` · ${e.note}` : ''}`}</Small>
          </View>
        ),
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
  th: { borderTopWidth: 0 },
  cDate: { width: 120 },
  cWhat: { flex: 1, minWidth: 0 },
  cMoney: { width: 110 },
  right: { textAlign: 'right' },
  item: { paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line, gap: space.xs },
  itemTop: { flexDirection: 'row', justifyContent: 'space-between', gap: space.sm },
  itemWhat: { flex: 1, fontFamily: fonts.medium },
  plus: { color: colors.success, fontFamily: fonts.semibold },
  minus: { color: colors.text, fontFamily: fonts.semibold },
});
