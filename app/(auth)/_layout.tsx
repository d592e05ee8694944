import { Redirect, Slot } from 'expo-router';
import { useMeQuery } from '../../components/queries/auth';
import { AuthFrame } from '../../components/auth/AuthFrame';

/** Signed-out pages: a centred card on the brand background; signed-in visitors go to the app. */
export default function AuthLayout() {
  const me = useMeQuery();
  if (me.data) return <Redirect href="/networks" />;
  return (
    <AuthFrame>
      <Slot />
    </AuthFrame>
  );
}
