import { useState } from 'react';
import { Pressable, StyleSheet, View, useWindowDimensions } from 'react-native';
import { Link, useRouter } from 'expo-router';
import { can } from '../../shared/permissions';
import type { NetworkListItem, NetworkSort } from '../../shared/schemas/networks';
import { useMeQuery } from '../queries/auth';
import { FIRST_NETWORK_LIST, useDemoCopyMutation, useDemoNetworksQuery, useNetworksQuery } from '../queries/networks';
import { colors, radius, space, TOUCH, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { EmptyState } from '../ui/EmptyState';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body, Label, Small } from '../ui/Text';
import { TextField } from '../ui/TextField';
import { formatVolume, formatWhen } from './format';

const SORTS: { key: NetworkSort; label: string }[] = [
  { key: 'updated', label: 'Updated' },
  { key: 'name', label: 'Name' },
  { key: 'size', label: 'Size' },
];

/** /networks — search, sort, cards on phones and a table on wide screens; an empty state with next steps. */
export function NetworkList() {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const me = useMeQuery();
  const canWrite = can(me.data?.current?.role, 'networks:write');
  const [search, setSearch] = useState<string>(FIRST_NETWORK_LIST.search);
  const [sort, setSort] = useState<NetworkSort>(FIRST_NETWORK_LIST.sort);
  const [order, setOrder] = useState<'asc' | 'desc'>(FIRST_NETWORK_LIST.order);
  const list = useNetworksQuery({ search, sort, order });
  const nothingAtAll = list.data?.length === 0 && search.trim() === '';
  const demos = useDemoNetworksQuery(nothingAtAll);
  const copy = useDemoCopyMutation();

  const pickSort = (key: NetworkSort) => {
    if (key === sort) setOrder((o) => (o === 'asc' ? 'desc' : 'asc'));
    else {
      setSort(key);
      setOrder(key === 'name' ? 'asc' : 'desc');
    }
  };
  const actions = canWrite ? (
    <>
      <Button label="Draw" onPress={() => router.push('/networks/new')} accessibilityHint="Draw a new network" />
      <Button label="Import" tone="secondary" onPress={() => router.push('/networks/import')} accessibilityHint="Import a network file" />
    </>
  ) : null;

  return (
    <Screen title="Networks" subtitle="Depots and the lanes between them, in versions that never change once saved." actions={nothingAtAll ? null : actions} testID="networks-screen">
      {nothingAtAll ? (
        <EmptyState title="No networks yet" message="Draw a network of depots and lanes, import one from your own systems, or start from a demo network of the Quillmere Valley." testID="networks-empty">
          {canWrite ? (
            <>
              <Button label="Draw a network" onPress={() => router.push('/networks/new')} />
              <Button label="Import a file" tone="secondary" onPress={() => router.push('/networks/import')} />
            </>
          ) : null}
          {canWrite
            ? (demos.data ?? []).map((d) => (
                <Button
                  key={d.key}
                  label={`Open demo: ${d.name}`}
                  tone="secondary"
                  busy={copy.isPending && copy.variables === d.key}
                  accessibilityHint={`${d.description}; copies it into your organisation`}
                  onPress={() => copy.mutate(d.key, { onSuccess: (r) => router.push(`/networks/${r.id}`) })}
                />
              ))
            : null}
        </EmptyState>
      ) : (
        <>
          <View style={styles.controls}>
            <View style={styles.search}>
              <TextField label="Search by name" value={search} onChangeText={setSearch} placeholder="e.g. Quillmere" autoCapitalize="none" />
            </View>
            <View style={styles.sorts} accessibilityRole="radiogroup" accessibilityLabel="Sort networks">
              {SORTS.map((s) => (
                <Button
                  key={s.key}
                  label={sort === s.key ? `${s.label} ${order === 'asc' ? '↑' : '↓'}` : s.label}
                  tone={sort === s.key ? 'primary' : 'secondary'}
                  onPress={() => pickSort(s.key)}
                  accessibilityHint={`Sort by ${s.label.toLowerCase()}${sort === s.key ? '; press again to reverse' : ''}`}
                  testID={`sort-${s.key}`}
                />
              ))}
            </View>
          </View>
          {list.isError ? <Notice tone="error">{list.error.message}</Notice> : null}
          {copy.isError ? <Notice tone="error">{copy.error.message}</Notice> : null}
          {list.isPending ? <Body>Loading networks…</Body> : null}
          {list.data && list.data.length === 0 ? <Body>No network name contains “{search.trim()}”.</Body> : null}
          {list.data && list.data.length > 0 ? (wide ? <NetworkTable items={list.data} /> : <NetworkCards items={list.data} />) : null}
        </>
      )}
    </Screen>
  );
}

function NetworkCards(props: { items: NetworkListItem[] }) {
  return (
    <View style={styles.cards} accessibilityRole="list" testID="networks-list">
      {props.items.map((n) => (
        <View key={n.id} role="listitem">
          <Link href={`/networks/${n.id}`} asChild>
            <Pressable accessibilityRole="link">
              <Card>
                <Label style={styles.name}>{n.name}</Label>
                <Small>
                  {formatVolume(n.summary.depots)} depots · {formatVolume(n.summary.lanes)} lanes · volume {formatVolume(n.summary.totalVolume)}
                </Small>
                <Small>Version {n.latestVersion} · updated {formatWhen(n.updatedAt)}</Small>
              </Card>
            </Pressable>
          </Link>
        </View>
      ))}
    </View>
  );
}

function NetworkTable(props: { items: NetworkListItem[] }) {
  const head = ['Name', 'Depots', 'Lanes', 'Total volume', 'Version', 'Updated'];
  return (
    <Card style={styles.table} testID="networks-table">
      <View style={[styles.tr, styles.th]} aria-hidden>
        {head.map((h, k) => (
          <Small key={h} style={[styles.td, k === 0 ? styles.nameCol : styles.numCol, k === head.length - 1 ? styles.whenCol : null]}>{h}</Small>
        ))}
      </View>
      <View accessibilityRole="list">
        {props.items.map((n) => (
          // The row's layout lives on a plain View inside the link: a Link with asChild passes its
          // child's props through a slot that drops a style given as a function, and the cells stacked.
          <View key={n.id} role="listitem" testID={`network-row-${n.id}`}>
            {/* A real link, so Enter opens the row from the keyboard (react-native-web ignores Enter on role=link without href). */}
            <Link href={`/networks/${n.id}`} asChild>
              <Pressable accessibilityRole="link">
                {(state) => (
                  <View style={[styles.tr, (state as { hovered?: boolean }).hovered ? styles.hover : null]}>
                    <Body style={[styles.td, styles.nameCol, styles.nameText]} numberOfLines={1}>{n.name}</Body>
                    <Body style={[styles.td, styles.numCol]}>{formatVolume(n.summary.depots)}</Body>
                    <Body style={[styles.td, styles.numCol]}>{formatVolume(n.summary.lanes)}</Body>
                    <Body style={[styles.td, styles.numCol]}>{formatVolume(n.summary.totalVolume)}</Body>
                    <Body style={[styles.td, styles.numCol]}>{n.latestVersion}</Body>
                    <Body style={[styles.td, styles.numCol, styles.whenCol]}>{formatWhen(n.updatedAt)}</Body>
                  </View>
                )}
              </Pressable>
            </Link>
          </View>
        ))}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  controls: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-end' },
  search: { flexGrow: 1, minWidth: 240 },
  sorts: { flexDirection: 'row', gap: space.xs, flexWrap: 'wrap' },
  cards: { gap: space.sm },
  name: { fontSize: 16, color: colors.text },
  table: { padding: 0, gap: 0, overflow: 'hidden', borderRadius: radius.lg },
  tr: { flexDirection: 'row', alignItems: 'center', minHeight: TOUCH, paddingHorizontal: space.lg, borderBottomWidth: 1, borderBottomColor: colors.line },
  th: { backgroundColor: colors.surfaceSunk, minHeight: 36 },
  hover: { backgroundColor: '#FBF7EE' },
  td: { paddingVertical: space.sm },
  nameCol: { flex: 3, minWidth: 0 },
  nameText: { fontFamily: 'Inter_600SemiBold' },
  numCol: { flex: 1, textAlign: 'right', fontVariant: ['tabular-nums'] },
  whenCol: { flex: 1.8 },
});
