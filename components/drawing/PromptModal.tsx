import { useState } from 'react';
import { KeyboardAvoidingView, Modal, Platform, Pressable, StyleSheet, View } from 'react-native';
import { colors, radius, space } from '../theme';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Heading, Small } from '../ui/Text';
import { TextField } from '../ui/TextField';

interface PromptProps {
  visible: boolean;
  title: string;
  label: string;
  initial?: string;
  hint?: string;
  confirmLabel: string;
  keyboardType?: 'default' | 'decimal-pad';
  /** A message when the text cannot be used, else null. */
  validate?: (text: string) => string | null;
  onConfirm: (text: string) => void;
  onCancel: () => void;
  testID?: string;
}

/**
 * An in-app prompt (no window.prompt: it blocks the page and does not exist on phones):
 * one text field checked by `validate` before `onConfirm` runs.
 */
export function PromptModal(props: PromptProps) {
  return (
    <Modal visible={props.visible} transparent animationType="fade" onRequestClose={props.onCancel}>
      {/* Mounted afresh at every opening, so the field starts from `initial`, never from the last text. */}
      {props.visible ? <PromptBody {...props} /> : null}
    </Modal>
  );
}

function PromptBody(props: PromptProps) {
  const [text, setText] = useState(props.initial ?? '');
  const [error, setError] = useState<string | null>(null);
  const confirm = () => {
    const problem = props.validate?.(text) ?? null;
    if (problem) return setError(problem);
    props.onConfirm(text);
  };
  return (
    <KeyboardAvoidingView behavior={Platform.OS === 'ios' ? 'padding' : undefined} style={styles.backdrop}>
      <Pressable style={StyleSheet.absoluteFill} onPress={props.onCancel} accessibilityLabel="Close" accessibilityRole="button" />
      <View style={styles.card} accessibilityViewIsModal testID={props.testID}>
        <Heading>{props.title}</Heading>
        <TextField
          label={props.label}
          value={text}
          onChangeText={(t) => {
            setText(t);
            setError(null);
          }}
          error={error ?? undefined}
          hint={props.hint}
          autoFocus
          keyboardType={props.keyboardType}
          onSubmitEditing={confirm}
          returnKeyType="done"
        />
        <View style={styles.row}>
          <Button label="Cancel" tone="secondary" onPress={props.onCancel} />
          <Button label={props.confirmLabel} onPress={confirm} />
        </View>
      </View>
    </KeyboardAvoidingView>
  );
}

/** A yes/no question in the app (leaving with unsaved changes, deleting). */
export function ConfirmModal(props: { visible: boolean; title: string; message: string; confirmLabel: string; cancelLabel?: string; danger?: boolean; busy?: boolean; error?: string | null; onConfirm: () => void; onCancel: () => void }) {
  return (
    <Modal visible={props.visible} transparent animationType="fade" onRequestClose={props.onCancel}>
      <View style={styles.backdrop}>
        <Pressable style={StyleSheet.absoluteFill} onPress={props.onCancel} accessibilityLabel="Close" accessibilityRole="button" />
        <View style={styles.card} accessibilityViewIsModal>
          <Heading>{props.title}</Heading>
          <Small style={{ color: colors.text }}>{props.message}</Small>
          {props.error ? <Notice tone="error">{props.error}</Notice> : null}
          <View style={styles.row}>
            <Button label={props.cancelLabel ?? 'Cancel'} tone="secondary" onPress={props.onCancel} />
            <Button label={props.confirmLabel} tone={props.danger ? 'danger' : 'primary'} onPress={props.onConfirm} busy={props.busy} />
          </View>
        </View>
      </View>
    </Modal>
  );
}

const styles = StyleSheet.create({
  backdrop: { flex: 1, backgroundColor: 'rgba(18,52,59,0.45)', alignItems: 'center', justifyContent: 'center', padding: space.lg },
  card: { width: '100%', maxWidth: 420, backgroundColor: colors.surface, borderRadius: radius.lg, padding: space.xl, gap: space.md },
  row: { flexDirection: 'row', justifyContent: 'flex-end', gap: space.sm, flexWrap: 'wrap' },
});
