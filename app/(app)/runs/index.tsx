import { Screen } from '../../../components/ui/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function RunsScreen() {
  return (
    <Screen title="Runs">
      <EmptyState title="No runs yet" message="Start a run from a network to see which depots go where, and how close each answer is to a proven bound." />
    </Screen>
  );
}
