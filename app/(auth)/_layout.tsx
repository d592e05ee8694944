import { Redirect, Slot, useLocalSearchParams } from 'expo-router';
import { pageAfterSignIn } from '../../components/auth/next';
import { useMeQuery } from '../../components/queries/auth';
import { AuthFrame } from '../../components/auth/AuthFrame';

/** Signed-out pages: a centred card on the brand background; signed-in visitors go to the app. */
export default function AuthLayout() {
  const me = useMeQuery();
  const { next } = useLocalSearchParams<{ next?: string }>();
  // Signed in (or just signed in here): on to the page first asked for, else the networks list.
  if (me.data) return <Redirect href={pageAfterSignIn(next)} />;
  return (
    <AuthFrame>
      <Slot />
    </AuthFrame>
  );
}
