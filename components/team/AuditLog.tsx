import { useState } from 'react';
import { ActivityIndicator, StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can } from '../../shared/permissions';
import { useMeQuery } from '../queries/auth';
import { useAuditQuery } from '../queries/audit';
import { colors, fonts, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { EmptyState } from '../ui/EmptyState';
import { Notice, QueryError } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Label, Small } from '../ui/Text';
import { describeAudit, formatDateTime } from './format';

const PAGE_SIZE = 25;

/** The organisation's audit log for admins: who did what, when, from where; newest first. */
export function AuditLog() {
  const router = useRouter();
  const me = useMeQuery();
  const allowed = can(me.data?.current?.role, 'audit:read');
  const [page, setPage] = useState(1);
  const q = useAuditQuery(page, PAGE_SIZE, allowed);
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  if (!allowed) {
    return (
      <Screen title="Audit log">
        <EmptyState title="Admins only" message="The audit log is visible to owners and admins of the organisation." />
      </Screen>
    );
  }
  const pages = q.data ? Math.max(1, Math.ceil(q.data.total / PAGE_SIZE)) : 1;
  return (
    <Screen
      title="Audit log"
      subtitle="Sign-ins, membership and role changes, invitations and tokens"
      testID="audit-screen"
      actions={<Button label="Back to team" tone="secondary" onPress={() => router.push('/team')} />}
    >
      {q.isPending ? (
        <View style={styles.center}>
          <ActivityIndicator color={colors.ink} accessibilityLabel="Loading the audit log" />
        </View>
      ) : q.isError ? (
        <QueryError error={q.error} onRetry={() => q.refetch()} />
      ) : q.data.items.length === 0 ? (
        <EmptyState title="Nothing recorded yet" message="Events appear here as people sign in, join and change roles." />
      ) : (
        <>
          <Card style={styles.card}>
            {wide ? (
              <View style={[styles.tr, styles.th]}>
                <Label style={styles.cWhen}>When</Label>
                <Label style={styles.cWhat}>What</Label>
                <Label style={styles.cWho}>By</Label>
                <Label style={styles.cIp}>From</Label>
              </View>
            ) : null}
            {q.data.items.map((e, i) =>
              wide ? (
                <View key={e.id} style={[styles.tr, styles.row, i > 0 && styles.divider]} testID="audit-row">
                  <Small style={styles.cWhen}>{formatDateTime(e.createdAt)}</Small>
                  <Body style={styles.cWhat}>{describeAudit(e)}</Body>
                  <Small style={styles.cWho} numberOfLines={1}>{e.actor?.email ?? '—'}</Small>
                  <Small style={styles.cIp} numberOfLines={1}>{e.ip ?? '—'}</Small>
                </View>
              ) : (
                <View key={e.id} style={[styles.row, i > 0 && styles.divider]} testID="audit-row">
                  <Body style={styles.what}>{describeAudit(e)}</Body>
                  <Small>
                    {formatDateTime(e.createdAt)}
                    {e.ip ? ` · ${e.ip}` : ''}
                  </Small>
                </View>
              ),
            )}
          </Card>
          <View style={styles.pager}>
            <Button label="Newer" tone="secondary" disabled={page <= 1} onPress={() => setPage((p) => Math.max(1, p - 1))} testID="audit-newer" />
            <Small>
              Page {page} of {pages} · {q.data.total} events
            </Small>
            <Button label="Older" tone="secondary" disabled={page >= pages} onPress={() => setPage((p) => p + 1)} testID="audit-older" />
          </View>
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  center: { padding: space.xl, alignItems: 'center' },
  card: { gap: 0, paddingVertical: space.sm },
  th: { borderBottomWidth: 1, borderBottomColor: colors.line, paddingBottom: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  row: { paddingVertical: space.sm, gap: 2 },
  divider: { borderTopWidth: 1, borderTopColor: colors.line },
  cWhen: { flex: 1.3 },
  cWhat: { flex: 4 },
  cWho: { flex: 2 },
  cIp: { flex: 1.2 },
  what: { fontFamily: fonts.medium },
  pager: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
});
