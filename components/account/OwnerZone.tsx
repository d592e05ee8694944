import { useState } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import type { Me } from '../../shared/schemas/auth';
import { can } from '../../shared/permissions';
import { useMembersQuery, useOrganisationCloseMutation, useOwnershipTransferMutation } from '../queries/members';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Body, Heading, Small } from '../ui/Text';
import { ConfirmBar } from '../team/ConfirmBar';

/** Owner-only: hand the organisation to another member, or close it (typed name confirms). */
export function OwnerZone(props: { me: Me }) {
  const current = props.me.current!;
  const router = useRouter();
  const members = useMembersQuery(can(current.role, 'organisation:transfer'));
  const transfer = useOwnershipTransferMutation();
  const close = useOrganisationCloseMutation();
  const [target, setTarget] = useState<number | null>(null);
  const [confirmName, setConfirmName] = useState('');
  const [closeError, setCloseError] = useState<string | undefined>();
  if (!can(current.role, 'organisation:transfer') && !can(current.role, 'organisation:close')) return null;
  const others = (members.data?.members ?? []).filter((m) => m.userId !== props.me.user.id);
  const chosen = others.find((m) => m.userId === target);
  return (
    <Card style={styles.card} testID="owner-zone">
      <Heading>Ownership of {current.name}</Heading>
      {can(current.role, 'organisation:transfer') ? (
        <View style={styles.section}>
          <Body>Transfer ownership: the member you choose becomes owner; you stay as admin.</Body>
          {members.isPending ? <ActivityIndicator color={colors.ink} accessibilityLabel="Loading members" /> : null}
          {members.isError ? <Notice tone="error">{members.error.message}</Notice> : null}
          {members.data && others.length === 0 ? <Small>Invite someone first; there is nobody else to hand over to.</Small> : null}
          <View style={styles.choices} accessibilityRole="radiogroup" accessibilityLabel="New owner">
            {others.map((m) => (
              <Pressable key={m.userId} accessibilityRole="radio" accessibilityLabel={`${m.name}, ${m.email}`} accessibilityState={{ selected: target === m.userId, checked: target === m.userId }} aria-checked={target === m.userId} onPress={() => setTarget(m.userId)} style={[styles.choice, target === m.userId && styles.choiceOn]}>
                <Text style={[styles.choiceText, target === m.userId && styles.choiceTextOn]} numberOfLines={1}>
                  {m.name}
                </Text>
              </Pressable>
            ))}
          </View>
          {transfer.error ? <Notice tone="error">{transfer.error.message}</Notice> : null}
          {transfer.isSuccess ? <Notice tone="success">Ownership transferred. You are now an admin.</Notice> : null}
          {chosen ? (
            <ConfirmBar message={`Make ${chosen.name} the owner of ${current.name}? You become an admin.`} confirmLabel="Transfer ownership" onCancel={() => setTarget(null)} onConfirm={() => transfer.mutate(chosen.userId, { onSuccess: () => setTarget(null) })} busy={transfer.isPending} testID="confirm-transfer" />
          ) : null}
        </View>
      ) : null}
      {can(current.role, 'organisation:close') ? (
        <View style={styles.section}>
          <Body>Close the organisation: every member loses access, invitations and API tokens stop working. This cannot be undone here.</Body>
          <TextField label={`Type "${current.name}" to confirm`} value={confirmName} onChangeText={(v) => { setConfirmName(v); setCloseError(undefined); }} error={closeError} autoCapitalize="none" testID="close-confirm-name" />
          <Button
            label="Close organisation"
            tone="danger"
            disabled={confirmName.trim() !== current.name}
            busy={close.isPending}
            onPress={() => close.mutate(confirmName, { onSuccess: () => router.replace('/networks'), onError: (e) => setCloseError(e.message) })}
            testID="close-organisation"
          />
        </View>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.lg, borderColor: colors.danger },
  section: { gap: space.sm },
  choices: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  choice: { minHeight: TOUCH, paddingHorizontal: space.md, borderRadius: radius.pill, borderWidth: 1, borderColor: colors.line, justifyContent: 'center', maxWidth: 260 },
  choiceOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  choiceText: { fontFamily: fonts.medium, fontSize: 14, color: colors.ink },
  choiceTextOn: { color: colors.onInk },
});
