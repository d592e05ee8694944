import { StyleSheet, View } from 'react-native';
import { colors, radius, space } from '../theme';
import { Button } from '../ui/Button';
import { Body } from '../ui/Text';

/** An inline "are you sure?" in place of the row's actions (no browser dialogs). */
export function ConfirmBar(props: { message: string; confirmLabel: string; onConfirm: () => void; onCancel: () => void; busy?: boolean; testID?: string }) {
  return (
    <View style={styles.box} accessibilityRole="alert" testID={props.testID}>
      <Body>{props.message}</Body>
      <View style={styles.actions}>
        <Button label="Cancel" tone="secondary" onPress={props.onCancel} testID={props.testID ? `${props.testID}-cancel` : undefined} />
        <Button label={props.confirmLabel} tone="danger" onPress={props.onConfirm} busy={props.busy} testID={props.testID ? `${props.testID}-confirm` : undefined} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm, padding: space.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.danger, backgroundColor: colors.dangerSoft },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, justifyContent: 'flex-end' },
});
