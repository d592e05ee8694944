import { useLayoutEffect } from 'react';
import { Redirect, Slot, useLocalSearchParams } from 'expo-router';
import { pageAfterSignIn } from '../../components/auth/next';
import { useMeQuery } from '../../components/queries/auth';
import { AuthFrame } from '../../components/auth/AuthFrame';
import { takeOverPrerendered } from '../../components/auth/prerendered';

/** Signed-out pages: a centred card on the brand background; signed-in visitors go to the app. */
export default function AuthLayout() {
  const me = useMeQuery();
  const { next } = useLocalSearchParams<{ next?: string }>();
  // Already signed in: the prerendered sign-in form (if the page had one) must not stay above the app.
  useLayoutEffect(() => {
    if (me.data) takeOverPrerendered();
  }, [me.data]);
  // Signed in (or just signed in here): on to the page first asked for, else the networks list.
  if (me.data) return <Redirect href={pageAfterSignIn(next)} />;
  return (
    <AuthFrame>
      <Slot />
    </AuthFrame>
  );
}
