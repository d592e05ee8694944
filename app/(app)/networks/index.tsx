import { NetworkList } from '../../../components/networks/NetworkList';

export default function NetworksRoute() {
  return <NetworkList />;
}
