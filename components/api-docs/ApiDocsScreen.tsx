import { useMemo, useState } from 'react';
import { ActivityIndicator, Linking, StyleSheet, Text, View } from 'react-native';
import { useApiDocsQuery } from '../queries/apiDocs';
import { colors, radius, space, type as typo } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Heading, Label, Small } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { describeApi, filterGroups, type ApiOperation } from './describe';

const origin = () => (globalThis as { location?: { origin?: string } }).location?.origin ?? 'https://spinyard.example';

/** How an integration signs its requests: a personal token from the Account screen, as a Bearer header. */
function AuthenticateCard() {
  const base = origin();
  return (
    <Card testID="api-authenticate">
      <Heading>Authenticate with a personal API token</Heading>
      <Body>1. Open Account → API tokens, name a token after the system that will use it, and create it. The token is shown once: copy it into that system's secret store.</Body>
      <Body>2. Send it on every request as the header Authorization: Bearer followed by the token. Token requests need no CSRF token and no cookie.</Body>
      <Body>3. A token acts as you, in the organisation it was created for, with your current role: if your role changes or you leave, the token follows. Revoke it on the Account screen when it is no longer needed.</Body>
      <View style={styles.code} role="group" accessibilityLabel="Example request with a token">
        <Text style={typo.mono} selectable>{`curl \\\n  -H "Authorization: Bearer spy_…" \\\n  ${base}/api/networks`}</Text>
      </View>
      <Small>Errors come back as JSON: {'{"error": "…", "fields": {…}}'} with 400 for invalid input (fields name each problem), 401 without a valid token, 403 when your role does not allow the action, 404 for rows of other organisations, 429 when a limit is reached.</Small>
    </Card>
  );
}

function OperationRow({ op }: { op: ApiOperation }) {
  return (
    <View style={styles.op} testID={`api-op-${op.method}-${op.path}`}>
      <View style={styles.opHead}>
        <Text style={[styles.method, styles[op.method as keyof typeof styles] as object]} >{op.method}</Text>
        <Text style={[typo.mono, styles.path]} selectable>{op.path}</Text>
      </View>
      <Body>{op.summary}</Body>
      <Small>
        {!op.signedIn ? 'Who may call it: anyone (no sign-in needed).' : op.roles ? `Who may call it: ${op.roles.join(', ')} (${op.access.replace(/`/g, '').replace(/\.$/, '')}).` : `Who may call it: ${op.access.replace(/`/g, '')}`}
      </Small>
      {op.fields.length > 0 ? (
        <View style={styles.fields}>
          {op.fields.map((f) => (
            <View key={`${f.where}:${f.name}`} style={styles.field}>
              <Text style={[typo.mono, styles.fieldName]}>{f.name}</Text>
              <Small>
                {f.where === 'body' ? 'body' : f.where === 'path' ? 'in the path' : 'query'} · {f.type}
                {f.required ? ' · required' : ' · optional'}
              </Small>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** The API page for integrators: every route of the OpenAPI document, grouped by area. */
export function ApiDocsScreen() {
  const q = useApiDocsQuery();
  const [filter, setFilter] = useState('');
  const groups = useMemo(() => (q.data ? describeApi(q.data) : []), [q.data]);
  const shown = useMemo(() => filterGroups(groups, filter), [groups, filter]);
  const count = groups.reduce((n, g) => n + g.operations.length, 0);
  return (
    <Screen
      title="API for integrators"
      subtitle={q.data ? `${q.data.info?.title ?? 'Spinyard API'} ${q.data.info?.version ?? ''} · ${count} routes` : 'Every route of the Spinyard API'}
      actions={<Button label="Open the OpenAPI document" tone="secondary" onPress={() => Linking.openURL(`${origin()}/api/openapi.json`)} testID="api-openapi-json" />}
      testID="api-docs-screen"
    >
      <AuthenticateCard />
      {q.isPending ? <ActivityIndicator color={colors.ink} accessibilityLabel="Loading the API description" /> : null}
      {q.isError ? (
        <Notice tone="error">
          The API description could not be loaded: {q.error.message}
        </Notice>
      ) : null}
      {q.data ? <TextField label="Filter routes" value={filter} onChangeText={setFilter} placeholder="e.g. runs cancel, versions, tokens" autoCapitalize="none" testID="api-filter" /> : null}
      {q.data && shown.length === 0 ? <Notice>No route matches “{filter}”.</Notice> : null}
      {shown.map((g) => (
        <Card key={g.tag} testID={`api-group-${g.tag}`}>
          <Heading>{g.tag.charAt(0).toUpperCase() + g.tag.slice(1)}</Heading>
          <Label>{g.operations.length === 1 ? '1 route' : `${g.operations.length} routes`}</Label>
          {g.operations.map((op) => (
            <OperationRow key={`${op.method} ${op.path}`} op={op} />
          ))}
        </Card>
      ))}
    </Screen>
  );
}

const styles = StyleSheet.create({
  code: { backgroundColor: colors.surfaceSunk, borderRadius: radius.md, padding: space.md },
  op: { borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.md, marginTop: space.sm, gap: space.xs },
  opHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm },
  method: { ...typo.label, color: colors.ink, backgroundColor: colors.surfaceSunk, borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 2, minWidth: 64, textAlign: 'center' },
  GET: { color: colors.ink },
  POST: { color: colors.success },
  PUT: { color: colors.signalDeep },
  PATCH: { color: colors.signalDeep },
  DELETE: { color: colors.danger },
  path: { flexShrink: 1 },
  fields: { gap: space.xs, paddingLeft: space.sm },
  field: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.sm, alignItems: 'baseline' },
  fieldName: { color: colors.ink },
});
