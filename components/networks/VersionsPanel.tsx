import { useState } from 'react';
import { Linking, Platform, StyleSheet, View } from 'react-native';
import type { VersionComparison } from '../../shared/schemas/networks';
import { exportUrl, useNetworkCompareQuery, useNetworkVersionsQuery, useVersionDuplicateMutation } from '../queries/networks';
import { colors, radius, space } from '../theme';
import { Button } from '../ui/Button';
import { Notice } from '../ui/Notice';
import { Body, Label, Small } from '../ui/Text';
import { formatVolume, formatWhen } from './format';

/** Opens a download: a new tab on the web (the browser saves it), the system handler elsewhere. */
function download(url: string) {
  const w = globalThis as { open?: (u: string, target?: string) => unknown };
  if (Platform.OS === 'web' && typeof w.open === 'function') w.open(url, '_blank');
  else void Linking.openURL(url);
}

const SOURCE_LABEL: Record<string, string> = { drawn: 'saved from the editor', api: 'created', import: 'imported', demo: 'demo', duplicate: 'duplicated' };

/**
 * Versions of a network, newest first: open one (read-only), duplicate it as the newest version,
 * export it (CSV lanes, CSV depots, GeoJSON) and compare any two.
 */
export function VersionsPanel(props: { networkId: number; openVersionId: number | null; latestVersionId: number; onOpen: (versionId: number) => void; canWrite: boolean }) {
  const versions = useNetworkVersionsQuery(props.networkId);
  const duplicate = useVersionDuplicateMutation(props.networkId);
  const [pair, setPair] = useState<number[]>([]);
  const [from, to] = pair.length === 2 ? [Math.min(pair[0], pair[1]), Math.max(pair[0], pair[1])] : [null, null];
  const comparison = useNetworkCompareQuery(props.networkId, from, to);
  if (versions.isPending) return <Small>Loading versions…</Small>;
  if (versions.isError) return <Notice tone="error">{versions.error.message}</Notice>;
  const toggle = (id: number) => setPair((p) => (p.includes(id) ? p.filter((x) => x !== id) : [...p, id].slice(-2)));
  return (
    <View style={styles.wrap} testID="versions-panel">
      <Small>Versions never change once saved; every run refers to one. Choose two to compare them.</Small>
      {duplicate.isError ? <Notice tone="error">{duplicate.error.message}</Notice> : null}
      {versions.data.map((v) => {
        const open = (props.openVersionId ?? props.latestVersionId) === v.id;
        const chosen = pair.includes(v.id);
        return (
          <View key={v.id} style={[styles.card, open && styles.open]} testID={`version-${v.number}`}>
            <View style={styles.head}>
              <Label style={styles.title}>Version {v.number}{v.id === props.latestVersionId ? ' (latest)' : ''}</Label>
              <Small>{formatWhen(v.createdAt)} · {SOURCE_LABEL[v.source] ?? v.source}</Small>
            </View>
            {v.note ? <Small>{v.note}</Small> : null}
            <Small>{formatVolume(v.summary.depots)} depots · {formatVolume(v.summary.lanes)} lanes · volume {formatVolume(v.summary.totalVolume)}</Small>
            <View style={styles.actions}>
              <Button label={open ? 'Open' : 'Open'} tone={open ? 'primary' : 'secondary'} disabled={open} onPress={() => props.onOpen(v.id)} accessibilityHint={`Show version ${v.number}`} />
              <Button label={chosen ? 'Comparing' : 'Compare'} tone={chosen ? 'primary' : 'secondary'} onPress={() => toggle(v.id)} accessibilityHint={`Choose version ${v.number} for comparison`} testID={`compare-${v.number}`} />
              {props.canWrite ? <Button label="Duplicate" tone="secondary" busy={duplicate.isPending && duplicate.variables === v.id} onPress={() => duplicate.mutate(v.id)} accessibilityHint={`Save version ${v.number} again as the newest version`} /> : null}
              <Button label="CSV lanes" tone="quiet" onPress={() => download(exportUrl(props.networkId, v.id, 'lanes-csv'))} accessibilityHint={`Download the lanes of version ${v.number} as CSV`} />
              <Button label="CSV depots" tone="quiet" onPress={() => download(exportUrl(props.networkId, v.id, 'depots-csv'))} accessibilityHint={`Download the depots of version ${v.number} as CSV`} />
              <Button label="GeoJSON" tone="quiet" onPress={() => download(exportUrl(props.networkId, v.id, 'geojson'))} accessibilityHint={`Download version ${v.number} as GeoJSON`} />
            </View>
          </View>
        );
      })}
      {pair.length === 1 ? <Small>Choose one more version to compare with.</Small> : null}
      {comparison.isError ? <Notice tone="error">{comparison.error.message}</Notice> : null}
      {comparison.data ? <ComparisonView c={comparison.data} /> : null}
    </View>
  );
}

export function ComparisonView(props: { c: VersionComparison }) {
  const c = props.c;
  const lines: [string, string[]][] = [
    ['Depots added', c.addedDepots],
    ['Depots removed', c.removedDepots],
    ['Depots changed', c.changedDepots.map((d) => `${d.id} (${d.fields.join(', ')})`)],
    ['Lanes added', c.addedLanes.map((l) => `${l.from}–${l.to} (${formatVolume(l.weight)})`)],
    ['Lanes removed', c.removedLanes.map((l) => `${l.from}–${l.to} (${formatVolume(l.weight)})`)],
    ['Volume changes', c.weightChanges.map((w) => `${w.from}–${w.to}: ${formatVolume(w.before)} → ${formatVolume(w.after)}`)],
  ];
  const none = lines.every(([, items]) => items.length === 0);
  return (
    <View style={styles.compare} testID="version-comparison" role="group" accessibilityLabel={`Comparison of version ${c.from.number} with version ${c.to.number}`}>
      <Label style={styles.title}>Version {c.from.number} → version {c.to.number}</Label>
      {none ? <Body>The two versions hold the same network.</Body> : null}
      {lines.filter(([, items]) => items.length > 0).map(([title, items]) => (
        <View key={title} style={styles.group}>
          <Small style={styles.groupTitle}>{title} ({items.length})</Small>
          <Body>{items.slice(0, 40).join(', ')}{items.length > 40 ? `, … ${items.length - 40} more` : ''}</Body>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  card: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.md, padding: space.md, gap: space.xs, backgroundColor: colors.surface },
  open: { borderColor: colors.ink, borderWidth: 2 },
  head: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', gap: space.sm, alignItems: 'baseline' },
  title: { fontSize: 15, color: colors.text },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginTop: space.xs },
  compare: { borderWidth: 1, borderColor: colors.signal, backgroundColor: colors.warnSoft, borderRadius: radius.md, padding: space.md, gap: space.sm },
  group: { gap: 2 },
  groupTitle: { fontFamily: 'Inter_600SemiBold', color: colors.inkSoft },
});
