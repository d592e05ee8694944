import { useRef, useState } from 'react';
import { StyleSheet, View, useWindowDimensions } from 'react-native';
import { useRouter } from 'expo-router';
import { can } from '../../shared/permissions';
import { useMeQuery } from '../queries/auth';
import { useVersionLayout, useNetworkDeleteMutation, useNetworkQuery, useNetworkRenameMutation, useNetworkVersionCreateMutation, useNetworkVersionQuery } from '../queries/networks';
import { ConfirmModal, PromptModal } from '../drawing/PromptModal';
import { NetworkNameSchema } from '../../shared/schemas/networks';
import { space, WIDE_BREAKPOINT } from '../theme';
import { Button } from '../ui/Button';
import { EmptyState } from '../ui/EmptyState';
import { Notice } from '../ui/Notice';
import { Screen } from '../ui/Screen';
import { Body } from '../ui/Text';
import { formatWhen } from './format';
import { NetworkWorkspace } from './NetworkWorkspace';
import { useLeaveGuard } from './useLeaveGuard';
import { VersionsPanel } from './VersionsPanel';
import { NewRunButton } from '../runs/NewRunButton';

/** /networks/:id — the latest version (or an opened older one) in the drawing and tables. */
export function NetworkScreen(props: { id: number }) {
  const router = useRouter();
  const wide = useWindowDimensions().width >= WIDE_BREAKPOINT;
  const me = useMeQuery();
  const canWrite = can(me.data?.current?.role, 'networks:write');
  const network = useNetworkQuery(props.id);
  const [openVersionId, setOpenVersionId] = useState<number | null>(null);
  const latestId = network.data?.latest.id ?? 0;
  const older = useNetworkVersionQuery(props.id, openVersionId && openVersionId !== latestId ? openVersionId : null);
  const save = useNetworkVersionCreateMutation(props.id);
  const rename = useNetworkRenameMutation(props.id);
  const remove = useNetworkDeleteMutation();
  const layouts = useVersionLayout();
  const [dirty, setDirty] = useState(false);
  const [more, setMore] = useState(false);
  const [asking, setAsking] = useState<null | 'delete' | 'rename' | { open: number } | { leaveTo: string }>(null);
  useLeaveGuard(dirty, (path) => setAsking({ leaveTo: path }));
  // The editing workspace belongs to one latest version: when another version becomes the latest
  // (a duplicate, an import, someone else's save) it starts afresh from that version's data. Only
  // the version this workspace saved itself continues it, so a save keeps drawing and undo history.
  const ownSave = useRef(false);
  const workspace = useRef({ latestId: 0, key: 'latest-0' });
  if (latestId && workspace.current.latestId !== latestId) {
    workspace.current = { latestId, key: ownSave.current ? workspace.current.key : `latest-${latestId}` };
  }

  if (network.isPending) return <Screen title="Network"><Body>Loading the network…</Body></Screen>;
  if (network.isError) {
    return (
      <Screen title="Network">
        <EmptyState title="This network cannot be shown" message={network.error.message}>
          <Button label="Back to networks" onPress={() => router.replace('/networks')} />
        </EmptyState>
      </Screen>
    );
  }
  const n = network.data;
  const viewingOlder = openVersionId !== null && openVersionId !== latestId;
  const version = viewingOlder ? older.data : n.latest;
  const leave = () => (dirty ? setAsking({ leaveTo: '/networks' }) : router.push('/networks'));
  const open = (versionId: number) => (dirty ? setAsking({ open: versionId }) : setOpenVersionId(versionId === latestId ? null : versionId));

  const actions = (
    <View style={wide ? styles.actionsWide : styles.actionsPhone}>
      {version ? <NewRunButton networkId={n.id} versionId={version.id} role={me.data?.current?.role ?? null} /> : null}
      <Button label="All networks" tone="secondary" onPress={leave} />
      {canWrite && !wide ? <Button label={more ? 'Less' : 'More'} tone="quiet" onPress={() => setMore((m) => !m)} accessibilityHint="Rename, import a new version or delete" /> : null}
      {canWrite && (wide || more) ? (
        <>
          <Button label="Rename" tone="secondary" onPress={() => setAsking('rename')} />
          <Button label="Import new version" tone="secondary" onPress={() => router.push(`/networks/import?networkId=${n.id}`)} />
          <Button label="Delete" tone="quiet" onPress={() => setAsking('delete')} />
        </>
      ) : null}
    </View>
  );

  return (
    <Screen
      title={n.name}
      subtitle={version ? `Version ${version.number} of ${n.versionCount} · saved ${formatWhen(version.createdAt)}` : undefined}
      // On phones the header's action row cannot wrap, so the buttons go first in the page.
      actions={wide ? actions : undefined}
      testID="network-screen"
    >
      {!wide ? actions : null}
      {!version ? (
        <Body>Loading version…</Body>
      ) : (
        <NetworkWorkspace
          // A new workspace (fresh layout and history) only when another version is opened;
          // saving keeps the drawing exactly as the user left it.
          key={viewingOlder ? `v${version.id}` : workspace.current.key}
          document={version.document}
          readOnly={!canWrite || viewingOlder}
          knownXy={layouts.get(version.id)}
          onSave={async (doc, xy) => {
            ownSave.current = true;
            try {
              const r = await save.mutateAsync({ depots: doc.depots, lanes: doc.lanes });
              layouts.set(r.versionId, xy);
            } finally {
              ownSave.current = false;
            }
          }}
          saving={save.isPending}
          saveError={save.isError ? save.error.message : null}
          onDirtyChange={setDirty}
          notice={
            viewingOlder ? (
              <Notice tone="caution" testID="older-version-notice">
                You are looking at version {version.number} (read-only). Duplicate it in Versions to continue from it, or open the latest version.
              </Notice>
            ) : !canWrite ? (
              <Notice>Your role can view networks but not change them.</Notice>
            ) : null
          }
          versions={<VersionsPanel networkId={n.id} latestVersionId={latestId} openVersionId={openVersionId} onOpen={open} canWrite={canWrite} />}
        />
      )}
      <ConfirmModal
        visible={typeof asking === 'object' && asking !== null}
        title="Leave without saving?"
        message="Your changes to this network are not saved. Save them as a new version first, or discard them."
        confirmLabel="Discard changes"
        cancelLabel="Keep editing"
        danger
        onCancel={() => setAsking(null)}
        onConfirm={() => {
          const a = asking;
          setAsking(null);
          setDirty(false);
          if (a && typeof a === 'object' && 'leaveTo' in a) router.push(a.leaveTo as never);
          else if (a && typeof a === 'object') setOpenVersionId(a.open === latestId ? null : a.open);
        }}
      />
      <ConfirmModal
        visible={asking === 'delete'}
        title={`Delete ${n.name}?`}
        message="The network leaves the list. Runs that used one of its versions keep working and still show it."
        confirmLabel="Delete network"
        danger
        onCancel={() => setAsking(null)}
        busy={remove.isPending}
        error={remove.isError ? remove.error.message : null}
        onConfirm={() =>
          remove.mutate(n.id, {
            onSuccess: () => {
              setAsking(null);
              router.replace('/networks');
            },
          })
        }
      />
      <PromptModal
        visible={asking === 'rename'}
        title="Rename network"
        label="Network name"
        initial={n.name}
        confirmLabel="Rename"
        validate={(t) => {
          const r = NetworkNameSchema.safeParse(t);
          return r.success ? null : r.error.issues[0].message;
        }}
        onCancel={() => setAsking(null)}
        onConfirm={(t) => rename.mutate(t.trim(), { onSettled: () => setAsking(null) })}
      />
    </Screen>
  );
}

const styles = StyleSheet.create({
  actionsPhone: { width: '100%', flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  actionsWide: { flexDirection: 'row', gap: space.sm },
});
