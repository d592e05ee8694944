import { ScrollView, StyleSheet, View } from 'react-native';
import { colors, space } from '../theme';
import { AuthBrand } from '../shell/AuthBrand';

/** Signed-out pages: a centred column on the brand background. */
export function AuthFrame(props: { children: React.ReactNode }) {
  return (
    <ScrollView contentContainerStyle={styles.root}>
      <View style={styles.column}>
        <AuthBrand />
        {props.children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  root: { flexGrow: 1, backgroundColor: colors.ink, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  column: { width: '100%', maxWidth: 420, gap: space.lg },
});
