import { Pressable, StyleSheet, Text, View } from 'react-native';
import { ROLE_LABELS, type Role } from '../../shared/permissions';
import { colors, fonts, radius, space, TOUCH } from '../theme';

/** Roles as a row of choice pills (one selected); only the roles the caller may grant are offered. */
export function RolePicker(props: { value: Role; options: readonly Role[]; onChange: (role: Role) => void; label: string; testID?: string; disabled?: boolean }) {
  return (
    <View style={styles.row} accessibilityRole="radiogroup" accessibilityLabel={props.label} testID={props.testID}>
      {props.options.map((role) => {
        const selected = role === props.value;
        return (
          <Pressable
            key={role}
            accessibilityRole="radio"
            accessibilityLabel={ROLE_LABELS[role]}
            accessibilityState={{ selected, checked: selected, disabled: !!props.disabled }}
            aria-checked={selected}
            disabled={props.disabled}
            onPress={() => props.onChange(role)}
            style={[styles.pill, selected && styles.pillOn]}
            testID={props.testID ? `${props.testID}-${role}` : undefined}
          >
            <Text style={[styles.text, selected && styles.textOn]}>{ROLE_LABELS[role]}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

export function RoleBadge(props: { role: Role }) {
  return (
    <View style={[styles.badge, props.role === 'owner' && styles.badgeOwner]}>
      <Text style={styles.badgeText}>{ROLE_LABELS[props.role]}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  pill: { minHeight: TOUCH, paddingHorizontal: space.md, borderRadius: radius.pill, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface, alignItems: 'center', justifyContent: 'center' },
  pillOn: { backgroundColor: colors.ink, borderColor: colors.ink },
  text: { fontFamily: fonts.medium, fontSize: 14, color: colors.ink },
  textOn: { color: colors.onInk },
  badge: { alignSelf: 'flex-start', paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radius.pill, backgroundColor: colors.surfaceSunk },
  badgeOwner: { backgroundColor: colors.warnSoft },
  badgeText: { fontFamily: fonts.medium, fontSize: 12, color: colors.inkSoft },
});
