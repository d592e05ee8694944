import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { BillingSummary } from '../../shared/schemas/billing';
import { useBillingCheckoutMutation } from '../queries/billing';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Body, Heading, Small } from '../ui/Text';
import { euros } from './format';

/** Seats in use against the limit (plan + purchased) and a quantity stepper to buy more. */
export function SeatsCard(props: { summary: BillingSummary; canBuy: boolean }) {
  const [quantity, setQuantity] = useState(1);
  const checkout = useBillingCheckoutMutation();
  const seats = props.summary.seats;
  const full = seats.used >= seats.limit;
  return (
    <Card style={styles.card} testID="billing-seats">
      <Heading>Seats</Heading>
      <Body style={styles.big} testID="billing-seats-count">{`${seats.used} of ${seats.limit} in use`}</Body>
      <Small>{`${seats.included} with the ${props.summary.plan.label} plan${seats.purchased ? ` + ${seats.purchased} purchased` : ''}. Members and pending invitations take a seat.`}</Small>
      {full ? <Small style={styles.caution}>All seats are taken: new invitations are refused until you add seats.</Small> : null}
      {props.canBuy ? (
        <>
        <View style={styles.row}>
          <Step symbol="−" label="One seat fewer" onPress={() => setQuantity((q) => Math.max(1, q - 1))} disabled={quantity <= 1} testID="seats-minus" />
          <Body style={styles.qty} testID="seats-quantity">{quantity}</Body>
          <Step symbol="+" label="One seat more" onPress={() => setQuantity((q) => Math.min(50, q + 1))} disabled={quantity >= 50} testID="seats-plus" />
        </View>
        <View style={styles.row}>
          <Button
            label={`Buy ${quantity} seat${quantity === 1 ? '' : 's'} · ${euros(quantity * seats.price.amount)}`}
            busy={checkout.isPending}
            onPress={() => checkout.mutate({ purpose: 'seats', quantity })}
            accessibilityHint="Opens the payment page"
            testID="buy-seats"
          />
        </View>
        </>
      ) : null}
      {checkout.error ? <Body style={styles.error}>{checkout.error.message}</Body> : null}
    </Card>
  );
}

/** A square ± button (44 px target) whose spoken label says what it does. */
function Step(props: { symbol: string; label: string; onPress: () => void; disabled: boolean; testID: string }) {
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={props.label}
      accessibilityState={{ disabled: props.disabled }}
      disabled={props.disabled}
      onPress={props.onPress}
      testID={props.testID}
      style={[styles.step, props.disabled && styles.stepOff]}
    >
      <Text style={styles.stepText}>{props.symbol}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  step: { width: TOUCH, height: TOUCH, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.surface },
  stepOff: { opacity: 0.4 },
  stepText: { fontFamily: fonts.semibold, fontSize: 22, color: colors.ink },
  card: { minWidth: 280 },
  big: { fontFamily: fonts.bold, fontSize: 24, lineHeight: 32, color: colors.ink },
  row: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, marginTop: space.sm },
  qty: { minWidth: 28, textAlign: 'center', fontFamily: fonts.semibold },
  caution: { color: colors.signalDeep },
  error: { color: colors.danger },
});
