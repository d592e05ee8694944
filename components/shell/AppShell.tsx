import { Pressable, StyleSheet, Text, View, useWindowDimensions } from 'react-native';
import { Link, usePathname } from 'expo-router';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
import { can, type Role } from '../../shared/permissions';
import { colors, fonts, space, TOUCH, WIDE_BREAKPOINT } from '../theme';
import { destinations } from './destinations';
import { Glyph } from './Glyph';
import { Wordmark } from './Wordmark';

/**
 * The signed-in frame: a header with the organisation name, then the page, with the five
 * destinations as a bottom bar on phones and as a side rail on wide screens (≥ 1024 px).
 */
export function AppShell(props: { organisationName: string; role: Role | null; headerRight?: React.ReactNode; children: React.ReactNode }) {
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const insets = useSafeAreaInsets();
  const pathname = usePathname();
  const visible = destinations.filter((d) => !d.needs || can(props.role, d.needs));
  const isActive = (href: string) => pathname === href || pathname.startsWith(`${href}/`);

  const header = (
    <View style={[styles.header, { paddingTop: insets.top + space.sm }]} role="banner" testID="shell-header">
      {!wide ? <Wordmark compact /> : null}
      <View style={styles.orgBox}>
        <Text style={styles.orgLabel}>Organisation</Text>
        <Text style={styles.orgName} numberOfLines={1} testID="shell-org-name">
          {props.organisationName}
        </Text>
      </View>
      {props.headerRight}
    </View>
  );

  if (wide) {
    return (
      <View style={styles.wideRoot}>
        <View style={styles.rail} role="navigation" accessibilityLabel="Main" testID="shell-rail">
          <View style={styles.railBrand}>
            <Wordmark />
          </View>
          {visible.map((d) => (
            <Link key={d.href} href={d.href} asChild>
              <Pressable accessibilityRole="link" accessibilityLabel={d.label} aria-current={isActive(d.href) ? 'page' : undefined} style={StyleSheet.flatten([styles.railItem, isActive(d.href) && styles.railItemActive])} testID={`nav-${d.glyph}`}>
                <Glyph name={d.glyph} color={isActive(d.href) ? colors.ink : colors.onInk} />
                <Text style={[styles.railText, isActive(d.href) && styles.railTextActive]}>{d.label}</Text>
              </Pressable>
            </Link>
          ))}
        </View>
        <View style={styles.main}>
          {header}
          <View style={styles.page}>{props.children}</View>
        </View>
      </View>
    );
  }

  return (
    <View style={styles.narrowRoot}>
      {header}
      <View style={styles.page}>{props.children}</View>
      <View style={[styles.bar, { paddingBottom: Math.max(insets.bottom, space.xs) }]} role="navigation" accessibilityLabel="Main" testID="shell-tabbar">
        {visible.map((d) => (
          <Link key={d.href} href={d.href} asChild>
            <Pressable accessibilityRole="link" accessibilityLabel={d.label} aria-current={isActive(d.href) ? 'page' : undefined} style={styles.barItem} testID={`nav-${d.glyph}`}>
              {/* The current destination lights a signal lamp on the bar's top edge. */}
              <View style={[styles.barLamp, isActive(d.href) && styles.barLampOn]} testID={isActive(d.href) ? 'nav-lamp' : undefined} />
              <Glyph name={d.glyph} color={isActive(d.href) ? colors.ink : colors.inkSoft} />
              <Text style={[styles.barText, isActive(d.href) && styles.barTextActive]}>{d.label}</Text>
            </Pressable>
          </Link>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.paper },
  narrowRoot: { flex: 1, backgroundColor: colors.paper },
  main: { flex: 1 },
  page: { flex: 1 },
  header: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingHorizontal: space.lg, paddingBottom: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line, backgroundColor: colors.surface },
  orgBox: { flex: 1, minWidth: 0 },
  orgLabel: { fontFamily: fonts.medium, fontSize: 11, letterSpacing: 0.6, textTransform: 'uppercase', color: colors.textMuted },
  orgName: { fontFamily: fonts.semibold, fontSize: 16, color: colors.text },
  rail: { width: 220, backgroundColor: colors.ink, paddingVertical: space.lg, paddingHorizontal: space.sm, gap: space.xs },
  railBrand: { paddingHorizontal: space.sm, paddingBottom: space.lg },
  railItem: { minHeight: TOUCH, flexDirection: 'row', alignItems: 'center', gap: space.md, paddingHorizontal: space.md, borderRadius: 10 },
  railItemActive: { backgroundColor: colors.signal },
  railText: { fontFamily: fonts.medium, fontSize: 15, color: colors.onInk },
  railTextActive: { color: colors.ink, fontFamily: fonts.semibold },
  bar: { flexDirection: 'row', borderTopWidth: 1, borderTopColor: colors.line, backgroundColor: colors.surface },
  barItem: { flex: 1, minHeight: 56, alignItems: 'center', justifyContent: 'center', gap: 2, paddingTop: space.xs },
  // A squared strip over the bar's top border: ≥ 3:1 against the surface (SC 1.4.11), with the
  // label's weight and aria-current it marks the current destination without relying on hue.
  barLamp: { position: 'absolute', top: -1, left: space.md, right: space.md, height: 4 },
  barLampOn: { backgroundColor: colors.signalDeep },
  barText: { fontFamily: fonts.medium, fontSize: 11, color: colors.inkSoft },
  barTextActive: { color: colors.ink, fontFamily: fonts.semibold },
});
