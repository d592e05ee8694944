import { useLocalSearchParams } from 'expo-router';
import { NetworkScreen } from '../../../components/networks/NetworkScreen';

export default function NetworkRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <NetworkScreen key={id} id={Number(id) || 0} />;
}
