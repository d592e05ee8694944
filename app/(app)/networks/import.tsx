import { useLocalSearchParams } from 'expo-router';
import { ImportScreen } from '../../../components/networks/ImportScreen';

export default function ImportRoute() {
  const { networkId } = useLocalSearchParams<{ networkId?: string }>();
  const id = Number(networkId);
  return <ImportScreen {...(id > 0 ? { networkId: id } : {})} />;
}
