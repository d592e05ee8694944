import { useState } from 'react';
import { Pressable, StyleSheet, View, useWindowDimensions } from 'react-native';
import { Link, useRouter } from 'expo-router';
import { can, type Role } from '../../shared/permissions';
import { useRunsQuery, useSolverLabels, useSolversQuery } from '../queries/runs';
import { colors, fonts, radius, space, TOUCH, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { EmptyState } from '../ui/EmptyState';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Label, Small } from '../ui/Text';
import { CheckRow } from './controls';
import { questionLabel } from './format';
import { formatDateTime } from '../ui/dates';
import { STATUS_TEXT } from './progress';
import type { RunListItem } from './types';


/** The organisation's runs, newest first; analysts tick two or more to compare them. */
export function RunList(props: { role: Role | null; compareWith?: number }) {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const runs = useRunsQuery();
  const labels = useSolverLabels();
  // Rows wait for the registry's labels (one cached request) so a solver never shows as its code first.
  const listing = useSolversQuery();
  const solverNames = (r: RunListItem) => r.solvers.map((s) => labels[s] ?? s).join(', ');
  const mayCompare = can(props.role, 'runs:compare');
  const [ticked, setTicked] = useState<number[]>(props.compareWith ? [props.compareWith] : []);
  const toggle = (id: number) => setTicked((t) => (t.includes(id) ? t.filter((x) => x !== id) : [...t, id]));
  const compareButton = ticked.length >= 2 ? <Button label={`Compare ${ticked.length} runs`} onPress={() => router.push(`/runs/compare?ids=${ticked.join(',')}`)} testID="compare-runs" /> : null;
  // Analysts (runs:advanced) reach operators of their own from here.
  const operator = can(props.role, 'runs:advanced') ? <Button label="Operator of your own" tone="secondary" onPress={() => router.push('/runs/operator')} testID="open-operator" /> : null;
  const compare = compareButton || operator ? <>{operator}{compareButton}</> : null;

  if (runs.isPending || listing.isPending) return <Screen title="Runs"><Body>Loading runs…</Body></Screen>;
  if (runs.isError) return <Screen title="Runs"><Notice tone="error">{runs.error.message}</Notice></Screen>;
  if (runs.data.length === 0) {
    return (
      <Screen title="Runs">
        <EmptyState title="No runs yet" message="Open a network and choose “New run” to see which depots go where, and how close each answer is to a proven bound.">
          <Button label="Go to networks" onPress={() => router.push('/networks')} />
        </EmptyState>
      </Screen>
    );
  }
  // Wide screens: one table row per run, the same cells as the phone card.
  const tableRow = (r: RunListItem) => (
    <View key={r.id} style={styles.tr} role="listitem" testID={`run-item-${r.id}`}>
      {/* A real <a href> on the web: Enter opens it (react-native-web leaves role="link" without href to the browser, which does nothing). */}
      <Link href={`/runs/${r.id}`} asChild>
      <Pressable accessibilityRole="link" style={styles.trOpen}>
        <Body style={[styles.cRun, styles.title]}>Run {r.id}</Body>
        <Body style={styles.cQuestion}>{questionLabel(r.problem)}</Body>
        <Body style={styles.cNetwork}>{r.networkName ?? `Network ${r.networkId}`} · {r.depotCount} depots</Body>
        <Small style={styles.cSolvers}>{solverNames(r)}</Small>
        <Small style={styles.cStatus}>{STATUS_TEXT[r.status] ?? r.status}</Small>
        <Small style={styles.cWhen}>{formatDateTime(r.createdAt)}</Small>
      </Pressable>
      </Link>
      {mayCompare ? (
        <View style={styles.cTick}>
          <CheckRow title="Compare" accessibilityLabel={`Compare run ${r.id}`} checked={ticked.includes(r.id)} onPress={() => toggle(r.id)} testID={`tick-${r.id}`} />
        </View>
      ) : null}
    </View>
  );
  const row = (r: RunListItem) => (
    <View key={r.id} style={styles.item} testID={`run-item-${r.id}`}>
      <Link href={`/runs/${r.id}`} asChild>
      <Pressable accessibilityRole="link" style={styles.open}>
        <Body style={styles.title}>Run {r.id} · {questionLabel(r.problem)}</Body>
        <Small>{r.networkName ?? `Network ${r.networkId}`} · {r.depotCount} depots · {solverNames(r)}</Small>
        <Small>{STATUS_TEXT[r.status] ?? r.status} · {formatDateTime(r.createdAt)}</Small>
      </Pressable>
      </Link>
      {mayCompare ? <CheckRow title="Compare" accessibilityLabel={`Compare run ${r.id}`} checked={ticked.includes(r.id)} onPress={() => toggle(r.id)} testID={`tick-${r.id}`} /> : null}
    </View>
  );
  return (
    <Screen title="Runs" subtitle={mayCompare ? 'Tick two or more runs to compare them in one table.' : undefined} actions={compare}>
      {wide ? (
        <View style={styles.table} accessibilityRole="list">
          <View style={[styles.tr, styles.thead]} aria-hidden>
            <View style={styles.trOpen}>
              {(['Run', 'Question', 'Network', 'Solvers', 'Status', 'Started'] as const).map((h, i) => (
                <Label key={h} style={[styles.cRun, styles.cQuestion, styles.cNetwork, styles.cSolvers, styles.cStatus, styles.cWhen][i]}>{h}</Label>
              ))}
            </View>
            {mayCompare ? <Label style={styles.cTick}>Compare</Label> : null}
          </View>
          {runs.data.map(tableRow)}
        </View>
      ) : (
        <View style={styles.list}>{runs.data.map(row)}</View>
      )}
      {/* Below a long list only the compare button repeats (it appears once runs are ticked); the operator link stays in the header. */}
      {compareButton}
      {!mayCompare ? <Small>Comparing runs is for analysts.</Small> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: { backgroundColor: colors.surface, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, padding: space.md, flexDirection: 'row', alignItems: 'center', gap: space.md },
  open: { minHeight: TOUCH, justifyContent: 'center', flex: 1, gap: 2 },
  title: { fontFamily: fonts.semibold },
  table: { backgroundColor: colors.surface, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, paddingHorizontal: space.md },
  thead: { minHeight: 36 },
  tr: { flexDirection: 'row', alignItems: 'center', borderBottomWidth: 1, borderColor: colors.line, gap: space.md },
  trOpen: { flex: 1, flexDirection: 'row', alignItems: 'center', minHeight: TOUCH, gap: space.md },
  cRun: { width: 70 },
  cQuestion: { width: 210 },
  cNetwork: { flex: 1 },
  cSolvers: { width: 170 },
  cStatus: { width: 150 },
  cWhen: { width: 110 },
  cTick: { width: 120 },
});
