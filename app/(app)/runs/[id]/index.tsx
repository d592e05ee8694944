import { useLocalSearchParams } from 'expo-router';
import { RunView } from '../../../../components/runs/RunView';
import { useMeQuery } from '../../../../components/queries/auth';

/** /runs/:id — live progress, then the scorecard and the partition (read-only for every member). */
export default function RunDetailScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const me = useMeQuery();
  return <RunView id={Number(id)} role={me.data?.current?.role ?? null} />;
}
