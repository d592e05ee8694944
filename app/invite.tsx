import { useLocalSearchParams } from 'expo-router';
import { AuthFrame } from '../components/auth/AuthFrame';
import { InviteAccept } from '../components/auth/InviteAccept';

/** /invite?token=… — the link in an invitation e-mail; works signed in or signed out. */
export default function InviteScreen() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return (
    <AuthFrame>
      <InviteAccept token={String(token ?? '')} />
    </AuthFrame>
  );
}
