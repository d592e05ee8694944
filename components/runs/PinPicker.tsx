import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { NetworkEditor } from '../drawing/NetworkEditor';
import { draftFromDocument, emptySelection, type Selection } from '../drawing/draft';
import type { NetworkDocument } from '../../shared/engine/network/types';
import type { ProblemKind } from '../../shared/engine/problem/types';
import { colors, radius, regionColors, space, TOUCH } from '../theme';
import { Small } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { Segmented } from './controls';
import { regionName } from './PartitionView';
import { cyclePin } from './setup';

/**
 * Pins by tapping depots on the drawing: each tap moves the depot to the next side or region,
 * then back to free. Pinned depots are listed under the drawing, each removable with one tap.
 */
export function PinPicker(props: { document: Pick<NetworkDocument, 'depots' | 'lanes'>; kind: ProblemKind; parts: number; pins: Record<string, number>; onChange: (pins: Record<string, number>) => void }) {
  const { draft, projection } = useMemo(() => draftFromDocument(props.document), [props.document]);
  const depotColors = useMemo(() => props.document.depots.map((d) => (props.pins[d.id] !== undefined ? regionColors[props.pins[d.id] % regionColors.length] : undefined)), [props.document, props.pins]);
  const onSelectionChange = (s: Selection) => {
    const tapped = [...s.depots][0];
    if (tapped === undefined) return;
    props.onChange(cyclePin(props.pins, props.document.depots[tapped].id, props.parts));
  };
  const pinned = Object.entries(props.pins);
  const name = (id: string) => props.document.depots.find((d) => d.id === id)?.name ?? id;
  return (
    <View style={styles.wrap} testID="pin-picker">
      <NetworkEditor draft={draft} projection={projection} onCommit={() => undefined} selection={emptySelection} onSelectionChange={onSelectionChange} readOnly height={300} depotColors={depotColors} />
      <Small>Tap a depot to pin it to {props.kind === 'kway' ? `${regionName('kway', 0)}, ${regionName('kway', 1)}, …` : `${regionName(props.kind, 0)}, then ${regionName(props.kind, 1)}`}; tap again to move it on, then to free it. Or pin from the list below (keyboard: Tab to a depot, arrow keys to choose).</Small>
      <PinList {...props} />
      {pinned.length > 0 ? (
        <View style={styles.chips}>
          {pinned.map(([id, part]) => (
            <Pressable key={id} accessibilityRole="button" accessibilityLabel={`Unpin ${name(id)} (${regionName(props.kind, part)})`} onPress={() => { const next = { ...props.pins }; delete next[id]; props.onChange(next); }} style={[styles.chip, { borderColor: regionColors[part % regionColors.length] }]} testID={`pin-${id}`}>
              <View style={[styles.swatch, { backgroundColor: regionColors[part % regionColors.length] }]} />
              <Small style={styles.chipText}>{name(id)} → {regionName(props.kind, part)} ✕</Small>
            </Pressable>
          ))}
        </View>
      ) : (
        <Small>No pins: every depot is free to go either way.</Small>
      )}
    </View>
  );
}

const LIST_ROWS = 8;
type PinChoice = 'free' | number;

/**
 * The keyboard way to pin (and the way for depots too close to tap): find a depot by name or id,
 * then choose Free or a side/region in its radio group.
 */
function PinList(props: { document: Pick<NetworkDocument, 'depots'>; kind: ProblemKind; parts: number; pins: Record<string, number>; onChange: (pins: Record<string, number>) => void }) {
  const [find, setFind] = useState('');
  const q = find.trim().toLowerCase();
  const matches = props.document.depots.filter((d) => !q || d.id.toLowerCase().includes(q) || (d.name ?? '').toLowerCase().includes(q));
  const options: PinChoice[] = ['free', ...Array.from({ length: props.parts }, (_, p) => p)];
  const set = (id: string, choice: PinChoice) => {
    const next = { ...props.pins };
    if (choice === 'free') delete next[id];
    else next[id] = choice;
    props.onChange(next);
  };
  return (
    <View style={styles.list} testID="pin-list">
      <TextField label="Find a depot to pin" value={find} onChangeText={setFind} placeholder="name or id" autoCapitalize="none" testID="pin-find" />
      {matches.slice(0, LIST_ROWS).map((d) => (
        <Segmented<PinChoice>
          key={d.id}
          label={d.name ? `${d.name} (${d.id})` : d.id}
          options={options}
          value={props.pins[d.id] ?? 'free'}
          onChange={(c) => set(d.id, c)}
          format={(c) => (c === 'free' ? 'Free' : regionName(props.kind, c))}
          testID={`pin-row-${d.id}`}
        />
      ))}
      {matches.length > LIST_ROWS ? <Small>{matches.length - LIST_ROWS} more — type part of a name or id to find them.</Small> : null}
      {matches.length === 0 ? <Small>No depot name or id contains “{find.trim()}”.</Small> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  wrap: { gap: space.sm },
  chips: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: { flexDirection: 'row', alignItems: 'center', gap: space.xs, minHeight: TOUCH, paddingHorizontal: space.md, borderRadius: radius.pill, borderWidth: 2, backgroundColor: colors.surface },
  swatch: { width: 12, height: 12, borderRadius: 6 },
  chipText: { color: colors.text },
});
