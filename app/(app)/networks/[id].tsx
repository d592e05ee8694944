import { useLocalSearchParams } from 'expo-router';
import { lazyScreen } from '../../../components/shell/lazy-screen';

const NetworkScreen = lazyScreen('NetworkScreen'); // drawing code loads with the screen, not with sign-in

export default function NetworkRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <NetworkScreen key={id} id={Number(id) || 0} />;
}
