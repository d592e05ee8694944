import { useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import type { Member } from '../../shared/schemas/auth';
import type { Role } from '../../shared/permissions';
import { memberActions } from './member-actions';
import { useMemberRemoveMutation, useMemberRoleMutation } from '../queries/members';
import { colors, fonts, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Body, Label, Small } from '../ui/Text';
import { ConfirmBar } from './ConfirmBar';
import { formatDate } from './format';
import { RoleBadge, RolePicker } from './RolePicker';

/** Members as cards on a phone, as a table on a wide screen. */
export function MembersView(props: { members: Member[]; myRole: Role | null; myUserId: number }) {
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const ownerCount = props.members.filter((m) => m.role === 'owner').length;
  return (
    <Card style={styles.card} testID={wide ? 'members-table' : 'members-list'}>
      {wide ? (
        <View style={[styles.tr, styles.th]} accessibilityRole="header">
          <Label style={styles.cName}>Name</Label>
          <Label style={styles.cEmail}>E-mail</Label>
          <Label style={styles.cRole}>Role</Label>
          <Label style={styles.cDate}>Joined</Label>
          <Label style={[styles.cActions, styles.right]}>Actions</Label>
        </View>
      ) : null}
      {props.members.map((m, i) => (
        <MemberRow key={m.id} first={i === 0} member={m} wide={wide} myRole={props.myRole} isMe={m.userId === props.myUserId} ownerCount={ownerCount} />
      ))}
    </Card>
  );
}

function MemberRow(props: { first: boolean; member: Member; wide: boolean; myRole: Role | null; isMe: boolean; ownerCount: number }) {
  const m = props.member;
  const allowed = memberActions(props.myRole, m, props.ownerCount);
  const [mode, setMode] = useState<'idle' | 'role' | 'remove'>('idle');
  const changeRole = useMemberRoleMutation();
  const remove = useMemberRemoveMutation();
  const error = changeRole.error ?? remove.error;
  const name = `${m.name}${props.isMe ? ' (you)' : ''}`;
  const actions =
    allowed.changeRole || allowed.remove ? (
      <View style={styles.actions}>
        {allowed.changeRole ? <Button label="Change role" tone="secondary" onPress={() => setMode(mode === 'role' ? 'idle' : 'role')} accessibilityHint={`Change the role of ${m.name}`} testID={`member-role-${m.email}`} /> : null}
        {allowed.remove ? <Button label="Remove" tone="quiet" onPress={() => setMode('remove')} accessibilityHint={`Remove ${m.name} from the organisation`} testID={`member-remove-${m.email}`} /> : null}
      </View>
    ) : null;
  const extra = (
    <>
      {mode === 'role' ? (
        <View style={styles.extra}>
          <RolePicker
            label={`New role for ${m.name}`}
            value={m.role}
            options={allowed.roleOptions}
            disabled={changeRole.isPending}
            onChange={(role) => changeRole.mutate({ id: m.id, role }, { onSuccess: () => setMode('idle') })}
            testID={`member-role-picker-${m.email}`}
          />
        </View>
      ) : null}
      {mode === 'remove' ? (
        <View style={styles.extra}>
          <ConfirmBar
            message={`Remove ${m.name} (${m.email}) from the organisation? Their API tokens for it stop working.`}
            confirmLabel="Remove member"
            onCancel={() => setMode('idle')}
            onConfirm={() => remove.mutate(m.id)}
            busy={remove.isPending}
            testID="confirm-remove-member"
          />
        </View>
      ) : null}
      {error ? <Small style={styles.error}>{error.message}</Small> : null}
    </>
  );
  if (props.wide) {
    return (
      <View style={[styles.rowWrap, !props.first && styles.divider]} testID={`member-${m.email}`}>
        <View style={styles.tr}>
          <Body style={styles.cName} numberOfLines={1}>{name}</Body>
          <Body style={styles.cEmail} numberOfLines={1}>{m.email}</Body>
          <View style={styles.cRole}>
            <RoleBadge role={m.role} />
          </View>
          <Small style={styles.cDate}>{formatDate(m.joinedAt)}</Small>
          <View style={styles.cActions}>{actions}</View>
        </View>
        {extra}
      </View>
    );
  }
  return (
    <View style={[styles.rowWrap, !props.first && styles.divider]} testID={`member-${m.email}`}>
      <View style={styles.cardHead}>
        <View style={styles.cardTitle}>
          <Body style={styles.name} numberOfLines={1}>{name}</Body>
          <Small numberOfLines={1}>{m.email}</Small>
        </View>
        <RoleBadge role={m.role} />
      </View>
      <Small>Joined {formatDate(m.joinedAt)}</Small>
      {actions}
      {extra}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: 0, paddingVertical: space.sm },
  th: { borderBottomWidth: 1, borderBottomColor: colors.line, paddingBottom: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', gap: space.md, minHeight: 52 },
  rowWrap: { gap: space.sm, paddingVertical: space.md },
  divider: { borderTopWidth: 1, borderTopColor: colors.line },
  cName: { flex: 2, minWidth: 0 },
  cEmail: { flex: 3, minWidth: 0 },
  cRole: { flex: 1.2 },
  cDate: { flex: 1.2 },
  cActions: { flex: 3, alignItems: 'flex-end' },
  right: { textAlign: 'right' },
  cardHead: { flexDirection: 'row', alignItems: 'flex-start', justifyContent: 'space-between', gap: space.sm },
  cardTitle: { flex: 1, minWidth: 0, gap: 2 },
  name: { fontFamily: fonts.semibold },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  extra: { paddingTop: space.xs },
  error: { color: colors.danger },
});
