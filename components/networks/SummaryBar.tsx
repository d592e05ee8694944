import { StyleSheet, View } from 'react-native';
import type { NetworkSummary } from '../../shared/schemas/networks';
import { colors, radius, space } from '../theme';
import { Label, Small } from '../ui/Text';
import { formatVolume } from './format';

const NBSP = '\u00a0';

/** Depots, lanes, total volume, components and degree range of the version on screen. */
export function SummaryBar(props: { summary: NetworkSummary; testID?: string; /** One line of text (phones: keeps the drawing near the top). */ compact?: boolean }) {
  const s = props.summary;
  const items: [string, string][] = [
    ['Depots', formatVolume(s.depots)],
    ['Lanes', formatVolume(s.lanes)],
    ['Total volume', formatVolume(s.totalVolume)],
    ['Components', formatVolume(s.components)],
    ['Degree', s.depots === 0 ? '—' : s.minDegree === s.maxDegree ? String(s.minDegree) : `${s.minDegree}–${s.maxDegree}`],
  ];
  if (props.compact) {
    const split = s.components > 1;
    return (
      <Small testID={props.testID ?? 'network-summary'} style={styles.line} role="group" accessibilityLabel={items.map(([k, v]) => `${k} ${v}`).join(', ') + (split ? `; ${s.components} separate parts` : '')}>
        {items.map(([k, v], i) => (
          // Each item is one unbreakable unit and the dot stays at the end of a line: a phone
          // wraps between items, never inside one or before its separator.
          <Small key={k} style={styles.line}>
            {i > 0 ? `${NBSP}· ` : ''}
            {k.replace(/ /g, NBSP)}{NBSP}<Label style={[styles.inline, k === 'Components' && split && styles.warn]} testID={`summary-${k.toLowerCase().replace(/\s/g, '-')}`}>{v.replace(/ /g, NBSP)}</Label>
          </Small>
        ))}
      </Small>
    );
  }
  return (
    <View style={styles.row} testID={props.testID ?? 'network-summary'} role="group" accessibilityLabel={items.map(([k, v]) => `${k} ${v}`).join(', ')}>
      {items.map(([k, v]) => {
        // Several components are worth a colour, not an extra line: the canvas below must not
        // jump while someone is drawing.
        const split = k === 'Components' && s.components > 1;
        return (
          <View key={k} style={styles.item} role={split ? 'group' : undefined} accessibilityLabel={split ? `${s.components} separate parts: depots in different parts share no lanes` : undefined}>
            <Small>{k}</Small>
            <Label style={[styles.value, split && styles.warn]} testID={`summary-${k.toLowerCase().replace(/\s/g, '-')}`}>{v}</Label>
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  item: { minWidth: 92, flexGrow: 1, paddingVertical: space.sm, paddingHorizontal: space.md, borderRadius: radius.md, backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line },
  value: { fontSize: 17, lineHeight: 24, color: colors.text },
  warn: { color: colors.signalDeep },
  line: { color: colors.textMuted },
  inline: { color: colors.text, fontSize: 14 },
});
