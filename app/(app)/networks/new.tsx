import { NewNetworkScreen } from '../../../components/networks/NewNetworkScreen';
import { RequirePermission } from '../../../components/shell/RequirePermission';

export default function NewNetworkRoute() {
  return (
    <RequirePermission permission="networks:write" title="Draw a network" what="draw networks" backTo="/networks">
      <NewNetworkScreen />
    </RequirePermission>
  );
}
