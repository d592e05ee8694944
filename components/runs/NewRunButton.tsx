import { useRouter } from 'expo-router';
import { can, type Role } from '../../shared/permissions';
import { Button } from '../ui/Button';

/** The network screen's entry to run setup (hidden from roles that cannot start runs). */
export function NewRunButton(props: { networkId: number; versionId: number; role: Role | null }) {
  const router = useRouter();
  if (!can(props.role, 'runs:start')) return null;
  return <Button label="New run" onPress={() => router.push(`/runs/new?networkId=${props.networkId}&versionId=${props.versionId}`)} accessibilityHint="Split this network version: choose a question, pins and solvers" testID="new-run" />;
}
