import { StyleSheet, View } from 'react-native';
import { extraQubitCharge, planPrices } from '../../shared/plans';
import type { BillingSummary } from '../../shared/schemas/billing';
import { space } from '../theme';
import { Card } from '../ui/Card';
import { Body, Heading, Small } from '../ui/Text';
import { euros } from './format';

// Thousands separated the way the rest of the app writes counts (1,000 depots).
const n = (v: number) => v.toLocaleString('en-GB');

/** What the plan includes for free and how a larger solve is priced (the same table the API uses). */
export function PlanCard(props: { summary: BillingSummary }) {
  const { plan, runsThisMonth } = props.summary;
  const p = planPrices(plan.id);
  return (
    <Card style={styles.card} testID="billing-plan">
      <Heading>{`${plan.label} plan`}</Heading>
      <Body>{`Included at no charge: runs up to ${n(plan.includedDepots)} depots, ${n(plan.includedQubits)} qubits and ${n(plan.includedSeconds)} s per solver — ${n(runsThisMonth)} of ${n(plan.monthlyFreeRuns)} included runs used this month.`}</Body>
      <View style={styles.list}>
        <Small>{`Large solve: ${euros(p.largeRunBase)} per run`}</Small>
        <Small>{`+ ${euros(p.per100DepotsOver)} per started 100 depots above ${n(plan.includedDepots)}`}</Small>
        <Small testID="plan-qubit-price">{`+ per quantum (variational) solver above ${n(plan.includedQubits)} qubits: ${[1, 2, 3].map((extra) => `${euros(extraQubitCharge(plan.id, extra))} for ${extra} more`).join(', ')}, and so on — each further qubit doubles the simulation`}</Small>
        <Small>{`+ ${euros(p.perExtraMinute)} per solver per started minute above ${plan.includedSeconds} s`}</Small>
        <Small>{`Runs beyond the monthly allowance: ${euros(p.smallRun)} each`}</Small>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { minWidth: 280 },
  list: { gap: space.xs },
});
