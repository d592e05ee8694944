import { useEffect, useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import type { Depot, Lane } from '../../shared/engine/network/types';
import { colors, space, TOUCH } from '../theme';
import { Button } from '../ui/Button';
import { Body, Small } from '../ui/Text';
import { formatVolume } from './format';

const PAGE = 100;

/**
 * Depots of the version on screen: id, name, position, weight and how many lanes each has.
 * Pressing a row selects the depot (the drawing highlights it); rows selected elsewhere are
 * highlighted here and scrolled into the shown range.
 */
export function DepotsTable(props: { depots: readonly Depot[]; lanes: readonly Lane[]; selected: ReadonlySet<number>; onSelect: (index: number) => void; wide: boolean }) {
  const [shown, setShown] = useState(PAGE);
  const degree = useMemo(() => {
    const count = new Map<string, number>();
    for (const l of props.lanes) {
      count.set(l.from, (count.get(l.from) ?? 0) + 1);
      count.set(l.to, (count.get(l.to) ?? 0) + 1);
    }
    return count;
  }, [props.lanes]);
  const furthest = Math.max(-1, ...props.selected);
  useEffect(() => {
    if (furthest >= shown) setShown(Math.ceil((furthest + 1) / PAGE) * PAGE);
  }, [furthest, shown]);
  if (props.depots.length === 0) return <Small>No depots yet. Tap the drawing to add one.</Small>;
  const cols = props.wide ? ['Id', 'Name', 'Latitude', 'Longitude', 'Weight', 'Lanes'] : ['Depot', 'Weight', 'Lanes'];
  return (
    <View role="group" accessibilityLabel="Depots" testID="depots-table">
      <View style={[styles.row, styles.head]}>
        {cols.map((c, k) => (
          <Small key={c} style={[styles.cell, props.wide ? (k === 0 ? styles.idCol : k === 1 ? styles.nameCol : styles.num) : k === 0 ? styles.grow : styles.num]}>{c}</Small>
        ))}
      </View>
      {props.depots.slice(0, shown).map((d, i) => {
        const selected = props.selected.has(i);
        return (
          <Pressable
            key={d.id}
            onPress={() => props.onSelect(i)}
            accessibilityRole="button"
            accessibilityState={{ selected }}
            aria-pressed={selected}
            style={[styles.row, selected && styles.selected]}
            testID={`depot-row-${d.id}`}
          >
            {props.wide ? (
              <>
                <Body style={[styles.cell, styles.idCol, styles.mono]} numberOfLines={1}>{d.id}</Body>
                <Body style={[styles.cell, styles.nameCol]} numberOfLines={1}>{d.name ?? '—'}</Body>
                <Body style={[styles.cell, styles.num]}>{d.lat ?? '—'}</Body>
                <Body style={[styles.cell, styles.num]}>{d.lon ?? '—'}</Body>
              </>
            ) : (
              <View style={[styles.cell, styles.grow]}>
                <Body numberOfLines={1}>{d.name ?? d.id}</Body>
                {d.name ? <Small numberOfLines={1}>{d.id}</Small> : null}
              </View>
            )}
            <Body style={[styles.cell, styles.num]}>{formatVolume(d.weight ?? 1)}</Body>
            <Body style={[styles.cell, styles.num]}>{degree.get(d.id) ?? 0}</Body>
          </Pressable>
        );
      })}
      {shown < props.depots.length ? <Button label={`Show ${Math.min(PAGE, props.depots.length - shown)} more of ${props.depots.length - shown}`} tone="quiet" onPress={() => setShown((s) => s + PAGE)} /> : null}
    </View>
  );
}

export const tableStyles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', minHeight: TOUCH, borderBottomWidth: 1, borderBottomColor: colors.line, paddingHorizontal: space.sm, gap: space.sm },
  head: { minHeight: 32, borderBottomColor: colors.inkSoft },
  selected: { backgroundColor: colors.signalSoft },
  cell: { paddingVertical: space.xs },
  grow: { flex: 2, minWidth: 0 },
  idCol: { flex: 1.2, minWidth: 0 },
  nameCol: { flex: 3, minWidth: 0 },
  num: { flex: 1, textAlign: 'right', fontVariant: ['tabular-nums'] },
  mono: { fontFamily: 'monospace', fontSize: 13 },
});
const styles = tableStyles;
