import { AccountScreen } from '../../components/account/AccountScreen';

export default function AccountRoute() {
  return <AccountScreen />;
}
