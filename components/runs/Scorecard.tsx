import { Pressable, StyleSheet, View, useWindowDimensions } from 'react-native';
import { colors, fonts, radius, space, TOUCH, WIDE_BREAKPOINT } from '../theme';
import { Body, Label, Small } from '../ui/Text';
import { formatCount, formatGap, formatRatio, formatSeconds, formatShots, formatValue } from './format';
import type { Scorecard as ScorecardData, ScoreRow } from './scorecard';
import { trivialBound } from './scorecard';

const STATUS_WORDS: Record<string, string> = { queued: 'Waiting', running: 'Running', succeeded: 'Done', failed: 'Failed', cancelled: 'Cancelled' };

function Badge(props: { text: string; tone: 'best' | 'proof' | 'warn' | 'muted'; testID?: string }) {
  return (
    <View style={[styles.badge, styles[props.tone]]} testID={props.testID}>
      <Small style={styles.badgeText}>{props.text}</Small>
    </View>
  );
}

function Badges({ row }: { row: ScoreRow }) {
  return (
    <View style={styles.badges}>
      {row.isBest ? <Badge text="Best answer" tone="best" testID={`best-${row.solver}`} /> : null}
      {row.provenOptimal ? <Badge text="Proven optimal" tone="proof" testID={`proven-${row.solver}`} /> : null}
      {row.value !== null && !row.balanced ? <Badge text="Unbalanced" tone="warn" /> : null}
      {row.status !== 'succeeded' ? <Badge text={STATUS_WORDS[row.status] ?? row.status} tone="muted" /> : null}
    </View>
  );
}

const COLUMNS: Array<{ key: string; title: string; get: (r: ScoreRow) => string; width: number }> = [
  { key: 'value', title: 'Value', get: (r) => formatValue(r.value), width: 90 },
  { key: 'ratio', title: 'Ratio to bound', get: (r) => formatRatio(r.ratio), width: 110 },
  { key: 'gap', title: 'Gap', get: (r) => formatGap(r.gap), width: 80 },
  { key: 'optimal', title: 'Proven optimal', get: (r) => (r.value === null ? '—' : r.provenOptimal ? 'Yes' : 'No'), width: 110 },
  { key: 'time', title: 'Time', get: (r) => formatSeconds(r.seconds), width: 90 },
  { key: 'toBest', title: 'Time to best', get: (r) => formatSeconds(r.secondsToBest), width: 100 },
  { key: 'evaluations', title: 'Evaluations', get: (r) => formatCount(r.evaluations), width: 100 },
  { key: 'shots', title: 'Shots', get: (r) => formatShots(r.shots), width: 90 },
];

/**
 * Every solver's answer side by side: value, ratio to the best proven bound, gap, optimality,
 * time, evaluations, shots — the best answer marked. Cards on phones, a table on wide screens.
 */
export function Scorecard(props: { card: ScorecardData; valueName: string; wide?: boolean; selectedJobId?: number | null; onSelect?: (jobId: number) => void }) {
  const { width } = useWindowDimensions();
  const wide = props.wide ?? width >= WIDE_BREAKPOINT;
  const { card } = props;
  const boundText = card.bound === null
    ? 'No proven bound for this run.'
    : trivialBound(card.sense, card.bound)
      ? `Best proven bound: ${formatValue(card.bound)} — no solver proved more than that a split crosses no negative volume, so no ratio or gap is shown.`
      : `Best proven bound: ${formatValue(card.bound)} (${card.sense === 'max' ? 'no cut can exceed it' : 'no balanced split can cross less'}).`;
  const select = (row: ScoreRow) => (props.onSelect && row.value !== null ? () => props.onSelect?.(row.jobId) : undefined);

  if (!wide) {
    return (
      <View style={styles.list} testID="scorecard">
        <Small>{boundText}</Small>
        {card.rows.map((row) => (
          <Pressable
            key={row.jobId}
            onPress={select(row)}
            disabled={!select(row)}
            accessibilityRole="button"
            accessibilityHint="Shows this answer on the network"
            accessibilityState={{ selected: props.selectedJobId === row.jobId }}
            style={[styles.card, row.isBest && styles.cardBest, props.selectedJobId === row.jobId && styles.cardSelected]}
            testID={`score-${row.solver}`}
          >
            <View style={styles.cardHead}>
              <Body style={styles.solver}>{row.label}</Body>
              <Body style={styles.bigValue} testID={`value-${row.solver}`}>{formatValue(row.value)}</Body>
            </View>
            <Badges row={row} />
            <View style={styles.grid}>
              {COLUMNS.filter((c) => c.key !== 'value' && c.key !== 'optimal').map((c) => (
                <View key={c.key} style={styles.cell}>
                  <Label>{c.title}</Label>
                  <Body testID={`${c.key}-${row.solver}`}>{c.get(row)}</Body>
                </View>
              ))}
            </View>
            {row.error ? <Small style={styles.error}>{row.error}</Small> : null}
          </Pressable>
        ))}
      </View>
    );
  }

  return (
    // Rows are buttons (tap to draw the answer), so no table role: a table may hold only rows.
    <View style={styles.table} testID="scorecard" role="group" accessibilityLabel="Scorecard">
      <Small>{boundText}</Small>
      <View style={[styles.tr, styles.thead]} aria-hidden>
        <Label style={[styles.th, styles.first]}>Solver</Label>
        {COLUMNS.map((c) => (
          <Label key={c.key} style={[styles.th, { width: c.width }]}>
            {c.key === 'value' ? props.valueName : c.title}
          </Label>
        ))}
      </View>
      {card.rows.map((row) => (
        <Pressable
          key={row.jobId}
          onPress={select(row)}
          disabled={!select(row)}
          accessibilityRole="button"
          accessibilityHint="Shows this answer on the network"
          accessibilityState={{ selected: props.selectedJobId === row.jobId }}
          style={[styles.tr, row.isBest && styles.cardBest, props.selectedJobId === row.jobId && styles.rowSelected]}
          testID={`score-${row.solver}`}
        >
          <View style={styles.first}>
            <Body style={styles.solver}>{row.label}</Body>
            <Badges row={row} />
            {row.error ? <Small style={styles.error}>{row.error}</Small> : null}
          </View>
          {COLUMNS.map((c) => (
            <Body key={c.key} style={[styles.td, { width: c.width }]} testID={`${c.key}-${row.solver}`}>
              {c.get(row)}
            </Body>
          ))}
        </Pressable>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  card: { backgroundColor: colors.surface, borderRadius: radius.lg, borderWidth: 1, borderColor: colors.line, padding: space.md, gap: space.sm, minHeight: TOUCH },
  cardBest: { borderColor: colors.signal, borderWidth: 2 },
  cardSelected: { backgroundColor: colors.surfaceSunk },
  rowSelected: { backgroundColor: colors.surfaceSunk },
  cardHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.sm },
  solver: { fontFamily: fonts.semibold, flexShrink: 1 },
  bigValue: { fontFamily: fonts.bold, fontSize: 20 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', rowGap: space.sm },
  cell: { width: '33%', gap: 2 },
  badges: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  badge: { borderRadius: radius.pill, paddingHorizontal: space.sm, paddingVertical: 2, borderWidth: 1 },
  badgeText: { fontFamily: fonts.medium, color: colors.text },
  best: { backgroundColor: colors.warnSoft, borderColor: colors.signal },
  proof: { backgroundColor: colors.successSoft, borderColor: colors.success },
  warn: { backgroundColor: colors.dangerSoft, borderColor: colors.danger },
  muted: { backgroundColor: colors.surfaceSunk, borderColor: colors.line },
  table: { gap: space.xs },
  tr: { flexDirection: 'row', alignItems: 'center', paddingVertical: space.sm, paddingHorizontal: space.sm, borderBottomWidth: 1, borderColor: colors.line, minHeight: TOUCH, backgroundColor: colors.surface, borderRadius: radius.sm },
  thead: { backgroundColor: 'transparent' },
  th: { paddingHorizontal: space.xs },
  td: { paddingHorizontal: space.xs, fontVariant: ['tabular-nums'] },
  first: { flex: 1, minWidth: 180, gap: space.xs, paddingHorizontal: space.xs },
  error: { color: colors.danger },
});
