import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { colors, fonts, radius, space, TOUCH } from '../theme';
import { Label, Small } from './Text';

/** A labelled input with its error beside it (errors come from the shared zod schemas). */
export function TextField(props: TextInputProps & { label: string; error?: string; hint?: string }) {
  const { label, error, hint, style, ...input } = props;
  return (
    <View style={styles.wrap}>
      <Label nativeID={`${label}-label`}>{label}</Label>
      <TextInput
        accessibilityLabel={label}
        placeholderTextColor={colors.textMuted}
        aria-invalid={!!error}
        {...input}
        style={[styles.input, error ? styles.inputError : null, style]}
      />
      {error ? (
        <Small style={styles.error} accessibilityLiveRegion="polite">
          {error}
        </Small>
      ) : hint ? (
        <Small>{hint}</Small>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  input: { minHeight: TOUCH, borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, paddingHorizontal: space.md, backgroundColor: colors.surface, fontFamily: fonts.regular, fontSize: 15, color: colors.text },
  inputError: { borderColor: colors.danger },
  error: { color: colors.danger },
});
