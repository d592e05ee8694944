import { ActivityIndicator, StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can } from '../../shared/permissions';
import { useMeQuery, useSignOutMutation } from '../queries/auth';
import { colors, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { OwnerZone } from './OwnerZone';
import { PasswordForm } from './PasswordForm';
import { ProfileForm } from './ProfileForm';
import { TokensPanel } from './TokensPanel';
import { ApiDocsLink } from '../api-docs/ApiDocsLink';

/** Name, password, API tokens, sign out; owners also see transfer and close. */
export function AccountScreen() {
  const router = useRouter();
  const me = useMeQuery();
  const signOut = useSignOutMutation();
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  if (me.isPending) return <ActivityIndicator style={styles.center} color={colors.ink} accessibilityLabel="Loading your account" />;
  if (!me.data) return null;
  const current = me.data.current;
  const out = <Button label="Sign out" tone="secondary" busy={signOut.isPending} onPress={() => signOut.mutate(undefined, { onSuccess: () => router.replace('/sign-in') })} testID="sign-out" />;
  return (
    <Screen title="Account" subtitle={me.data.user.email} actions={<><ApiDocsLink />{out}</>} testID="account-screen">
      {signOut.error ? <Notice tone="error">{signOut.error.message}</Notice> : null}
      <View style={[styles.columns, wide && styles.columnsWide]}>
        <View style={[styles.column, wide && styles.columnWide]}>
          <ProfileForm me={me.data} />
          <PasswordForm />
        </View>
        <View style={[styles.column, wide && styles.columnWide]}>
          {current && can(current.role, 'tokens:own') ? <TokensPanel organisationName={current.name} /> : null}
          {current ? <OwnerZone me={me.data} /> : null}
        </View>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  center: { padding: space.xl },
  columns: { gap: space.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: space.lg, minWidth: 0 },
  // flex: 1 only side by side: stacked on a phone it gave each column a zero basis, and the
  // tokens card was drawn over the password card's hint and button.
  columnWide: { flex: 1 },
});
