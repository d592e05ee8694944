import { useLocalSearchParams } from 'expo-router';
import { Screen } from '../../../components/ui/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function NetworkDetailScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Screen title={`Network ${id}`}>
      <EmptyState title="Nothing here yet" message="Details of this network appear here." />
    </Screen>
  );
}
