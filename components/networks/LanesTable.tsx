import { memo, useEffect, useState } from 'react';
import { Pressable, StyleSheet, TextInput, View } from 'react-native';
import type { Lane } from '../../shared/engine/network/types';
import { parseVolume } from '../drawing/volume';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Button } from '../ui/Button';
import { Body, Small } from '../ui/Text';
import { tableStyles as styles } from './DepotsTable';

const PAGE = 100;

/** A lane row's accessible name: its visible text, from then to, nothing before it. */
export const laneName = (l: Pick<Lane, 'from' | 'to'>) => `${l.from} ${l.to}`;

/** A volume typed in place: checked with the shared rule on blur/enter, the error shown beside it. */
const VolumeCell = memo(function VolumeCell(props: { index: number; lane: Lane; readOnly: boolean; onChange: (index: number, weight: number) => void }) {
  const [text, setText] = useState(String(props.lane.weight));
  const [error, setError] = useState<string | null>(null);
  useEffect(() => {
    setText(String(props.lane.weight));
    setError(null);
  }, [props.lane.weight]);
  if (props.readOnly) return <Body style={[styles.cell, styles.num]}>{props.lane.weight}</Body>;
  const commit = () => {
    const v = parseVolume(text);
    if (typeof v === 'string') return setError(v);
    setError(null);
    if (v !== props.lane.weight) props.onChange(props.index, v);
  };
  const label = `Volume of lane ${props.lane.from}–${props.lane.to}`;
  return (
    <View style={cell.wrap}>
      <TextInput
        value={text}
        onChangeText={(t) => {
          setText(t);
          if (error) setError(null);
        }}
        onBlur={commit}
        onSubmitEditing={commit}
        keyboardType="decimal-pad"
        accessibilityLabel={label}
        aria-invalid={!!error}
        style={[cell.input, error ? cell.inputError : null]}
        testID={`lane-volume-${props.index}`}
      />
      {error ? (
        <Small style={cell.error} accessibilityLiveRegion="polite" testID={`lane-volume-error-${props.index}`}>
          {error}
        </Small>
      ) : null}
    </View>
  );
});

/**
 * Lanes of the version on screen with their volumes edited in place (each change becomes an undo
 * step of the draft; Save writes a new version). Pressing a row selects the lane in the drawing.
 */
export function LanesTable(props: { lanes: readonly Lane[]; selected: ReadonlySet<number>; onSelect: (index: number) => void; onWeightChange: (index: number, weight: number) => void; readOnly?: boolean }) {
  const [shown, setShown] = useState(PAGE);
  const furthest = Math.max(-1, ...props.selected);
  useEffect(() => {
    if (furthest >= shown) setShown(Math.ceil((furthest + 1) / PAGE) * PAGE);
  }, [furthest, shown]);
  if (props.lanes.length === 0) return <Small>No lanes yet. In the drawing, drag from one depot to another to add one.</Small>;
  return (
    <View role="group" accessibilityLabel="Lanes" testID="lanes-table">
      <View style={[styles.row, styles.head]}>
        <Small style={[styles.cell, styles.grow]}>From</Small>
        <Small style={[styles.cell, styles.grow]}>To</Small>
        <Small style={[styles.cell, styles.num]}>Volume</Small>
      </View>
      {props.lanes.slice(0, shown).map((l, e) => {
        const selected = props.selected.has(e);
        return (
          <View key={`${e}:${l.from}:${l.to}`} style={[styles.row, selected && styles.selected]} testID={`lane-row-${e}`}>
            {/* Named by exactly what it shows (WCAG 2.1 SC 2.5.3 Label in Name): "A C", the ends as read under From and To. */}
            <Pressable style={[styles.grow, local.pick]} onPress={() => props.onSelect(e)} accessibilityRole="button" accessibilityLabel={laneName(l)} accessibilityState={{ selected }} aria-pressed={selected}>
              <Body numberOfLines={1} style={[styles.cell, styles.grow, styles.mono]}>{l.from}</Body>
              <Body numberOfLines={1} style={[styles.cell, styles.grow, styles.mono]}>{l.to}</Body>
            </Pressable>
            <VolumeCell index={e} lane={l} readOnly={!!props.readOnly} onChange={props.onWeightChange} />
          </View>
        );
      })}
      {shown < props.lanes.length ? <Button label={`Show ${Math.min(PAGE, props.lanes.length - shown)} more of ${props.lanes.length - shown}`} tone="quiet" onPress={() => setShown((s) => s + PAGE)} /> : null}
    </View>
  );
}

const local = StyleSheet.create({ pick: { flex: 4, flexDirection: 'row', alignItems: 'center', minHeight: TOUCH, gap: space.sm } });
const cell = StyleSheet.create({
  wrap: { flex: 2, alignItems: 'flex-end', paddingVertical: space.xs },
  input: { minHeight: TOUCH, minWidth: 84, maxWidth: 140, borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, paddingHorizontal: space.sm, textAlign: 'right', fontFamily: fonts.regular, fontSize: 15, color: colors.text, backgroundColor: colors.surface },
  inputError: { borderColor: colors.danger },
  error: { color: colors.danger, textAlign: 'right', maxWidth: 220 },
});
