import { StyleSheet, Text, View } from 'react-native';
import { colors, fonts, space } from '../theme';
import { Wordmark } from './Wordmark';

export function AuthBrand() {
  return (
    <View style={styles.wrap}>
      <Wordmark />
      <Text style={styles.tag}>Split your distribution network where it matters.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm, alignItems: 'flex-start' },
  tag: { fontFamily: fonts.regular, fontSize: 15, color: colors.onInk, opacity: 0.85 },
});
