import { ActivityIndicator, StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can } from '../../shared/permissions';
import { useMeQuery } from '../queries/auth';
import { useMembersQuery } from '../queries/members';
import { colors, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { EmptyState } from '../ui/EmptyState';
import { Notice, QueryError } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body } from '../ui/Text';
import { InviteForm } from './InviteForm';
import { MembersView } from './MembersView';
import { PendingInvitations } from './PendingInvitations';

/** Members, seats, invitations; what a role cannot do is not shown. */
export function TeamScreen() {
  const router = useRouter();
  const me = useMeQuery();
  const role = me.data?.current?.role ?? null;
  const members = useMembersQuery(can(role, 'members:read'));
  const seats = members.data?.seats;
  const subtitle = seats ? `${seats.used} of ${seats.limit} seats in use · ${seats.planLabel} plan` : undefined;
  const canManage = can(role, 'members:manage');
  const wide = useWindowDimensions().width >= WIDE_BREAKPOINT;
  if (!me.data?.current) {
    return (
      <Screen title="Team">
        <EmptyState title="No organisation" message="You are not a member of an organisation right now. Ask an admin for an invitation, or create your own organisation." />
      </Screen>
    );
  }
  return (
    <Screen
      title="Team"
      subtitle={subtitle}
      testID="team-screen"
      actions={can(role, 'audit:read') ? <Button label="Audit log" tone="secondary" onPress={() => router.push('/team/audit')} testID="open-audit" /> : null}
    >
      {members.isPending ? (
        <View style={styles.center}>
          <ActivityIndicator color={colors.ink} accessibilityLabel="Loading members" />
        </View>
      ) : members.isError ? (
        <QueryError error={members.error} onRetry={() => members.refetch()} />
      ) : (
        <>
          {members.data.members.length === 0 ? (
            <EmptyState title="No members" message="This organisation has no members yet." />
          ) : (
            <MembersView members={members.data.members} myRole={role} myUserId={me.data.user.id} />
          )}
          {canManage ? (
            <View style={[styles.manage, wide && styles.manageWide]}>
              <View style={wide ? styles.half : undefined}>
                <InviteForm myRole={role!} seatsFull={!!seats && seats.used >= seats.limit} />
              </View>
              <View style={wide ? styles.half : undefined}>
                <PendingInvitations />
              </View>
            </View>
          ) : null}
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  center: { padding: space.xl, alignItems: 'center' },
  manage: { gap: space.lg },
  manageWide: { flexDirection: 'row', alignItems: 'flex-start' },
  half: { flex: 1, minWidth: 0 },
});
