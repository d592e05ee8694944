import { NewNetworkScreen } from '../../../components/networks/NewNetworkScreen';

export default function NewNetworkRoute() {
  return <NewNetworkScreen />;
}
