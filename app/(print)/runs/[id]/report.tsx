import { useLocalSearchParams } from 'expo-router';
import { lazyScreen } from '../../../../components/shell/lazy-screen';

const RunReport = lazyScreen('RunReport'); // drawing code loads with the screen, not with sign-in

/** /runs/:id/report — the print-friendly report of a run. */
export default function RunReportScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <RunReport id={Number(id)} />;
}
