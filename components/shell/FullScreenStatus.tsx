import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { colors, space } from '../theme';
import { Body, Small } from '../ui/Text';
import { Button } from '../ui/Button';

/** Whole-screen loading or failure state (before the shell can render). */
export function FullScreenStatus(props: { label: string; error?: string; onRetry?: () => void }) {
  return (
    <View style={styles.root} accessibilityLiveRegion="polite">
      {props.error ? null : <ActivityIndicator color={colors.ink} accessibilityLabel={props.label} />}
      <Body>{props.label}</Body>
      {props.error ? <Small>{props.error}</Small> : null}
      {props.onRetry ? <Button label="Try again" tone="secondary" onPress={props.onRetry} /> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: space.md, backgroundColor: colors.paper, padding: space.xl },
});
