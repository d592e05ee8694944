import { Children, cloneElement, isValidElement, useRef, type ReactElement } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { checkboxKeyDown, radioKeyDown, type KeyEvent } from '../ui/keys';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Body, Small } from '../ui/Text';

/** react-native-web passes onKeyDown to the element; React Native's types do not list it. */
const keyProps = (onKeyDown?: (e: KeyEvent) => void): object => (onKeyDown ? { onKeyDown } : {});

/** One option of a single choice (radio semantics), with an optional sentence under the title. */
export function ChoiceCard(props: { title: string; hint?: string; selected: boolean; onPress: () => void; testID?: string; onKeyDown?: (e: KeyEvent) => void; tabIndex?: 0 | -1; choiceRef?: (el: View | null) => void }) {
  return (
    <Pressable
      ref={props.choiceRef}
      {...keyProps(props.onKeyDown)}
      tabIndex={props.tabIndex}
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
      // WAI-ARIA APG checkbox: Space toggles (react-native-web gives Space to buttons only).
      {...keyProps((e) => checkboxKeyDown(e, props.disabled ? () => undefined : props.onPress))}
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

/**
 * A radio group of ChoiceCards with the WAI-ARIA APG keys: arrow keys move both the focus and the
 * choice to the next or previous card (wrapping); only the chosen card is in the Tab order; Space
 * chooses the focused card.
 */
export function ChoiceGroup(props: { label: string; children: ReactElement<{ selected: boolean; onPress: () => void }>[]; style?: object; testID?: string }) {
  const refs = useRef<(View | null)[]>([]);
  const cards = Children.toArray(props.children).filter(isValidElement) as ReactElement<{ selected: boolean; onPress: () => void }>[];
  const chosen = Math.max(0, cards.findIndex((c) => c.props.selected));
  return (
    <View style={props.style} accessibilityRole="radiogroup" accessibilityLabel={props.label} testID={props.testID}>
      {cards.map((card, i) =>
        cloneElement(card as ReactElement<Record<string, unknown>>, {
          tabIndex: i === chosen ? 0 : -1,
          choiceRef: (el: View | null) => { refs.current[i] = el; },
          onKeyDown: (e: KeyEvent) =>
            radioKeyDown(e, i, cards.length, (next) => {
              cards[next].props.onPress();
              (refs.current[next] as unknown as { focus?: () => void } | null)?.focus?.();
            }),
        }),
      )}
    </View>
  );
}

/** A compact segmented choice for short values (k, ansatz, optimizer). */
export function Segmented<T extends string | number>(props: { label: string; options: readonly T[]; value: T; onChange: (v: T) => void; format?: (v: T) => string; testID?: string }) {
  const refs = useRef<(View | null)[]>([]);
  const chosen = Math.max(0, props.options.indexOf(props.value));
  const move = (next: number) => {
    props.onChange(props.options[next]);
    (refs.current[next] as unknown as { focus?: () => void } | null)?.focus?.();
  };
  return (
    <View style={styles.segWrap} accessibilityRole="radiogroup" accessibilityLabel={props.label} testID={props.testID}>
      <Small style={styles.segLabel}>{props.label}</Small>
      <View style={styles.seg}>
        {props.options.map((o, i) => (
          <Pressable
            key={String(o)}
            ref={(el) => { refs.current[i] = el; }}
            tabIndex={i === chosen ? 0 : -1}
            {...keyProps((e) => radioKeyDown(e, i, props.options.length, move))}
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
