import { useState } from 'react';
import { StyleSheet } from 'react-native';
import { Link } from 'expo-router';
import { ResetRequestSchema, type ResetRequest } from '../../shared/schemas/auth';
import { useResetRequestMutation } from '../queries/auth';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Body, Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';

/** Ask for a reset link. The answer never says whether the address has an account. */
export function ResetRequestForm(props: { notice?: string }) {
  const form = useZodForm(ResetRequestSchema, { email: '' });
  const request = useResetRequestMutation();
  const [sent, setSent] = useState<string | null>(null);
  const submit = () => {
    const body = form.validate() as ResetRequest | null;
    if (!body) return;
    request.mutate(body, { onSuccess: (r) => setSent(r.message), onError: form.fromServer });
  };
  return (
    <Card style={styles.card} testID="reset-request-form">
      <Heading>Reset your password</Heading>
      {props.notice ? <Notice tone="caution">{props.notice}</Notice> : null}
      {sent ? (
        <Notice tone="success" testID="reset-request-sent">
          {sent}
        </Notice>
      ) : (
        <>
          <Body>Enter the e-mail address of your account. We send a link that lets you choose a new password.</Body>
          {form.errors._ ? <Notice tone="error">{form.errors._}</Notice> : null}
          <TextField label="E-mail" value={form.values.email} onChangeText={form.set('email')} error={form.errors.email} autoCapitalize="none" autoComplete="email" inputMode="email" onSubmitEditing={submit} testID="reset-email" />
          <Button label="Send reset link" onPress={submit} busy={request.isPending} testID="reset-request-submit" />
        </>
      )}
      <Link href="/sign-in" style={styles.link}>
        <Small style={styles.linkText}>Back to sign in</Small>
      </Link>
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  link: { minHeight: 44, justifyContent: 'center', paddingVertical: space.sm },
  linkText: { color: colors.ink, textDecorationLine: 'underline' },
});
