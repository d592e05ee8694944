import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { Link } from 'expo-router';
import { InviteSchema, type Invite } from '../../shared/schemas/auth';
import { can, type Role } from '../../shared/permissions';
import { ApiError } from '../api/client';
import { useInvitationCreateMutation } from '../queries/invitations';
import { colors, space } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Heading, Label, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';
import { RolePicker } from './RolePicker';

const INVITABLE: Role[] = ['admin', 'analyst', 'dispatcher', 'viewer'];

/** Invite a colleague by e-mail with a role; seat-limit refusals say how to add seats. */
export function InviteForm(props: { myRole: Role; seatsFull: boolean }) {
  const form = useZodForm(InviteSchema, { email: '', role: 'dispatcher' });
  const invite = useInvitationCreateMutation();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [seatLimit, setSeatLimit] = useState<string | null>(null);
  const submit = () => {
    setSentTo(null);
    setSeatLimit(null);
    const body = form.validate() as Invite | null;
    if (!body) return;
    invite.mutate(body, {
      onSuccess: (inv) => {
        setSentTo(inv.email);
        form.setValues({ email: '', role: body.role });
      },
      onError: (err) => (err instanceof ApiError && err.body?.code === 'seat_limit' ? setSeatLimit(err.message) : form.fromServer(err)),
    });
  };
  const seatNotice = seatLimit ?? (props.seatsFull ? 'All seats are in use. Cancel a pending invitation or remove a member, or add seats on the Billing page.' : null);
  return (
    <Card style={styles.card} testID="invite-form">
      <Heading>Invite a colleague</Heading>
      {seatNotice ? (
        <Notice tone="caution" testID="invite-seat-limit">
          <Small style={styles.noticeText}>{seatNotice}</Small>
          {can(props.myRole, 'billing:read') ? (
            <Link href="/billing" style={styles.link}>
              <Small style={styles.linkText}>Open Billing</Small>
            </Link>
          ) : null}
        </Notice>
      ) : null}
      {sentTo ? (
        <Notice tone="success" testID="invite-sent">
          {`Invitation sent to ${sentTo}. It is valid for 7 days.`}
        </Notice>
      ) : null}
      {form.errors._ && !form.errors.email ? <Notice tone="error">{form.errors._}</Notice> : null}
      <TextField label="E-mail" value={form.values.email} onChangeText={form.set('email')} error={form.errors.email} autoCapitalize="none" autoComplete="email" inputMode="email" onSubmitEditing={submit} testID="invite-email" />
      <View style={styles.field}>
        <Label>Role</Label>
        <RolePicker label="Role of the invited colleague" value={form.values.role as Role} options={INVITABLE} onChange={(r) => form.set('role')(r)} testID="invite-role" />
        {form.errors.role ? <Small style={styles.error}>{form.errors.role}</Small> : null}
      </View>
      <Button label="Send invitation" onPress={submit} busy={invite.isPending} testID="invite-submit" />
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  field: { gap: space.xs },
  error: { color: colors.danger },
  noticeText: { color: colors.text },
  link: { minHeight: 44, justifyContent: 'center' },
  linkText: { color: colors.ink, textDecorationLine: 'underline' },
});
