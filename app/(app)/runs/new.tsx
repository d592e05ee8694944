import { useLocalSearchParams, useRouter } from 'expo-router';
import { lazyScreen } from '../../../components/shell/lazy-screen';
import { useMeQuery } from '../../../components/queries/auth';
import { Screen } from '../../../components/ui/Screen';
import { Notice } from '../../../components/ui/Notice';
import { Button } from '../../../components/ui/Button';

const RunSetup = lazyScreen('RunSetup'); // drawing code loads with the screen, not with sign-in

/** /runs/new?networkId=…&versionId=… — set up a run on one network version. */
export default function NewRunScreen() {
  const { networkId, versionId } = useLocalSearchParams<{ networkId?: string; versionId?: string }>();
  const me = useMeQuery();
  const router = useRouter();
  if (!networkId || !versionId) {
    return (
      <Screen title="New run">
        <Notice>Open a network and choose “New run” to start from one of its versions.</Notice>
        <Button label="Choose a network" onPress={() => router.push('/networks')} />
      </Screen>
    );
  }
  return <RunSetup networkId={Number(networkId)} versionId={Number(versionId)} role={me.data?.current?.role ?? null} />;
}
