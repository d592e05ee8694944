import { Redirect, Slot } from 'expo-router';
import { ScrollView, StyleSheet, View } from 'react-native';
import { colors, space } from '../../components/theme';
import { useMeQuery } from '../../components/queries/auth';
import { AuthBrand } from '../../components/shell/AuthBrand';

/** Signed-out pages: a centred card on the brand background; signed-in visitors go to the app. */
export default function AuthLayout() {
  const me = useMeQuery();
  if (me.data) return <Redirect href="/networks" />;
  return (
    <ScrollView contentContainerStyle={styles.root}>
      <View style={styles.column}>
        <AuthBrand />
        <Slot />
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  root: { flexGrow: 1, backgroundColor: colors.ink, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  column: { width: '100%', maxWidth: 420, gap: space.lg },
});
