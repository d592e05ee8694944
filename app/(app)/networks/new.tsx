import { lazyScreen } from '../../../components/shell/lazy-screen';
import { RequirePermission } from '../../../components/shell/RequirePermission';

const NewNetworkScreen = lazyScreen('NewNetworkScreen'); // drawing code loads with the screen, not with sign-in

export default function NewNetworkRoute() {
  return (
    <RequirePermission permission="networks:write" title="Draw a network" what="draw networks" backTo="/networks">
      <NewNetworkScreen />
    </RequirePermission>
  );
}
