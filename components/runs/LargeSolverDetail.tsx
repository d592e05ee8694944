import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import type { NetworkDocument } from '../../shared/engine/network/types';
import type { DecompositionReport } from '../../shared/engine/solvers/types';
import type { JobResultView } from '../../shared/schemas/runs';
import { NetworkEditor } from '../drawing/NetworkEditor';
import { draftFromDocument, emptySelection, type Selection } from '../drawing/draft';
import { colors, fonts, radius, regionColors, space } from '../theme';
import { Button } from '../ui/Button';
import { Body, Heading, Label, Small } from '../ui/Text';
import { formatCount } from './format';
import { blockColours, blockSizeCounts, correlationRange, roundName } from './large-solvers';

/** Rounds shown before "Show all". */
const FIRST_ROUNDS = 8;
const MERGE_WORDS: Record<DecompositionReport['merge'], string> = {
  single: 'one block: nothing to orient',
  exact: 'exact enumeration over the block orientations',
  rqaoa: 'recursive QAOA on the block graph (level 1, closed form)',
  blocks: 'blocks of blocks: QAOA on groups of blocks, then the groups oriented',
  local: 'greedy whole-block flips under the balance rule',
};

/** RQAOA's rounds: per round, depots left, depots eliminated (same side / other side) and the |correlations| used. */
export function RecursionRounds(props: { recursion: NonNullable<JobResultView['recursion']>; label: string; wide: boolean }) {
  const { recursion: rec } = props;
  const [all, setAll] = useState(false);
  const log = rec.roundLog ?? [];
  const shown = all ? log : log.slice(0, FIRST_ROUNDS);
  const merged = log.some((e) => e.to > e.from);
  return (
    <View style={styles.wrap} testID="rqaoa-rounds">
      <Heading>{props.label}: rounds</Heading>
      <Small testID="rqaoa-summary">
        {rec.rounds} round{rec.rounds === 1 ? '' : 's'} of one-layer QAOA; {formatCount(rec.eliminationsTotal)} depot{rec.eliminationsTotal === 1 ? '' : 's'} eliminated by imposing the strongest correlation ⟨Z·Z⟩ between two depots (same side when positive, opposite when negative); the last {rec.remainder} solved exactly.
        {merged ? ' Consecutive rounds are grouped to keep the log short.' : ''}
      </Small>
      {log.length === 0 ? <Small>No round log was kept with this result.</Small> : null}
      {props.wide && shown.length ? (
        <View role="table" accessibilityLabel="Recursive QAOA rounds">
          <View style={[styles.tr, styles.thead]} role="row">
            {['Round', 'Depots left', 'Eliminated', 'Same / other side', '|Correlation| used', 'γ', 'β'].map((h, i) => <Label key={h} style={[styles.td, { width: WIDTHS[i] }]} role="columnheader">{h}</Label>)}
          </View>
          {shown.map((e) => (
            <View key={e.from} style={styles.tr} role="row" testID="rqaoa-round">
              {[roundName(e), formatCount(e.spins), `${formatCount(e.eliminated)}${e.dropped ? ` (+${e.dropped} without lanes)` : ''}`, `${e.same} / ${e.opposite}`, correlationRange(e), e.from ? e.gamma.toFixed(3) : '—', e.from ? e.beta.toFixed(3) : '—'].map((cell, i) => (
                <Body key={i} style={[styles.td, { width: WIDTHS[i] }]} role="cell">{cell}</Body>
              ))}
            </View>
          ))}
        </View>
      ) : (
        shown.map((e) => (
          <View key={e.from} style={styles.line} testID="rqaoa-round">
            <Body style={styles.strong}>{roundName(e)}</Body>
            <Small>
              {e.from ? `${formatCount(e.spins)} depots left · ` : ''}{formatCount(e.eliminated)} eliminated ({e.same} same side, {e.opposite} other){e.dropped ? `, ${e.dropped} without lanes` : ''} · |correlation| {correlationRange(e)}
            </Small>
          </View>
        ))
      )}
      {log.length > FIRST_ROUNDS ? <Button label={all ? `Show the first ${FIRST_ROUNDS} only` : `Show all ${log.length} entries`} tone="quiet" onPress={() => setAll((a) => !a)} testID="rqaoa-rounds-all" /> : null}
    </View>
  );
}
const WIDTHS = [130, 100, 170, 130, 140, 70, 70];

/** qaoa-blocks' blocks: how many, their sizes, the merge, and the network coloured by block. */
export function BlocksView(props: { decomposition: DecompositionReport; document: Pick<NetworkDocument, 'depots' | 'lanes'>; label: string; blockSize?: number }) {
  const d = props.decomposition;
  const { draft, projection } = useMemo(() => draftFromDocument(props.document), [props.document]);
  const [selection, setSelection] = useState<Selection>(emptySelection);
  const { depotColors, between } = useMemo(() => {
    const index = new Map(props.document.depots.map((x, i) => [x.id, i]));
    const ends = props.document.lanes.map((l) => [index.get(l.from) ?? -1, index.get(l.to) ?? -1] as const);
    const colour = blockColours(d.blockOf, ends.filter(([a, b]) => a >= 0 && b >= 0), regionColors.length);
    const crossing = new Set<number>();
    ends.forEach(([a, b], e) => { if (a >= 0 && b >= 0 && d.blockOf[a] !== d.blockOf[b]) crossing.add(e); });
    return { depotColors: d.blockOf.map((b) => regionColors[colour[b]]), between: crossing };
  }, [d.blockOf, props.document]);
  const counts = blockSizeCounts(d.sizes);
  const picked = [...selection.depots][0];
  return (
    <View style={styles.wrap} testID="blocks-view">
      <Heading>{props.label}: blocks</Heading>
      <Body testID="blocks-summary">
        {formatCount(d.blocks)} block{d.blocks === 1 ? '' : 's'}, widest circuit {d.largestQubits} qubits; orientations by {MERGE_WORDS[d.merge]}.
      </Body>
      <View style={styles.sizes} testID="block-sizes">
        {counts.map((c) => (
          <View key={c.size} style={styles.chip}>
            <Small style={styles.chipText}>{c.blocks} × {c.size} depots</Small>
          </View>
        ))}
      </View>
      {d.blockOf.length === props.document.depots.length ? (
        <>
          <NetworkEditor draft={draft} projection={projection} onCommit={() => undefined} selection={selection} onSelectionChange={setSelection} readOnly height={320} depotColors={depotColors} emphasisedLanes={between} />
          <Small testID="blocks-picked">
            {picked !== undefined ? `${props.document.depots[picked].name ?? props.document.depots[picked].id}: block ${d.blockOf[picked] + 1} of ${d.blocks} (${d.sizes[d.blockOf[picked]]} depots).` : 'Depots coloured by block (neighbouring blocks differ where eight colours allow); emphasised lanes run between blocks. Tap a depot to see its block.'}
          </Small>
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  tr: { flexDirection: 'row', alignItems: 'center', paddingVertical: space.xs, borderBottomWidth: 1, borderColor: colors.line },
  thead: { paddingVertical: space.xs },
  td: { paddingHorizontal: space.xs, fontVariant: ['tabular-nums'] },
  line: { gap: 2, paddingVertical: space.xs, borderBottomWidth: 1, borderColor: colors.line },
  strong: { fontFamily: fonts.semibold },
  sizes: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: { borderRadius: radius.pill, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surfaceSunk, paddingHorizontal: space.sm, paddingVertical: 2 },
  chipText: { color: colors.text },
});
