import { useLocalSearchParams } from 'expo-router';
import { lazyScreen } from '../../../components/shell/lazy-screen';
import { RequirePermission } from '../../../components/shell/RequirePermission';

const ImportScreen = lazyScreen('ImportScreen'); // drawing code loads with the screen, not with sign-in

export default function ImportRoute() {
  const { networkId } = useLocalSearchParams<{ networkId?: string }>();
  const id = Number(networkId);
  return (
    <RequirePermission permission="networks:write" title="Import a network" what="import networks" backTo="/networks">
      <ImportScreen {...(id > 0 ? { networkId: id } : {})} />
    </RequirePermission>
  );
}
