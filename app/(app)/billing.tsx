import { useLocalSearchParams } from 'expo-router';
import { BillingScreen } from '../../components/billing/BillingScreen';

export default function BillingRoute() {
  const { checkout } = useLocalSearchParams<{ checkout?: string }>();
  return <BillingScreen checkout={typeof checkout === 'string' ? checkout : undefined} />;
}
