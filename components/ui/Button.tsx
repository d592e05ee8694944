import { ActivityIndicator, Pressable, StyleSheet, Text, type StyleProp, type ViewStyle } from 'react-native';
import { colors, focusRing, fonts, radius, space, TOUCH } from '../theme';

export type ButtonTone = 'primary' | 'secondary' | 'danger' | 'quiet';

export function Button(props: {
  label: string;
  onPress?: () => void;
  tone?: ButtonTone;
  busy?: boolean;
  disabled?: boolean;
  style?: StyleProp<ViewStyle>;
  testID?: string;
  accessibilityHint?: string;
}) {
  const tone = props.tone ?? 'primary';
  const inactive = props.disabled || props.busy;
  return (
    <Pressable
      accessibilityRole="button"
      accessibilityLabel={props.label}
      accessibilityHint={props.accessibilityHint}
      accessibilityState={{ disabled: !!inactive, busy: !!props.busy }}
      disabled={inactive}
      onPress={props.onPress}
      testID={props.testID}
      style={({ pressed, hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
        styles.base,
        styles[tone],
        (pressed || hovered) && !inactive && styles[`${tone}Active` as const],
        focused && styles.focused,
        inactive && styles.inactive,
        props.style,
      ]}
    >
      {props.busy ? <ActivityIndicator size="small" color={tone === 'primary' || tone === 'danger' ? colors.onInk : colors.ink} accessibilityLabel="Working" /> : null}
      <Text style={[styles.label, tone === 'primary' || tone === 'danger' ? styles.labelOnDark : styles.labelOnLight]}>{props.label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: { minHeight: TOUCH, paddingHorizontal: space.lg, borderRadius: radius.md, flexDirection: 'row', alignItems: 'center', justifyContent: 'center', gap: space.sm, borderWidth: 1, borderColor: 'transparent' },
  primary: { backgroundColor: colors.ink },
  primaryActive: { backgroundColor: colors.inkSoft },
  secondary: { backgroundColor: colors.surface, borderColor: colors.line },
  secondaryActive: { backgroundColor: colors.surfaceSunk },
  danger: { backgroundColor: colors.danger },
  dangerActive: { opacity: 0.9 },
  quiet: { backgroundColor: 'transparent' },
  quietActive: { backgroundColor: colors.surfaceSunk },
  focused: focusRing,
  inactive: { opacity: 0.55 },
  label: { fontFamily: fonts.semibold, fontSize: 15 },
  labelOnDark: { color: colors.onInk },
  labelOnLight: { color: colors.ink },
});
