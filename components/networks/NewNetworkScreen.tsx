import { useState } from 'react';
import { useRouter } from 'expo-router';
import { NetworkNameSchema } from '../../shared/schemas/networks';
import { useNetworkCreateMutation, useVersionLayout } from '../queries/networks';
import { ConfirmModal } from '../drawing/PromptModal';
import { Button } from '../ui/Button';
import { Screen } from '../ui/Screen';
import { TextField } from '../ui/TextField';
import { NetworkWorkspace } from './NetworkWorkspace';
import { useLeaveGuard } from './useLeaveGuard';

const EMPTY = { depots: [], lanes: [] };

/** /networks/new — draw a network from nothing; saving creates it with version 1. */
export function NewNetworkScreen() {
  const router = useRouter();
  const create = useNetworkCreateMutation();
  const layouts = useVersionLayout();
  const [name, setName] = useState('');
  const [nameError, setNameError] = useState<string | null>(null);
  const [dirty, setDirty] = useState(false);
  const [asking, setAsking] = useState<string | null>(null);
  useLeaveGuard(dirty, setAsking);
  return (
    <Screen title="Draw a network" subtitle="Tap to place depots, drag from depot to depot to join them with a lane." actions={<Button label="All networks" tone="secondary" onPress={() => (dirty ? setAsking('/networks') : router.push('/networks'))} />} testID="new-network-screen">
      <TextField label="Network name" value={name} onChangeText={(t) => { setName(t); setNameError(null); }} error={nameError ?? undefined} placeholder="e.g. North yard lanes" />
      <NetworkWorkspace
        document={EMPTY}
        readOnly={false}
        onDirtyChange={setDirty}
        saving={create.isPending}
        saveError={create.isError ? create.error.message : null}
        onSave={async (doc, xy) => {
          const checked = NetworkNameSchema.safeParse(name);
          if (!checked.success) {
            setNameError(checked.error.issues[0].message);
            throw new Error(checked.error.issues[0].message);
          }
          const r = await create.mutateAsync({ name: checked.data, depots: doc.depots, lanes: doc.lanes });
          layouts.set(r.versionId, xy); // the saved network opens exactly as drawn
          setDirty(false);
          router.replace(`/networks/${r.id}`);
        }}
      />
      <ConfirmModal
        visible={asking !== null}
        title="Leave without saving?"
        message="This drawing is not saved yet. Give it a name and save it, or discard it."
        confirmLabel="Discard drawing"
        cancelLabel="Keep drawing"
        danger
        onCancel={() => setAsking(null)}
        onConfirm={() => {
          const to = asking ?? '/networks';
          setAsking(null);
          setDirty(false);
          router.push(to as never);
        }}
      />
    </Screen>
  );
}
