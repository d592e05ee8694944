import { useLocalSearchParams } from 'expo-router';
import { RunReport } from '../../../../components/runs/RunReport';

/** /runs/:id/report — the print-friendly report of a run. */
export default function RunReportScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <RunReport id={Number(id)} />;
}
