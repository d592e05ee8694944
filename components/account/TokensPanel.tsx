import { useState } from 'react';
import { ActivityIndicator, StyleSheet, Text, View } from 'react-native';
import * as Clipboard from 'expo-clipboard';
import { CreateTokenSchema, type ApiToken, type CreateToken, type CreatedToken } from '../../shared/schemas/auth';
import { useTokenCreateMutation, useTokenRevokeMutation, useTokensQuery } from '../queries/tokens';
import { colors, radius, space, type as typo } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice, QueryError } from '../ui/Notice';
import { TextField } from '../ui/TextField';
import { Body, Heading, Small } from '../ui/Text';
import { useZodForm } from '../ui/useZodForm';
import { ConfirmBar } from '../team/ConfirmBar';
import { formatDate, formatDateTime } from '../team/format';

/** Personal API tokens for the current organisation: create (shown once, with copy), list, revoke. */
export function TokensPanel(props: { organisationName: string }) {
  const q = useTokensQuery();
  const create = useTokenCreateMutation();
  const form = useZodForm(CreateTokenSchema, { name: '' });
  const [fresh, setFresh] = useState<CreatedToken | null>(null);
  const [copied, setCopied] = useState(false);
  const submit = () => {
    const body = form.validate() as CreateToken | null;
    if (!body) return;
    create.mutate(body, {
      onSuccess: (t) => {
        setFresh(t);
        setCopied(false);
        form.setValues({ name: '' });
      },
      onError: form.fromServer,
    });
  };
  const copy = async () => {
    if (!fresh) return;
    await Clipboard.setStringAsync(fresh.token);
    setCopied(true);
  };
  return (
    <Card style={styles.card} testID="tokens-panel">
      <Heading>API tokens</Heading>
      <Small>
        For dispatch-system integration: send <Text style={typo.mono}>Authorization: Bearer …</Text> to act as you in {props.organisationName}, with your current role.
      </Small>
      {fresh ? (
        <Notice tone="success" testID="token-created">
          <Body>Token "{fresh.name}" created. Copy it now — it is not shown again.</Body>
          <Text selectable style={[typo.mono, styles.secret]} testID="token-secret">
            {fresh.token}
          </Text>
          <View style={styles.actions}>
            <Button label={copied ? 'Copied' : 'Copy token'} onPress={copy} testID="token-copy" />
            <Button label="Done" tone="secondary" onPress={() => setFresh(null)} />
          </View>
        </Notice>
      ) : null}
      {form.errors._ && !form.errors.name ? <Notice tone="error">{form.errors._}</Notice> : null}
      <TextField label="Token name" value={form.values.name} onChangeText={form.set('name')} error={form.errors.name} hint="Name it after the system that uses it." onSubmitEditing={submit} testID="token-name" />
      <Button label="Create token" tone="secondary" onPress={submit} busy={create.isPending} testID="token-create" />
      {q.isPending ? <ActivityIndicator color={colors.ink} accessibilityLabel="Loading tokens" /> : null}
      {q.isError ? (
        <QueryError error={q.error} onRetry={() => q.refetch()} />
      ) : null}
      {q.data && q.data.length === 0 ? <Small>You have no tokens for this organisation.</Small> : null}
      {q.data?.map((t) => <TokenRow key={t.id} token={t} />)}
    </Card>
  );
}

function TokenRow({ token }: { token: ApiToken }) {
  const revoke = useTokenRevokeMutation();
  const [confirming, setConfirming] = useState(false);
  return (
    <View style={styles.row} testID={`token-${token.name}`}>
      <Body>{token.name}</Body>
      <Small>
        <Text style={typo.mono}>{token.prefix}…</Text> · created {formatDate(token.createdAt)} · {token.lastUsedAt ? `last used ${formatDateTime(token.lastUsedAt)}` : 'never used'}
      </Small>
      {revoke.error ? <Small style={styles.error}>{revoke.error.message}</Small> : null}
      {confirming ? (
        <ConfirmBar message={`Revoke "${token.name}"? Systems using it stop working at once.`} confirmLabel="Revoke token" onCancel={() => setConfirming(false)} onConfirm={() => revoke.mutate(token.id)} busy={revoke.isPending} testID="confirm-revoke-token" />
      ) : (
        <View style={styles.actions}>
          <Button label="Revoke" tone="quiet" onPress={() => setConfirming(true)} accessibilityHint={`Revoke the token ${token.name}`} />
        </View>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  card: { gap: space.md },
  secret: { padding: space.sm, backgroundColor: colors.surface, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line, marginVertical: space.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  row: { gap: space.xs, paddingTop: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
  error: { color: colors.danger },
});
