import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { useRouter } from 'expo-router';
import type { Me } from '../../shared/schemas/auth';
import { ROLE_LABELS } from '../../shared/permissions';
import { useSwitchOrganisationMutation } from '../queries/auth';
import { colors, fonts, radius, space, TOUCH } from '../theme';

/** The header's organisation switcher; shown only to people in more than one organisation. */
export function OrgSwitcher(props: { me: Me }) {
  const router = useRouter();
  const [open, setOpen] = useState(false);
  const switchOrg = useSwitchOrganisationMutation();
  if (props.me.organisations.length < 2) return null;
  return (
    <View style={styles.wrap}>
      <Pressable accessibilityRole="button" accessibilityLabel="Switch organisation" accessibilityState={{ expanded: open }} onPress={() => setOpen(!open)} style={styles.button} testID="org-switcher">
        <Text style={styles.buttonText}>Switch</Text>
      </Pressable>
      {open ? (
        <View style={styles.menu} accessibilityRole="menu" testID="org-switcher-menu">
          {props.me.organisations.map((o) => {
            const current = o.id === props.me.current?.id;
            return (
              <Pressable
                key={o.id}
                accessibilityRole="menuitem"
                accessibilityLabel={`${o.name}, ${ROLE_LABELS[o.role]}${current ? ', current' : ''}`}
                accessibilityState={{ selected: current, disabled: switchOrg.isPending }}
                style={[styles.item, current && styles.itemOn]}
                onPress={() => {
                  setOpen(false);
                  if (!current) switchOrg.mutate(o.id, { onSuccess: () => router.replace('/networks') });
                }}
              >
                <Text style={styles.itemName} numberOfLines={1}>
                  {o.name}
                </Text>
                <Text style={styles.itemRole}>{ROLE_LABELS[o.role]}</Text>
              </Pressable>
            );
          })}
          {switchOrg.error ? <Text style={styles.error}>{switchOrg.error.message}</Text> : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { position: 'relative', zIndex: 10 },
  button: { minHeight: TOUCH, minWidth: TOUCH, paddingHorizontal: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, alignItems: 'center', justifyContent: 'center' },
  buttonText: { fontFamily: fonts.semibold, fontSize: 14, color: colors.ink },
  menu: { position: 'absolute', top: TOUCH + space.xs, right: 0, width: 280, backgroundColor: colors.surface, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, paddingVertical: space.xs, shadowColor: '#000', shadowOpacity: 0.12, shadowRadius: 12, shadowOffset: { width: 0, height: 4 } },
  item: { minHeight: TOUCH, paddingHorizontal: space.md, paddingVertical: space.sm, justifyContent: 'center' },
  itemOn: { backgroundColor: colors.surfaceSunk },
  itemName: { fontFamily: fonts.medium, fontSize: 15, color: colors.text },
  itemRole: { fontFamily: fonts.regular, fontSize: 12, color: colors.textMuted },
  error: { color: colors.danger, padding: space.sm, fontFamily: fonts.regular, fontSize: 13 },
});
