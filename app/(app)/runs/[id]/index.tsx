import { useLocalSearchParams } from 'expo-router';
import { lazyScreen } from '../../../../components/shell/lazy-screen';
import { useMeQuery } from '../../../../components/queries/auth';

const RunView = lazyScreen('RunView'); // drawing code loads with the screen, not with sign-in

/** /runs/:id — live progress, then the scorecard and the partition (read-only for every member). */
export default function RunDetailScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMeQuery();
  return <RunView id={Number(id)} role={me.data?.current?.role ?? null} />;
}
