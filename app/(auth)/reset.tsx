import { useLocalSearchParams } from 'expo-router';
import { ResetConfirmForm } from '../../components/auth/ResetConfirmForm';
import { ResetRequestForm } from '../../components/auth/ResetRequestForm';

/** /reset asks for a link; /reset?token=… (the e-mailed link) sets the new password. */
export default function ResetScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return token ? <ResetConfirmForm token={String(token)} /> : <ResetRequestForm />;
}
