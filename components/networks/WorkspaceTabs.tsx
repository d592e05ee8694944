import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, focusRing, fonts, radius, space, TOUCH } from '../theme';

export type WorkspaceTab = { key: string; name: string; count?: number };

/**
 * The workspace's tabs as one row of equal parts that always fits the width: the count sits under
 * the name in smaller type, so long counts ("Lanes 780") never push a tab onto a second row.
 * (A wrapped row could re-wrap between a tap's press and release, and the tap was lost.) The
 * name and count are one text, so the tab's accessible name is exactly what it shows, "Lanes (780)"
 * (a separate label differing from the visible words fails WCAG 2.5.3, "Label in Name").
 */
export function WorkspaceTabs(props: { tabs: WorkspaceTab[]; current: string; onChange: (key: string) => void }) {
  return (
    <View style={styles.row} accessibilityRole="tablist">
      {props.tabs.map((t) => {
        const selected = t.key === props.current;
        return (
          <Pressable
            key={t.key}
            accessibilityRole="tab"
            // react-native-web writes aria-selected from this prop, not from accessibilityState.
            aria-selected={selected}
            onPress={() => props.onChange(t.key)}
            testID={`tab-${t.key}`}
            style={({ pressed, hovered, focused }: { pressed: boolean; hovered?: boolean; focused?: boolean }) => [
              styles.tab,
              selected ? styles.selected : (pressed || hovered) && styles.active,
              focused && styles.focused,
            ]}
          >
            <Text style={[styles.name, selected && styles.onInk]} numberOfLines={t.count === undefined ? 1 : 2}>
              {t.name}
              {t.count !== undefined ? (
                <Text style={[styles.count, selected && styles.onInk]}>{`\n(${t.count.toLocaleString('en-GB')})`}</Text>
              ) : null}
            </Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: 2, padding: 2, borderRadius: radius.md, backgroundColor: colors.surfaceSunk, alignSelf: 'stretch' },
  tab: { flex: 1, minWidth: 0, minHeight: TOUCH, paddingHorizontal: space.xs, paddingVertical: 4, borderRadius: radius.md - 2, alignItems: 'center', justifyContent: 'center' },
  selected: { backgroundColor: colors.ink },
  active: { backgroundColor: colors.surface },
  focused: focusRing,
  name: { fontFamily: fonts.semibold, fontSize: 15, lineHeight: 20, color: colors.ink, textAlign: 'center' },
  count: { fontFamily: fonts.medium, fontSize: 12, lineHeight: 16, color: colors.inkSoft },
  onInk: { color: colors.onInk },
});
