import { StyleSheet, Text, View } from 'react-native';
import { colors, space } from '../theme';
import { Label, Small } from '../ui/Text';
import { resourceRows, RESOURCE_COLUMNS } from './circuit-view';
import type { JobResult } from './types';

/** A row of cells: a table row from 1024 px, label-value lines on phones (the head row is hidden there). */
export function Row(props: { cells: string[]; head?: boolean; wide: boolean; names: string[]; testID?: string }) {
  if (!props.wide && !props.head) {
    return (
      <View style={styles.cardRow} testID={props.testID}>
        <Label>{props.cells[0]}</Label>
        {props.cells.slice(1).map((c, i) => <Small key={i}>{props.names[i + 1]}: {c}</Small>)}
      </View>
    );
  }
  if (!props.wide) return null;
  return (
    <View style={styles.tableRow} accessibilityRole={props.head ? 'header' : undefined} testID={props.testID}>
      {props.cells.map((c, i) => <Text key={i} style={[styles.cell, i === 0 ? styles.first : null, props.head ? styles.head : null]}>{c}</Text>)}
    </View>
  );
}

/**
 * Gate counts and depths of one circuit per qubit layout — the run screen's "On a real device"
 * panel and the run setup's details (before launch) show the same table.
 */
export function ResourceTable(props: { circuit: NonNullable<JobResult['circuit']>; wide: boolean; testID?: string; rowID?: (layout: string) => string }) {
  return (
    <View testID={props.testID}>
      <Row head wide={props.wide} names={RESOURCE_COLUMNS} cells={RESOURCE_COLUMNS} />
      {resourceRows(props).map((r) => (
        <Row key={r.layout} wide={props.wide} names={RESOURCE_COLUMNS} testID={props.rowID?.(r.layout)}
          cells={[r.label, r.oneQubitGates.toLocaleString('en-US'), r.twoQubitGates.toLocaleString('en-US'), r.twoQubitDepth.toLocaleString('en-US'), r.depth.toLocaleString('en-US'), r.swaps.toLocaleString('en-US')]} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  tableRow: { flexDirection: 'row', borderBottomWidth: StyleSheet.hairlineWidth, borderColor: colors.line, paddingVertical: space.xs },
  // The left padding keeps wrapped header words of neighbouring columns apart.
  cell: { flex: 1, textAlign: 'right', fontVariant: ['tabular-nums'], color: colors.ink, paddingLeft: space.sm },
  first: { flex: 2, textAlign: 'left', paddingLeft: 0 },
  head: { fontWeight: '600' },
  cardRow: { paddingVertical: space.xs, gap: 2 },
});
