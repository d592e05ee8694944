import { Screen } from '../../components/ui/Screen';
import { EmptyState } from '../../components/ui/EmptyState';

export default function TeamScreen() {
  return (
    <Screen title="Team">
      <EmptyState title="Team" message="Members, roles and invitations of this organisation appear here." />
    </Screen>
  );
}
