import { ScrollView, StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can, type Role } from '../../shared/permissions';
import { useRunsByIdQuery, useRunVersionsQuery, useSolverLabels } from '../queries/runs';
import { colors, fonts, space, WIDE_BREAKPOINT } from '../theme';
import { Card } from '../ui/Card';
import { Button } from '../ui/Button';
import { DecisionSupportNote, Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Heading, Label, Small } from '../ui/Text';
import { compareColumns, sameQuestion, type CompareColumn } from './compare';
import { formatGap, formatRatio, formatSeconds, formatValue, questionLabel } from './format';
import type { RunDetail } from './types';

const settingsText = (s: Record<string, unknown>) => {
  const parts = Object.entries(s).filter(([k]) => ['layers', 'shots', 'optimizer', 'ansatz'].includes(k)).map(([k, v]) => `${k} ${String(v)}`);
  return parts.length ? ` (${parts.join(', ')})` : '';
};

const COL = 190;
const HEAD = 150;

/** Two or more runs side by side in one table (analysts: runs:compare). Scrolls sideways on phones. */
export function CompareView(props: { ids: number[]; role: Role | null }) {
  const router = useRouter();
  const queries = useRunsByIdQuery(props.ids);
  const labels = useSolverLabels();
  const wide = useWindowDimensions().width >= WIDE_BREAKPOINT;
  const loaded = queries.map((q) => q.data).filter((d): d is RunDetail => !!d);
  const versions = useRunVersionsQuery(loaded.map((r) => ({ networkId: r.networkId, versionId: r.versionId })));
  const versionNumber = new Map(versions.map((v) => [v.data?.id, v.data?.number]));
  if (!can(props.role, 'runs:compare')) return <Screen title="Compare runs"><Notice>Comparing runs is for analysts. Ask an admin for the analyst role.</Notice></Screen>;
  if (props.ids.length < 2) return <Screen title="Compare runs"><Notice>Choose two or more runs on the runs page.</Notice><Button label="Runs" onPress={() => router.push('/runs')} /></Screen>;
  const failed = queries.find((q) => q.isError);
  if (failed) return <Screen title="Compare runs"><Notice tone="error">{failed.error?.message ?? 'A run could not be loaded.'}</Notice></Screen>;
  if (queries.some((q) => q.isPending)) return <Screen title="Compare runs"><Body>Loading runs…</Body></Screen>;
  const runs = queries.map((q) => q.data as RunDetail);
  const cols = compareColumns(runs, labels);
  // One row per solver label + settings, so QAOA p = 1 and p = 3 get rows of their own.
  const solverKeys: string[] = [];
  const solverHead = new Map<string, string>();
  for (const c of cols) for (const s of c.solvers) {
    const key = s.solver + settingsText(s.settings);
    if (!solverKeys.includes(key)) solverKeys.push(key);
    solverHead.set(key, (labels[s.solver] ?? s.solver) + settingsText(s.settings));
  }
  const cell = (c: CompareColumn, key: string) => {
    const s = c.solvers.find((x) => x.solver + settingsText(x.settings) === key);
    if (!s) return '—';
    return `${formatValue(s.value)} · ratio ${formatRatio(s.ratio)} · gap ${formatGap(s.gap)}${s.provenOptimal ? ' · optimal' : ''} · ${formatSeconds(s.seconds)}`;
  };
  const rows: Array<{ head: string; get: (c: CompareColumn) => string }> = [
    {
      head: 'Question',
      get: (c) => {
        const pinned = Object.keys(c.question.pins ?? {}).length;
        return questionLabel(c.question) + (c.question.tolerance ? ` ± ${Math.round(c.question.tolerance * 100)} %` : '') + (pinned ? ` · ${pinned} pinned depot${pinned > 1 ? 's' : ''}` : ' · no pins');
      },
    },
    { head: 'Network', get: (c) => `${c.network} · version ${versionNumber.get(c.versionId) ?? '…'}` },
    { head: 'Best answer', get: (c) => (c.bestValue === null ? '—' : `${formatValue(c.bestValue)} by ${c.bestSolver}`) },
    { head: 'Best proven bound', get: (c) => formatValue(c.bound) },
    ...solverKeys.map((key) => ({ head: solverHead.get(key) ?? key, get: (c: CompareColumn) => cell(c, key) })),
  ];
  return (
    <Screen title="Compare runs" subtitle={`${runs.length} runs`}>
      {!sameQuestion(runs) ? <Notice tone="caution">These runs ask different questions (kind, regions, tolerance or pins differ); compare their values with care.</Notice> : null}
      <DecisionSupportNote />
      {!wide ? (
        // Phones: one card per run, one under the other — nothing hides off the right edge.
        <View style={styles.cards} testID="compare-cards">
          {cols.map((c) => (
            <Card key={c.runId} testID={`compare-card-${c.runId}`}>
              <Heading>Run {c.runId}</Heading>
              {rows.map((row) => (
                <View key={row.head} style={styles.line}>
                  <Label>{row.head}</Label>
                  <Body testID={`cmp-${c.runId}-${row.head}`}>{row.get(c)}</Body>
                </View>
              ))}
              <Button label={`Open run ${c.runId}`} tone="secondary" onPress={() => router.push(`/runs/${c.runId}`)} />
            </Card>
          ))}
        </View>
      ) : (
      <ScrollView horizontal contentContainerStyle={styles.scroll} testID="compare-table">
        <View>
          <View style={[styles.tr, styles.thead]}>
            <Label style={styles.th}> </Label>
            {cols.map((c) => (
              <Button key={c.runId} label={`Run ${c.runId}`} tone="quiet" onPress={() => router.push(`/runs/${c.runId}`)} style={{ width: COL }} />
            ))}
          </View>
          {rows.map((row) => (
            <View key={row.head} style={styles.tr}>
              <Label style={styles.th}>{row.head}</Label>
              {cols.map((c) => (
                <Body key={c.runId} style={styles.td} testID={`cmp-${c.runId}-${row.head}`}>
                  {row.get(c)}
                </Body>
              ))}
            </View>
          ))}
        </View>
      </ScrollView>
      )}
      <Small>Ratio = value against the best proven bound of that run (1.000 = proven best); gap = how far from that bound.</Small>
    </Screen>
  );
}

const styles = StyleSheet.create({
  scroll: { paddingBottom: space.sm },
  cards: { gap: space.md },
  line: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderColor: colors.line },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderColor: colors.line, paddingVertical: space.sm, alignItems: 'flex-start' },
  thead: { alignItems: 'center' },
  th: { width: HEAD, paddingRight: space.sm, fontFamily: fonts.medium },
  td: { width: COL, paddingRight: space.sm, fontSize: 14 },
});
