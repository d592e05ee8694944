import { useLocalSearchParams } from 'expo-router';
import { Screen } from '../../../components/ui/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function RunDetailScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Screen title={`Run ${id}`}>
      <EmptyState title="Nothing here yet" message="Details of this run appear here." />
    </Screen>
  );
}
