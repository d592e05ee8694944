import { useState } from 'react';
import { StyleSheet } from 'react-native';
import { ChangePasswordSchema, type ChangePassword } from '../../shared/schemas/auth';
import { usePasswordChangeMutation } from '../queries/auth';
import { space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Heading } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';

export function PasswordForm() {
  const form = useZodForm(ChangePasswordSchema, { currentPassword: '', newPassword: '' });
  const change = usePasswordChangeMutation();
  const [done, setDone] = useState(false);
  const submit = () => {
    setDone(false);
    const body = form.validate() as ChangePassword | null;
    if (!body) return;
    change.mutate(body, {
      onSuccess: () => {
        setDone(true);
        form.setValues({ currentPassword: '', newPassword: '' });
      },
      onError: form.fromServer,
    });
  };
  return (
    <Card style={styles.card} testID="password-form">
      <Heading>Password</Heading>
      {form.errors._ && !form.errors.currentPassword && !form.errors.newPassword ? <Notice tone="error">{form.errors._}</Notice> : null}
      {done ? <Notice tone="success">Password changed.</Notice> : null}
      <TextField label="Current password" value={form.values.currentPassword} onChangeText={form.set('currentPassword')} error={form.errors.currentPassword} secureTextEntry autoComplete="current-password" testID="password-current" />
      <TextField label="New password" value={form.values.newPassword} onChangeText={form.set('newPassword')} error={form.errors.newPassword} secureTextEntry autoComplete="new-password" hint="At least 10 characters; common passwords are refused." onSubmitEditing={submit} testID="password-new" />
      <Button label="Change password" tone="secondary" onPress={submit} busy={change.isPending} testID="password-submit" />
    </Card>
  );
}

const styles = StyleSheet.create({ card: { gap: space.md } });
