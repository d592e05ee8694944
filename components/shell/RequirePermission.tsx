import { useRouter } from 'expo-router';
import { can, type Permission } from '../../shared/permissions';
import { useMeQuery } from '../queries/auth';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';

/**
 * Shows its children only to roles with the permission (shared/permissions.ts); others — e.g. a
 * viewer who typed the address — get a plain explanation instead of controls the API would refuse.
 */
export function RequirePermission(props: { permission: Permission; title: string; what: string; backTo: '/networks' | '/runs' | '/team'; children: React.ReactNode }) {
  const me = useMeQuery();
  const router = useRouter();
  const role = me.data?.current?.role ?? null;
  if (can(role, props.permission)) return <>{props.children}</>;
  return (
    <Screen title={props.title} testID="permission-refused">
      <Notice tone="info">{`Your role${role ? ` (${role})` : ''} cannot ${props.what}. Ask an admin of the organisation if you need to.`}</Notice>
      <Button label="Back" tone="secondary" onPress={() => router.replace(props.backTo)} />
    </Screen>
  );
}
