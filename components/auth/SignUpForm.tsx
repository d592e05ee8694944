import { StyleSheet } from 'react-native';
import { Link, useRouter } from 'expo-router';
import { SignUpSchema, type SignUp } from '../../shared/schemas/auth';
import { useSignUpMutation } from '../queries/auth';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';

export function SignUpForm() {
  const router = useRouter();
  const form = useZodForm(SignUpSchema, { name: '', email: '', password: '', organisationName: '' });
  const signUp = useSignUpMutation();
  const submit = () => {
    const body = form.validate() as SignUp | null;
    if (!body) return;
    signUp.mutate(body, { onSuccess: () => router.replace('/networks'), onError: form.fromServer });
  };
  return (
    <Card style={styles.card} testID="sign-up-form">
      <Heading>Create your organisation</Heading>
      {form.errors._ ? <Notice tone="error">{form.errors._}</Notice> : null}
      <TextField label="Your name" value={form.values.name} onChangeText={form.set('name')} error={form.errors.name} autoComplete="name" testID="sign-up-name" />
      <TextField label="Organisation" value={form.values.organisationName} onChangeText={form.set('organisationName')} error={form.errors.organisationName} testID="sign-up-organisation" />
      <TextField label="E-mail" value={form.values.email} onChangeText={form.set('email')} error={form.errors.email} autoCapitalize="none" autoComplete="email" inputMode="email" testID="sign-up-email" />
      <TextField label="Password" value={form.values.password} onChangeText={form.set('password')} error={form.errors.password} secureTextEntry autoComplete="new-password" hint="At least 10 characters; common passwords are refused." testID="sign-up-password" />
      <Button label="Create organisation" onPress={submit} busy={signUp.isPending} testID="sign-up-submit" />
      <Link href="/sign-in" style={styles.link}>
        <Small style={styles.linkText}>I already have an account</Small>
      </Link>
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  link: { minHeight: 44, justifyContent: 'center', paddingVertical: space.sm },
  linkText: { color: colors.ink, textDecorationLine: 'underline' },
});
