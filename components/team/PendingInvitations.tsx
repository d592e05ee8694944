import { useState } from 'react';
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import type { Invitation } from '../../shared/schemas/auth';
import { useInvitationCancelMutation, useInvitationResendMutation, useInvitationsQuery } from '../queries/invitations';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice, QueryError } from '../ui/Notice';
import { Body, Heading, Small } from '../ui/Text';
import { ConfirmBar } from './ConfirmBar';
import { formatDate } from './format';
import { RoleBadge } from './RolePicker';

/** Pending invitations with resend and cancel (cancel asks first). */
export function PendingInvitations() {
  const q = useInvitationsQuery();
  return (
    <Card style={styles.card} testID="pending-invitations">
      <Heading>Pending invitations</Heading>
      {q.isPending ? <ActivityIndicator color={colors.ink} accessibilityLabel="Loading invitations" /> : null}
      {q.isError ? (
        <QueryError error={q.error} onRetry={() => q.refetch()} />
      ) : null}
      {q.data && q.data.length === 0 ? <Small>No invitations are waiting for an answer.</Small> : null}
      {q.data?.map((inv) => <InvitationRow key={inv.id} inv={inv} />)}
    </Card>
  );
}

function InvitationRow({ inv }: { inv: Invitation }) {
  const resend = useInvitationResendMutation();
  const cancel = useInvitationCancelMutation();
  const [confirming, setConfirming] = useState(false);
  const error = resend.error ?? cancel.error;
  return (
    <View style={styles.row} testID={`invitation-${inv.email}`}>
      <View style={styles.main}>
        <Body numberOfLines={1}>{inv.email}</Body>
        <View style={styles.meta}>
          <RoleBadge role={inv.role} />
          <Small style={inv.expired ? styles.expired : undefined}>{inv.expired ? `Expired ${formatDate(inv.expiresAt)}` : `Valid until ${formatDate(inv.expiresAt)}`}</Small>
          {inv.invitedBy ? <Small>by {inv.invitedBy}</Small> : null}
        </View>
        {resend.isSuccess ? <Small style={styles.ok}>Sent again with a fresh link.</Small> : null}
        {error ? <Small style={styles.expired}>{error.message}</Small> : null}
      </View>
      {confirming ? (
        <ConfirmBar message={`Cancel the invitation to ${inv.email}? The link stops working.`} confirmLabel="Cancel invitation" onCancel={() => setConfirming(false)} onConfirm={() => cancel.mutate(inv.id)} busy={cancel.isPending} testID="confirm-cancel-invitation" />
      ) : (
        <View style={styles.actions}>
          <Button label="Resend" tone="secondary" onPress={() => resend.mutate(inv.id)} busy={resend.isPending} accessibilityHint={`Send the invitation to ${inv.email} again`} />
          <Button label="Cancel" tone="quiet" onPress={() => setConfirming(true)} accessibilityHint={`Cancel the invitation to ${inv.email}`} />
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  row: { gap: space.sm, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
  main: { gap: space.xs, minWidth: 0 },
  meta: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  expired: { color: colors.danger },
  ok: { color: colors.success },
});
