import { useCallback, useEffect, useMemo, useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import type { NetworkDocument } from '../../shared/engine/network/types';
import { summariseNetwork } from '../../shared/networks/summary';
import { NetworkEditor } from '../drawing/NetworkEditor';
import { draftFromDocument, emptySelection, setLaneWeight, toDocument, type Selection } from '../drawing/draft';
import { useDraftHistory } from '../drawing/useDraftHistory';
import { colors, space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { Card } from '../ui/Card';
import { Notice } from '../ui/Notice';
import { Small } from '../ui/Text';
import { DepotsTable } from './DepotsTable';
import { LanesTable } from './LanesTable';
import { SummaryBar } from './SummaryBar';
import { WorkspaceTabs } from './WorkspaceTabs';

type Tab = 'drawing' | 'depots' | 'lanes' | 'versions';

/**
 * Three views of one draft — the drawing, the depots table, the lanes table — sharing one
 * selection (select in one, highlighted in the others) and one undo history. Phones show one
 * view at a time under tabs; wide screens put the drawing beside the tables.
 */
export function NetworkWorkspace(props: {
  document: Pick<NetworkDocument, 'depots' | 'lanes'>;
  readOnly: boolean;
  /** Positions from an earlier drawing of this document (kept across a save). */
  knownXy?: Float64Array | null;
  /** Saves the draft as a new version; resolves when written. `xy` lets the screen keep the layout. */
  onSave?: (doc: NetworkDocument, xy: Float64Array) => Promise<unknown>;
  saving?: boolean;
  saveError?: string | null;
  /** Rendered above the views (title row is the screen's). */
  notice?: React.ReactNode;
  versions?: React.ReactNode;
  /** Told whenever the unsaved state changes (the screen asks before leaving). */
  onDirtyChange?: (dirty: boolean) => void;
}) {
  const { width } = useWindowDimensions();
  const wide = width >= WIDE_BREAKPOINT;
  const [{ draft: initial, projection }] = useState(() => draftFromDocument(props.document, props.knownXy));
  const history = useDraftHistory(initial);
  const [selection, setSelection] = useState<Selection>(emptySelection);
  const [tab, setTab] = useState<Tab>('drawing');
  const { draft, dirty } = history;
  const summary = useMemo(() => summariseNetwork(draft), [draft]);
  const onDirtyChange = props.onDirtyChange;
  useEffect(() => onDirtyChange?.(dirty), [dirty, onDirtyChange]);

  const selectDepot = useCallback((i: number) => setSelection((s) => ({ depots: s.depots.has(i) && s.depots.size === 1 ? new Set() : new Set([i]), lanes: new Set() })), []);
  const selectLane = useCallback((e: number) => setSelection((s) => ({ depots: new Set(), lanes: s.lanes.has(e) && s.lanes.size === 1 ? new Set() : new Set([e]) })), []);
  const changeWeight = useCallback((e: number, w: number) => history.commit(setLaneWeight(history.draft, e, w)), [history]);

  const save = async () => {
    if (!props.onSave) return;
    try {
      await props.onSave(toDocument(draft), draft.xy);
      history.markSaved();
    } catch {
      // The screen shows why (saveError or a field error); the draft stays unsaved.
    }
  };

  const editor = (
    <NetworkEditor
      draft={draft}
      projection={projection}
      onCommit={history.commit}
      selection={selection}
      onSelectionChange={setSelection}
      undo={history.undo}
      redo={history.redo}
      canUndo={history.canUndo}
      canRedo={history.canRedo}
      readOnly={props.readOnly}
      height={wide ? 560 : 440}
    />
  );
  const depots = <DepotsTable depots={draft.depots} lanes={draft.lanes} selected={selection.depots} onSelect={selectDepot} wide={wide} />;
  const lanes = <LanesTable lanes={draft.lanes} selected={selection.lanes} onSelect={selectLane} onWeightChange={changeWeight} readOnly={props.readOnly} />;
  const tabs: Tab[] = wide ? ['depots', 'lanes', ...(props.versions ? (['versions'] as Tab[]) : [])] : ['drawing', 'depots', 'lanes', ...(props.versions ? (['versions'] as Tab[]) : [])];
  const current = wide && tab === 'drawing' ? 'depots' : tab;
  const tabBar = (
    <WorkspaceTabs
      tabs={tabs.map((t) => (t === 'drawing' ? { key: t, name: 'Drawing' } : t === 'depots' ? { key: t, name: 'Depots', count: draft.depots.length } : t === 'lanes' ? { key: t, name: 'Lanes', count: draft.lanes.length } : { key: t, name: 'Versions' }))}
      current={current}
      onChange={(t) => setTab(t as Tab)}
    />
  );
  const panel = current === 'drawing' ? editor : current === 'depots' ? depots : current === 'lanes' ? lanes : props.versions;

  return (
    <View style={styles.wrap}>
      {props.notice}
      <SummaryBar summary={summary} compact={!wide} />
      {!props.readOnly && props.onSave ? (
        <View style={styles.saveRow}>
          <Small style={dirty ? styles.dirty : undefined} testID="save-state">{dirty ? 'Unsaved changes' : 'All changes saved'}</Small>
          <Button label="Save as new version" onPress={save} disabled={!dirty || draft.depots.length === 0} busy={props.saving} testID="save-network" />
        </View>
      ) : null}
      {props.saveError ? <Notice tone="error" testID="save-error">{props.saveError}</Notice> : null}
      {wide ? (
        <View style={styles.columns}>
          <View style={styles.left}>{editor}</View>
          <Card style={styles.right}>
            {tabBar}
            {panel}
          </Card>
        </View>
      ) : (
        <>
          {tabBar}
          {panel}
        </>
      )}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  columns: { flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' },
  left: { flex: 3, minWidth: 0 },
  right: { flex: 2, minWidth: 0 },
  saveRow: { flexDirection: 'row', alignItems: 'center', justifyContent: 'flex-end', gap: space.md, flexWrap: 'wrap' },
  dirty: { color: colors.signalDeep, fontFamily: 'Inter_600SemiBold' },
});
