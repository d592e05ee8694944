import { Redirect, Slot, usePathname } from 'expo-router';
import { AppShell } from '../../components/shell/AppShell';
import { FullScreenStatus } from '../../components/shell/FullScreenStatus';
import { useMeQuery } from '../../components/queries/auth';
import { rememberRequestedPage } from '../../components/auth/next';
import { OrgSwitcher } from '../../components/account/OrgSwitcher';
import { NoOrganisation } from '../../components/account/NoOrganisation';

/** Signed-in area: everything under it needs a session; the shell shows the current organisation. */
export default function SignedInLayout() {
  const me = useMeQuery();
  const pathname = usePathname();
  // expo-router reports '/' by the time the redirect below renders, so note the page while loading.
  if (!me.data) rememberRequestedPage(pathname);
  if (me.isPending) return <FullScreenStatus label="Loading your organisation…" />;
  if (me.isError) return <FullScreenStatus label="Spinyard cannot be reached right now." error={me.error.message} onRetry={() => me.refetch()} />;
  if (!me.data) {
    // The page asked for (a shared run link, say) was noted above; sign-in brings the visitor back.
    return <Redirect href="/sign-in" />;
  }
  return (
    <AppShell organisationName={me.data.current?.name ?? 'No organisation'} role={me.data.current?.role ?? null} headerRight={<OrgSwitcher me={me.data} />}>
      {/* Without an organisation only the account page has something to show; elsewhere, the way forward. */}
      {me.data.current || pathname.startsWith('/account') ? <Slot /> : <NoOrganisation me={me.data} />}
    </AppShell>
  );
}
