import { StyleSheet, Text, View } from 'react-native';
import Svg, { Circle, Line, Rect } from 'react-native-svg';
import { colors, fonts } from '../theme';

/** Spinyard's mark: two depots on either side of a cut. */
export function Wordmark({ compact = false }: { compact?: boolean }) {
  return (
    <View style={styles.row} accessibilityLabel="Spinyard" accessibilityRole="image">
      <Svg width={28} height={28} viewBox="0 0 64 64">
        <Rect x="0" y="0" width="64" height="64" rx="14" fill={compact ? colors.ink : colors.onInk} />
        <Line x1="14" y1="50" x2="50" y2="14" stroke={colors.signal} strokeWidth={5} />
        <Circle cx="20" cy="20" r="8" fill={compact ? colors.onInk : colors.ink} />
        <Circle cx="44" cy="44" r="8" fill={colors.signal} />
      </Svg>
      {!compact ? <Text style={styles.word}>Spinyard</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: 10 },
  word: { fontFamily: fonts.bold, fontSize: 19, color: colors.onInk, letterSpacing: 0.3 },
});
