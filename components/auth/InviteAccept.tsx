import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Link, useRouter } from 'expo-router';
import { z } from 'zod';
import { NewPasswordSchema } from '../../shared/schemas/auth';
import { ROLE_LABELS } from '../../shared/permissions';
import { ApiError } from '../api/client';
import { useMeQuery } from '../queries/auth';
import { useInvitationAcceptMutation, useInvitationPreviewQuery } from '../queries/invitations';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Body, Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';

const NewAccount = z.object({ name: z.string().trim().min(1, 'Enter your name').max(120), password: NewPasswordSchema });
const ExistingAccount = z.object({ password: z.string().min(1, 'Enter your password') });

/**
 * The page an invitation link opens: who invites you where, then — signed in: join; an account
 * exists for the address: its password; otherwise name and a new password.
 */
export function InviteAccept(props: { token: string }) {
  const router = useRouter();
  const me = useMeQuery();
  const preview = useInvitationPreviewQuery(props.token);
  const accept = useInvitationAcceptMutation();
  const fresh = useZodForm(NewAccount, { name: '', password: '' });
  const existing = useZodForm(ExistingAccount, { password: '' });
  const done = () => router.replace('/networks');

  if (!props.token) return <Gone message="This invitation link is incomplete. Open it again from the e-mail, or ask an admin to resend it." />;
  if (preview.isPending || me.isPending) {
    return (
      <Card style={styles.card}>
        <ActivityIndicator color={colors.ink} accessibilityLabel="Loading the invitation" />
      </Card>
    );
  }
  if (preview.isError) {
    const gone = preview.error instanceof ApiError && (preview.error.status === 410 || preview.error.status === 400);
    return <Gone message={gone ? preview.error.message : 'Spinyard cannot be reached right now. Try the link again in a moment.'} />;
  }
  const inv = preview.data;
  const signedIn = !!me.data;
  const submit = () => {
    if (signedIn) return accept.mutate({ token: props.token }, { onSuccess: done, onError: fresh.fromServer });
    if (inv.accountExists) {
      const body = existing.validate() as { password: string } | null;
      if (body) accept.mutate({ token: props.token, password: body.password }, { onSuccess: done, onError: existing.fromServer });
      return;
    }
    const body = fresh.validate() as { name: string; password: string } | null;
    if (body) accept.mutate({ token: props.token, ...body }, { onSuccess: done, onError: fresh.fromServer });
  };
  const errorText = (signedIn ? fresh.errors._ : inv.accountExists ? existing.errors._ : fresh.errors._) ?? null;
  return (
    <Card style={styles.card} testID="invite-accept">
      <Heading>Join {inv.organisationName}</Heading>
      <Body>
        {inv.invitedBy ? `${inv.invitedBy} invited ` : 'You are invited as '}
        {inv.invitedBy ? `${inv.email} as ` : ''}
        <Body style={styles.strong}>{ROLE_LABELS[inv.role]}</Body>.
      </Body>
      {errorText ? <Notice tone="error">{errorText}</Notice> : null}
      {signedIn ? (
        <Body>
          You are signed in as {me.data!.user.email}. Joining adds {inv.organisationName} to your organisations.
        </Body>
      ) : inv.accountExists ? (
        <>
          <Small>{inv.email} already has a Spinyard account. Enter its password to join.</Small>
          <TextField label="Password" value={existing.values.password} onChangeText={existing.set('password')} error={existing.errors.password} secureTextEntry autoComplete="current-password" onSubmitEditing={submit} testID="invite-password" />
        </>
      ) : (
        <>
          <Small>Create your account for {inv.email}.</Small>
          <TextField label="Your name" value={fresh.values.name} onChangeText={fresh.set('name')} error={fresh.errors.name} autoComplete="name" testID="invite-name" />
          <TextField label="Password" value={fresh.values.password} onChangeText={fresh.set('password')} error={fresh.errors.password} secureTextEntry autoComplete="new-password" hint="At least 10 characters; common passwords are refused." onSubmitEditing={submit} testID="invite-password" />
        </>
      )}
      <Button label={signedIn ? `Join ${inv.organisationName}` : inv.accountExists ? 'Sign in and join' : 'Create account and join'} onPress={submit} busy={accept.isPending} testID="invite-submit" />
    </Card>
  );
}

function Gone(props: { message: string }) {
  return (
    <Card style={styles.card} testID="invite-gone">
      <Heading>This invitation cannot be used</Heading>
      <Notice tone="caution">{props.message}</Notice>
      <View style={styles.links}>
        <Link href="/sign-in" style={styles.link}>
          <Small style={styles.linkText}>Sign in</Small>
        </Link>
        <Link href="/sign-up" style={styles.link}>
          <Small style={styles.linkText}>Create your own organisation</Small>
        </Link>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  strong: { fontWeight: '600' },
  links: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm },
  link: { minHeight: 44, justifyContent: 'center', paddingVertical: space.sm },
  linkText: { color: colors.ink, textDecorationLine: 'underline' },
});
