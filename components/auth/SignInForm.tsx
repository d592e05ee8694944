import { StyleSheet, View } from 'react-native';
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { useQueryClient } from '@tanstack/react-query';
import { pageAfterSignIn } from './next';
import { usePrerenderedHandover } from './prerendered';
import { SignInSchema, type SignIn } from '../../shared/schemas/auth';
import { useSignInMutation } from '../queries/auth';
import { prefetchFirstNetworkList } from '../queries/networks';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';

export function SignInForm() {
  const router = useRouter();
  const { next } = useLocalSearchParams<{ next?: string }>();
  const form = useZodForm(SignInSchema, { email: '', password: '' });
  const signIn = useSignInMutation();
  const qc = useQueryClient();
  // The page's HTML may carry a copy of this form (shown before scripts ran): take over from it.
  usePrerenderedHandover((testID, value) => {
    if (testID === 'sign-in-email') form.set('email')(value);
    if (testID === 'sign-in-password') form.set('password')(value);
  });
  const submit = () => {
    const body = form.validate() as SignIn | null;
    if (!body) return;
    signIn.mutate(body, {
      onSuccess: () => {
        const to = pageAfterSignIn(next);
        // The usual first page: its list is read while its screen's code loads, not after.
        if (to === '/networks') prefetchFirstNetworkList(qc);
        router.replace(to);
      },
      onError: form.fromServer,
    });
  };
  return (
    <Card style={styles.card} testID="sign-in-form">
      <Heading>Sign in</Heading>
      {form.errors._ ? <Notice tone="error">{form.errors._}</Notice> : null}
      <TextField label="E-mail" value={form.values.email} onChangeText={form.set('email')} error={form.errors.email} autoCapitalize="none" autoComplete="email" keyboardType="email-address" inputMode="email" testID="sign-in-email" />
      <TextField label="Password" value={form.values.password} onChangeText={form.set('password')} error={form.errors.password} secureTextEntry autoComplete="current-password" onSubmitEditing={submit} testID="sign-in-password" />
      <Button label="Sign in" onPress={submit} busy={signIn.isPending} testID="sign-in-submit" />
      <View style={styles.links}>
        <Link href="/sign-up" style={styles.link}>
          <Small style={styles.linkText}>Create an organisation</Small>
        </Link>
        <Link href="/reset" style={styles.link}>
          <Small style={styles.linkText}>Forgot your password?</Small>
        </Link>
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  links: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm },
  link: { minHeight: 44, justifyContent: 'center', paddingVertical: space.sm },
  linkText: { color: colors.ink, textDecorationLine: 'underline' },
});
