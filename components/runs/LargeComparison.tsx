import { StyleSheet, View } from 'react-native';
import { colors, fonts, radius, space } from '../theme';
import { Body, Heading, Label, Small } from '../ui/Text';
import { formatGap, formatSeconds, formatValue } from './format';
import type { LargeComparison as Comparison, LargeRow, RefinementWord } from './large-solvers';

const REFINEMENT_WORDS: Record<RefinementWord, string> = {
  changed: 'Changed the answer',
  unchanged: 'Ran, no change',
  off: 'Off',
  none: '—',
};

const COLUMNS: Array<{ key: string; title: string; get: (r: LargeRow) => string; width: number }> = [
  { key: 'unrefined', title: 'Before refinement', get: (r) => (r.unrefined === null ? '—' : `${formatValue(r.unrefined)}${r.unrefinedBalanced ? '' : ' (unbalanced)'}`), width: 130 },
  { key: 'refinement', title: 'Classical refinement', get: (r) => REFINEMENT_WORDS[r.refinement], width: 150 },
  { key: 'bestKnownGap', title: 'Gap to best known', get: (r) => formatGap(r.gapToBestKnown), width: 120 },
  { key: 'boundGap', title: 'Gap to bound', get: (r) => formatGap(r.gapToBound), width: 100 },
  { key: 'time', title: 'Time', get: (r) => formatSeconds(r.seconds), width: 80 },
];

/**
 * The large-network solvers against the classical heuristic, the bound and the best known answer,
 * with the value before classical refinement beside the final one, so a variational answer is never
 * credited with the classical polish. Cards on phones, a table on wide screens.
 */
export function LargeComparison(props: { comparison: Comparison; valueName: string; wide: boolean; runId: number }) {
  const { comparison: c } = props;
  const bk = c.bestKnown;
  const bestKnownText = bk
    ? `Best known answer: ${formatValue(bk.value)} — the best balanced answer any run on this network version has found for this question (${bk.runsCompared} run${bk.runsCompared > 1 ? 's' : ''} compared; found by ${bk.solver} in ${bk.runId === props.runId ? 'this run' : `run ${bk.runId}`})${bk.provenOptimal ? ', proven optimal.' : '; not proven optimal, so the true optimum may be better.'}`
    : 'No best known answer yet: no run on this network version has answered this question.';
  const boundText = c.bound === null ? 'No proven bound for this run.' : `Proven bound: ${formatValue(c.bound)}.`;
  return (
    <View style={styles.wrap} testID="large-comparison">
      <Heading>Large-network quantum solvers against the classical answer</Heading>
      <Small testID="best-known">{bestKnownText}</Small>
      <Small>{boundText}</Small>
      {props.wide ? (
        <View role="table" accessibilityLabel="Large-network comparison">
          <View style={[styles.tr, styles.thead]} role="row">
            <Label style={styles.first} role="columnheader">Solver</Label>
            <Label style={[styles.td, { width: 90 }]} role="columnheader">{props.valueName}</Label>
            {COLUMNS.map((col) => <Label key={col.key} style={[styles.td, { width: col.width }]} role="columnheader">{col.title}</Label>)}
          </View>
          {c.rows.map((r) => (
            <View key={r.jobId} style={[styles.tr, r.role === 'classical' && styles.classical]} role="row" testID={`large-row-${r.solver}`}>
              <Body style={[styles.first, styles.solver]} role="cell">{r.label}{r.role === 'classical' ? ' (classical)' : ''}</Body>
              <Body style={[styles.td, { width: 90 }]} role="cell" testID={`large-value-${r.solver}`}>{formatValue(r.value)}</Body>
              {COLUMNS.map((col) => <Body key={col.key} style={[styles.td, { width: col.width }]} role="cell" testID={`large-${col.key}-${r.solver}`}>{col.get(r)}</Body>)}
            </View>
          ))}
        </View>
      ) : (
        c.rows.map((r) => (
          <View key={r.jobId} style={[styles.card, r.role === 'classical' && styles.classical]} testID={`large-row-${r.solver}`}>
            <View style={styles.cardHead}>
              <Body style={styles.solver}>{r.label}{r.role === 'classical' ? ' (classical)' : ''}</Body>
              <Body style={styles.big} testID={`large-value-${r.solver}`}>{formatValue(r.value)}</Body>
            </View>
            <View style={styles.grid}>
              {COLUMNS.filter((col) => r.role === 'variational' || (col.key !== 'unrefined' && col.key !== 'refinement')).map((col) => (
                <View key={col.key} style={styles.cell}>
                  <Label>{col.title}</Label>
                  <Body testID={`large-${col.key}-${r.solver}`}>{col.get(r)}</Body>
                </View>
              ))}
            </View>
          </View>
        ))
      )}
      <Small>“Before refinement” is the quantum-style method's own answer; “Classical refinement” says whether a classical local search then changed it (a solver setting). Compare the value before refinement when judging the quantum-style part alone.</Small>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', paddingVertical: space.sm, borderBottomWidth: 1, borderColor: colors.line },
  thead: { paddingVertical: space.xs },
  classical: { backgroundColor: colors.surfaceSunk },
  first: { flex: 1, minWidth: 160, paddingHorizontal: space.xs },
  td: { paddingHorizontal: space.xs, fontVariant: ['tabular-nums'] },
  solver: { fontFamily: fonts.semibold },
  card: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.lg, padding: space.md, gap: space.sm },
  cardHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.sm },
  big: { fontFamily: fonts.bold, fontSize: 20 },
  grid: { flexDirection: 'row', flexWrap: 'wrap', rowGap: space.sm },
  cell: { width: '50%', gap: 2 },
});
