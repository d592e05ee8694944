import { Screen } from '../../../components/ui/Screen';
import { EmptyState } from '../../../components/ui/EmptyState';

export default function NetworksScreen() {
  return (
    <Screen title="Networks">
      <EmptyState title="No networks yet" message="Draw a network of depots and lanes, or import one from your own systems, to ask a splitting question." />
    </Screen>
  );
}
