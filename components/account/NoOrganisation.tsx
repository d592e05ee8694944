import { useRouter } from 'expo-router';
import type { Me } from '../../shared/schemas/auth';
import { ROLE_LABELS } from '../../shared/permissions';
import { useSignOutMutation, useSwitchOrganisationMutation } from '../queries/auth';
import { Button } from '../ui/Button';
import { EmptyState } from '../ui/EmptyState';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';

/**
 * What every signed-in page shows while the user belongs to no current organisation (removed by
 * an admin, or their organisation closed): the organisations they can still open, how to get back
 * in, and signing out — never a page that waits for data it may not read.
 */
export function NoOrganisation(props: { me: Me }) {
  const router = useRouter();
  const switchOrg = useSwitchOrganisationMutation();
  const signOut = useSignOutMutation();
  const others = props.me.organisations;
  const message = others.length > 0
    ? 'You are no longer a member of the organisation you were working in. Open one of your other organisations below.'
    : 'You are not a member of any organisation right now. An admin can invite you again: the link in the invitation e-mail brings you back in.';
  return (
    <Screen title="No organisation" testID="no-organisation">
      <EmptyState title="Choose where to work" message={message}>
        {others.map((o) => (
          <Button
            key={o.id}
            label={`Open ${o.name}`}
            accessibilityHint={`Work in ${o.name} as ${ROLE_LABELS[o.role]}`}
            busy={switchOrg.isPending && switchOrg.variables === o.id}
            onPress={() => switchOrg.mutate(o.id, { onSuccess: () => router.replace('/networks') })}
          />
        ))}
        <Button label="Your account" tone="secondary" onPress={() => router.push('/account')} />
        <Button label="Sign out" tone="quiet" busy={signOut.isPending} onPress={() => signOut.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })} />
      </EmptyState>
      {switchOrg.isError ? <Notice tone="error">{switchOrg.error.message}</Notice> : null}
      {signOut.isError ? <Notice tone="error">{signOut.error.message}</Notice> : null}
    </Screen>
  );
}
