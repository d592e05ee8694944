import { useLocalSearchParams } from 'expo-router';
import { lazyScreen } from '../../../components/shell/lazy-screen';
import { useMeQuery } from '../../../components/queries/auth';

const CompareView = lazyScreen('CompareView'); // drawing code loads with the screen, not with sign-in

/** /runs/compare?ids=1,2,3 — runs side by side (analysts). */
export default function CompareRunsScreen() {
  const { ids } = useLocalSearchParams<{ ids?: string }>();
  const me = useMeQuery();
  const list = (ids ?? '').split(',').map(Number).filter((n) => Number.isInteger(n) && n > 0);
  return <CompareView ids={list} role={me.data?.current?.role ?? null} />;
}
