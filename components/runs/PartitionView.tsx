import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { NetworkEditor } from '../drawing/NetworkEditor';
import { draftFromDocument, emptySelection, type Selection } from '../drawing/draft';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { colors, radius, regionColors, space } from '../theme';
import { Body, Label, Small } from '../ui/Text';
import { formatValue } from './format';
import { emptyRegionNote, summarisePartition } from './partition';
import { partName } from '../../shared/runs/regions';
import type { RunProblem } from './types';

/** Sides and regions are named as the CSV numbers them (shared/runs/regions.ts). */
export const regionName = (kind: RunProblem['kind'], r: number) => partName(kind, r);

/**
 * One answer drawn on the network: depots coloured by side or region, crossing lanes
 * emphasised, with per-region totals and the balance verdict beside it.
 */
export function PartitionView(props: { document: Pick<NetworkDocument, 'depots' | 'lanes'>; problem: RunProblem; assignment: readonly number[]; title: string; height?: number; /** For print: a still drawing, no controls or tap hints. */ still?: boolean }) {
  const { draft, projection } = useMemo(() => draftFromDocument(props.document), [props.document]);
  const [selection, setSelection] = useState<Selection>(emptySelection);
  const summary = useMemo(() => summarisePartition(props.document, props.problem, props.assignment), [props.document, props.problem, props.assignment]);
  const depotColors = useMemo(() => props.assignment.map((r) => regionColors[r % regionColors.length]), [props.assignment]);
  const crossingWord = props.problem.kind === 'maxcut' ? 'Cut weight (lanes between sides)' : 'Crossing weight (lanes between regions)';
  const picked = [...selection.depots][0];
  const pickedDepot = picked !== undefined ? props.document.depots[picked] : undefined;
  return (
    <View style={styles.wrap} testID="partition-view">
      <Label>{props.title}</Label>
      <NetworkEditor draft={draft} projection={projection} onCommit={() => undefined} selection={selection} onSelectionChange={setSelection} readOnly still={props.still} height={props.height ?? 340} depotColors={depotColors} emphasisedLanes={summary.crossingLanes} />
      {pickedDepot ? (
        <Small testID="partition-picked">
          {pickedDepot.name ?? pickedDepot.id} ({pickedDepot.id}): {regionName(props.problem.kind, props.assignment[picked])}
        </Small>
      ) : props.still ? (
        <Small>Emphasised lanes cross between {props.problem.kind === 'kway' ? 'regions' : 'sides'}.</Small>
      ) : (
        <Small>Tap a depot to see its {props.problem.kind === 'kway' ? 'region' : 'side'}. Emphasised lanes cross between {props.problem.kind === 'kway' ? 'regions' : 'sides'}.</Small>
      )}
      <View style={styles.legend} role="group" accessibilityLabel="Totals per region">
        {summary.regions.map((r) => (
          <View key={r.region} style={styles.region} testID={`region-${r.region}`}>
            <View style={[styles.swatch, { backgroundColor: regionColors[r.region % regionColors.length] }]} />
            <View style={styles.regionText}>
              <Body>{regionName(props.problem.kind, r.region)}</Body>
              <Small>
                {r.depots} depots · demand {formatValue(r.weight)} · lanes inside {formatValue(r.internalLaneWeight)}
              </Small>
            </View>
          </View>
        ))}
      </View>
      <Body testID="partition-crossing">
        {crossingWord}: {formatValue(summary.crossing)}
      </Body>
      {summary.limit !== null ? (
        <Small testID="partition-balance" style={summary.balanced ? undefined : styles.bad}>
          {summary.balanced ? 'Balanced' : 'Not balanced'}: heaviest region {formatValue(summary.heaviest)}, allowed up to {formatValue(Math.floor(summary.limit * 1000) / 1000)}.
        </Small>
      ) : null}
      {summary.emptyRegions.length > 0 ? (
        <Small testID="partition-empty">{emptyRegionNote(props.problem.kind, summary.emptyRegions)}</Small>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  legend: { gap: space.xs },
  region: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  regionText: { flexShrink: 1 },
  swatch: { width: 16, height: 16, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.ink },
  bad: { color: colors.danger },
});
