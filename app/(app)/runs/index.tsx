import { useLocalSearchParams } from 'expo-router';
import { RunList } from '../../../components/runs/RunList';
import { useMeQuery } from '../../../components/queries/auth';

/** /runs — the organisation's runs; `?compare=<id>` starts a comparison with that run ticked. */
export default function RunsScreen() {
  const { compare } = useLocalSearchParams<{ compare?: string }>();
  const me = useMeQuery();
  return <RunList role={me.data?.current?.role ?? null} compareWith={compare ? Number(compare) : undefined} />;
}
