import { StyleSheet, View } from 'react-native';
import type { BillingSummary } from '../../shared/schemas/billing';
import { useBillingCheckoutMutation } from '../queries/billing';
import { colors, fonts, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Body, Heading, Small } from '../ui/Text';
import { euros } from './format';

/** Balance and the credit packs to buy (admins and owners). */
export function CreditsCard(props: { summary: BillingSummary; canBuy: boolean }) {
  const checkout = useBillingCheckoutMutation();
  const s = props.summary;
  return (
    <Card style={styles.card} testID="billing-credits">
      <Heading>Credits</Heading>
      <Body style={styles.big} testID="billing-balance">{euros(s.balance.amount)}</Body>
      <Small>Large solves are paid from the credits (an admin confirms) or by card on the run.</Small>
      {props.canBuy ? (
        <View style={styles.row}>
          {s.creditPacks.map((cents, i) => (
            <Button
              key={cents}
              label={`Buy ${euros(cents)}`}
              tone={i === 0 ? 'primary' : 'secondary'}
              busy={checkout.isPending && checkout.variables?.quantity === cents / 100}
              disabled={checkout.isPending}
              onPress={() => checkout.mutate({ purpose: 'credits', quantity: cents / 100 })}
              accessibilityHint="Opens the payment page"
              testID={`buy-credits-${cents}`}
            />
          ))}
        </View>
      ) : null}
      {checkout.error ? <Body style={styles.error}>{checkout.error.message}</Body> : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { minWidth: 280 },
  big: { fontFamily: fonts.bold, fontSize: 32, lineHeight: 40, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginTop: space.sm },
  error: { color: colors.danger },
});
