import { Redirect, Slot, usePathname } from 'expo-router';
import { View } from 'react-native';
import { FullScreenStatus } from '../../components/shell/FullScreenStatus';
import { useMeQuery } from '../../components/queries/auth';
import { rememberRequestedPage } from '../../components/auth/next';
import { colors } from '../../components/theme';

/** Printable pages: signed-in only, without the app's navigation so a printout holds just the report. */
export default function PrintLayout() {
  const me = useMeQuery();
  const pathname = usePathname();
  if (!me.data) rememberRequestedPage(pathname); // sign-in brings the visitor back to this report
  if (me.isPending) return <FullScreenStatus label="Loading…" />;
  if (me.isError) return <FullScreenStatus label="Spinyard cannot be reached right now." error={me.error.message} onRetry={() => me.refetch()} />;
  if (!me.data) return <Redirect href="/sign-in" />;
  return (
    <View style={{ flex: 1, backgroundColor: colors.surface }}>
      <Slot />
    </View>
  );
}
