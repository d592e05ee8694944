import { useLocalSearchParams } from 'expo-router';
import { ImportScreen } from '../../../components/networks/ImportScreen';
import { RequirePermission } from '../../../components/shell/RequirePermission';

export default function ImportRoute() {
  const { networkId } = useLocalSearchParams<{ networkId?: string }>();
  const id = Number(networkId);
  return (
    <RequirePermission permission="networks:write" title="Import a network" what="import networks" backTo="/networks">
      <ImportScreen {...(id > 0 ? { networkId: id } : {})} />
    </RequirePermission>
  );
}
