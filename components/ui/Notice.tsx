import { StyleSheet, View } from 'react-native';
import { colors, radius, space } from '../theme';
import { Body } from './Text';
import { Button } from './Button';

export type NoticeTone = 'info' | 'caution' | 'error' | 'success';

const toneStyle = {
  info: { backgroundColor: colors.surfaceSunk, borderColor: colors.line },
  caution: { backgroundColor: colors.warnSoft, borderColor: colors.signal },
  error: { backgroundColor: colors.dangerSoft, borderColor: colors.danger },
  success: { backgroundColor: colors.successSoft, borderColor: colors.success },
};

/** A boxed message; errors are announced to screen readers. */
export function Notice(props: { tone?: NoticeTone; children: React.ReactNode; testID?: string }) {
  const tone = props.tone ?? 'info';
  return (
    <View style={[styles.box, toneStyle[tone]]} accessibilityRole={tone === 'error' ? 'alert' : undefined} accessibilityLiveRegion={tone === 'error' ? 'assertive' : 'polite'} testID={props.testID}>
      {typeof props.children === 'string' ? <Body>{props.children}</Body> : props.children}
    </View>
  );
}

/** The caution shown beside results and in the shell: decision support, not a decision. */
export function DecisionSupportNote() {
  return (
    <Notice tone="caution" testID="decision-support-note">
      Results are decision support. Review them against your own knowledge of the network before acting, and handle network data under your organisation's own rules.
    </Notice>
  );
}

const styles = StyleSheet.create({
  box: { borderWidth: 1, borderRadius: radius.md, padding: space.md },
});

/** A failed query: its message and a retry button (every list and page shows the same). */
export function QueryError(props: { error: Error; onRetry: () => void }) {
  return (
    <Notice tone="error">
      <Body>{props.error.message}</Body>
      <Button label="Try again" tone="secondary" onPress={props.onRetry} />
    </Notice>
  );
}
