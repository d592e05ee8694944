import { Screen } from '../../components/ui/Screen';
import { EmptyState } from '../../components/ui/EmptyState';

export default function AccountScreen() {
  return (
    <Screen title="Account">
      <EmptyState title="Account" message="Your profile, password and API tokens appear here." />
    </Screen>
  );
}
