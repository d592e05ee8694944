import { StyleSheet, View } from 'react-native';
import Svg, { Circle, Line } from 'react-native-svg';
import { colors, space } from '../theme';
import { Body, Heading } from './Text';

/** What a screen shows when there is nothing yet: a small drawing, a sentence, the next actions. */
export function EmptyState(props: { title: string; message: string; children?: React.ReactNode; testID?: string }) {
  return (
    <View style={styles.wrap} testID={props.testID}>
      <Svg width={96} height={64} viewBox="0 0 96 64" aria-hidden>
        <Line x1="16" y1="44" x2="48" y2="16" stroke={colors.line} strokeWidth={3} />
        <Line x1="48" y1="16" x2="80" y2="44" stroke={colors.line} strokeWidth={3} strokeDasharray="6 5" />
        <Circle cx="16" cy="44" r="9" fill={colors.surface} stroke={colors.ink} strokeWidth={3} />
        <Circle cx="48" cy="16" r="9" fill={colors.signal} />
        <Circle cx="80" cy="44" r="9" fill={colors.surface} stroke={colors.ink} strokeWidth={3} />
      </Svg>
      <Heading style={styles.center}>{props.title}</Heading>
      <Body style={[styles.center, styles.muted]}>{props.message}</Body>
      {props.children ? <View style={styles.actions}>{props.children}</View> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { alignItems: 'center', paddingVertical: space.xxl, paddingHorizontal: space.lg, gap: space.md },
  center: { textAlign: 'center' },
  muted: { color: colors.textMuted, maxWidth: 420 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, justifyContent: 'center', marginTop: space.sm },
});
