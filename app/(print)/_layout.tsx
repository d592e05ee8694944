import { Redirect, Slot } from 'expo-router';
import { View } from 'react-native';
import { FullScreenStatus } from '../../components/shell/FullScreenStatus';
import { useMeQuery } from '../../components/queries/auth';
import { colors } from '../../components/theme';

/** Printable pages: signed-in only, without the app's navigation so a printout holds just the report. */
export default function PrintLayout() {
  const me = useMeQuery();
  if (me.isPending) return <FullScreenStatus label="Loading…" />;
  if (me.isError) return <FullScreenStatus label="Spinyard cannot be reached right now." error={me.error.message} onRetry={() => me.refetch()} />;
  if (!me.data) return <Redirect href="/sign-in" />;
  return (
    <View style={{ flex: 1, backgroundColor: colors.surface }}>
      <Slot />
    </View>
  );
}
