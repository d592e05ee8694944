import { useState } from 'react';
import { StyleSheet } from 'react-native';
import { Link } from 'expo-router';
import { z } from 'zod';
import { NewPasswordSchema } from '../../shared/schemas/auth';
import { ApiError } from '../api/client';
import { useResetConfirmMutation } from '../queries/auth';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';
import { ResetRequestForm } from './ResetRequestForm';

const NewPasswordForm = z
  .object({ password: NewPasswordSchema, repeat: z.string() })
  .refine((v) => v.password === v.repeat, { path: ['repeat'], message: 'The two passwords differ' });

/** Choose a new password from an e-mailed link; an expired or used link offers to send a new one. */
export function ResetConfirmForm(props: { token: string }) {
  const form = useZodForm(NewPasswordForm, { password: '', repeat: '' });
  const confirm = useResetConfirmMutation();
  const [expired, setExpired] = useState(false);
  const submit = () => {
    const body = form.validate() as { password: string } | null;
    if (!body) return;
    confirm.mutate(
      { token: props.token, password: body.password },
      { onError: (err) => (err instanceof ApiError && err.status === 410 ? setExpired(true) : form.fromServer(err)) },
    );
  };
  if (expired) return <ResetRequestForm notice="This reset link has expired or was already used. Ask for a new one below." />;
  return (
    <Card style={styles.card} testID="reset-confirm-form">
      <Heading>Choose a new password</Heading>
      {confirm.isSuccess ? (
        <>
          <Notice tone="success" testID="reset-done">
            Your password is changed. Sign in with the new one; other devices were signed out.
          </Notice>
          <Link href="/sign-in" style={styles.link}>
            <Small style={styles.linkText}>Go to sign in</Small>
          </Link>
        </>
      ) : (
        <>
          {form.errors._ ? <Notice tone="error">{form.errors._}</Notice> : null}
          <TextField label="New password" value={form.values.password} onChangeText={form.set('password')} error={form.errors.password} secureTextEntry autoComplete="new-password" hint="At least 10 characters; common passwords are refused." testID="reset-password" />
          <TextField label="Repeat the new password" value={form.values.repeat} onChangeText={form.set('repeat')} error={form.errors.repeat} secureTextEntry autoComplete="new-password" onSubmitEditing={submit} testID="reset-repeat" />
          <Button label="Set new password" onPress={submit} busy={confirm.isPending} testID="reset-confirm-submit" />
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  link: { minHeight: 44, justifyContent: 'center', paddingVertical: space.sm },
  linkText: { color: colors.ink, textDecorationLine: 'underline' },
});
