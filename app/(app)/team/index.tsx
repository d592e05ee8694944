import { TeamScreen } from '../../../components/team/TeamScreen';

export default function TeamRoute() {
  return <TeamScreen />;
}
