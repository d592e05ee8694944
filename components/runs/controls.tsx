import { Pressable, StyleSheet, View } from 'react-native';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Body, Small } from '../ui/Text';

/** One option of a single choice (radio semantics), with an optional sentence under the title. */
export function ChoiceCard(props: { title: string; hint?: string; selected: boolean; onPress: () => void; testID?: string }) {
  return (
    <Pressable
      accessibilityRole="radio"
      accessibilityLabel={props.title}
      accessibilityHint={props.hint}
      accessibilityState={{ checked: props.selected }}
      aria-checked={props.selected}
      onPress={props.onPress}
      style={[styles.choice, props.selected && styles.choiceOn]}
      testID={props.testID}
    >
      <View style={[styles.dot, props.selected && styles.dotOn]} />
      <View style={styles.text}>
        <Body style={styles.title}>{props.title}</Body>
        {props.hint ? <Small>{props.hint}</Small> : null}
      </View>
    </Pressable>
  );
}

/** A tick box row. */
export function CheckRow(props: { title: string; hint?: string; checked: boolean; onPress: () => void; disabled?: boolean; testID?: string; accessibilityLabel?: string }) {
  return (
    <Pressable
      accessibilityRole="checkbox"
      accessibilityLabel={props.accessibilityLabel ?? props.title}
      accessibilityHint={props.hint}
      accessibilityState={{ checked: props.checked, disabled: !!props.disabled }}
      aria-checked={props.checked}
      disabled={props.disabled}
      onPress={props.onPress}
      style={[styles.check, props.disabled && styles.disabled]}
      testID={props.testID}
    >
      <View style={[styles.box, props.checked && styles.boxOn]}>{props.checked ? <Body style={styles.tick}>✓</Body> : null}</View>
      <View style={styles.text}>
        <Body style={styles.title}>{props.title}</Body>
        {props.hint ? <Small>{props.hint}</Small> : null}
      </View>
    </Pressable>
  );
}

/** A compact segmented choice for short values (k, ansatz, optimizer). */
export function Segmented<T extends string | number>(props: { label: string; options: readonly T[]; value: T; onChange: (v: T) => void; format?: (v: T) => string; testID?: string }) {
  return (
    <View style={styles.segWrap} accessibilityRole="radiogroup" accessibilityLabel={props.label} testID={props.testID}>
      <Small style={styles.segLabel}>{props.label}</Small>
      <View style={styles.seg}>
        {props.options.map((o) => (
          <Pressable
            key={String(o)}
            accessibilityRole="radio"
            accessibilityLabel={`${props.label}: ${props.format ? props.format(o) : String(o)}`}
            accessibilityState={{ checked: o === props.value }}
            aria-checked={o === props.value}
            onPress={() => props.onChange(o)}
            style={[styles.segItem, o === props.value && styles.segItemOn]}
          >
            <Body style={[styles.segText, o === props.value && styles.segTextOn]}>{props.format ? props.format(o) : String(o)}</Body>
          </Pressable>
        ))}
      </View>
    </View>
  );
}

/** A labelled progress bar (0…1). */
export function ProgressBar(props: { fraction: number; label: string; tone?: 'ink' | 'success' | 'danger' | 'muted'; testID?: string }) {
  const f = Math.max(0, Math.min(1, Number.isFinite(props.fraction) ? props.fraction : 0));
  const fill = props.tone === 'success' ? colors.success : props.tone === 'danger' ? colors.danger : props.tone === 'muted' ? colors.line : colors.ink;
  return (
    <View
      style={styles.track}
      accessibilityRole="progressbar"
      accessibilityLabel={props.label}
      accessibilityValue={{ min: 0, max: 100, now: Math.round(f * 100) }}
      aria-valuenow={Math.round(f * 100)}
      testID={props.testID}
    >
      <View style={[styles.fill, { width: `${f * 100}%`, backgroundColor: fill }]} />
    </View>
  );
}

const styles = StyleSheet.create({
  choice: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start', padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface, minHeight: TOUCH },
  choiceOn: { borderColor: colors.ink, borderWidth: 2, backgroundColor: colors.surfaceSunk },
  dot: { width: 20, height: 20, borderRadius: 10, borderWidth: 2, borderColor: colors.inkSoft, marginTop: 2 },
  dotOn: { borderColor: colors.ink, backgroundColor: colors.ink },
  text: { flex: 1, gap: 2 },
  title: { fontFamily: fonts.semibold },
  check: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start', paddingVertical: space.sm, minHeight: TOUCH },
  disabled: { opacity: 0.5 },
  box: { width: 24, height: 24, borderRadius: radius.sm, borderWidth: 2, borderColor: colors.inkSoft, alignItems: 'center', justifyContent: 'center', marginTop: 1 },
  boxOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  tick: { color: colors.onInk, fontFamily: fonts.bold, lineHeight: 20 },
  segWrap: { gap: space.xs },
  segLabel: { fontFamily: fonts.medium, color: colors.inkSoft },
  seg: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  segItem: { minHeight: TOUCH, minWidth: TOUCH, paddingHorizontal: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface, alignItems: 'center', justifyContent: 'center' },
  segItemOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  segText: { fontFamily: fonts.medium },
  segTextOn: { color: colors.onInk },
  track: { height: 10, borderRadius: radius.pill, backgroundColor: colors.surfaceSunk, overflow: 'hidden', borderWidth: 1, borderColor: colors.line },
  fill: { height: '100%', borderRadius: radius.pill },
});
