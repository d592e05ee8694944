import { useState } from 'react';
import { Modal, Pressable, StyleSheet, Text, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';
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
  const insets = useSafeAreaInsets();
  if (props.me.organisations.length < 2) return null;
  return (
    <View style={styles.wrap}>
      <Pressable accessibilityRole="button" accessibilityLabel="Switch organisation" accessibilityState={{ expanded: open }} onPress={() => setOpen(!open)} style={styles.button} testID="org-switcher">
        <Text style={styles.buttonText}>Switch</Text>
      </Pressable>
      {/* A modal layer, so the list sits above the page (the header is not the top layer). */}
      <Modal visible={open} transparent animationType="none" onRequestClose={() => setOpen(false)}>
        <Pressable style={styles.backdrop} accessibilityRole="button" accessibilityLabel="Close the organisation list" onPress={() => setOpen(false)} />
        <View style={[styles.menu, { top: insets.top + TOUCH + space.md }]} accessibilityRole="menu" testID="org-switcher-menu">
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
        </View>
      </Modal>
      {switchOrg.error ? <Text style={styles.error}>{switchOrg.error.message}</Text> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { alignItems: 'flex-end' },
  backdrop: { position: 'absolute', top: 0, right: 0, bottom: 0, left: 0, backgroundColor: 'rgba(18,52,59,0.18)' },
  button: { minHeight: TOUCH, minWidth: TOUCH, paddingHorizontal: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, alignItems: 'center', justifyContent: 'center' },
  buttonText: { fontFamily: fonts.semibold, fontSize: 14, color: colors.ink },
  menu: { position: 'absolute', right: space.lg, width: 300, maxWidth: '90%', backgroundColor: colors.surface, borderRadius: radius.md, borderWidth: 1, borderColor: colors.line, paddingVertical: space.xs, shadowColor: '#000', shadowOpacity: 0.12, shadowRadius: 12, shadowOffset: { width: 0, height: 4 } },
  item: { minHeight: TOUCH, paddingHorizontal: space.md, paddingVertical: space.sm, justifyContent: 'center' },
  itemOn: { backgroundColor: colors.surfaceSunk },
  itemName: { fontFamily: fonts.medium, fontSize: 15, color: colors.text },
  itemRole: { fontFamily: fonts.regular, fontSize: 12, color: colors.textMuted },
  error: { color: colors.danger, padding: space.sm, fontFamily: fonts.regular, fontSize: 13 },
});
