import { ScrollView, StyleSheet, View } from 'react-native';
import { space } from '../theme';
import { Title, Small } from './Text';

/** A scrolling page with a title, optional subtitle and header actions, centred on wide screens. */
export function Screen(props: { title: string; subtitle?: string; actions?: React.ReactNode; children: React.ReactNode; maxWidth?: number; testID?: string }) {
  return (
    <ScrollView contentContainerStyle={styles.scroll} testID={props.testID}>
      <View style={[styles.inner, { maxWidth: props.maxWidth ?? 1200 }]}>
        <View style={styles.head}>
          <View style={styles.titles}>
            <Title>{props.title}</Title>
            {props.subtitle ? <Small>{props.subtitle}</Small> : null}
          </View>
          {props.actions ? <View style={styles.actions}>{props.actions}</View> : null}
        </View>
        {props.children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flexGrow: 1, padding: space.lg },
  inner: { width: '100%', alignSelf: 'center', gap: space.lg },
  head: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end', justifyContent: 'space-between', gap: space.md },
  titles: { gap: space.xs, flexShrink: 1 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
});
