import { Screen } from '../../components/ui/Screen';
import { EmptyState } from '../../components/ui/EmptyState';

export default function BillingScreen() {
  return (
    <Screen title="Billing">
      <EmptyState title="Billing" message="Plan, credits, seats and receipts appear here." />
    </Screen>
  );
}
