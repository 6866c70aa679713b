import { Redirect, Slot } from 'expo-router';

import { useSession } from '../../src/api/session';
import { Loading, QueryError } from '../../src/components/common/query-state';
import { AppShell } from '../../src/components/nav';
import { Screen } from '../../src/components/ui';

/** Everything in this group needs a signed-in member; the server checks every request as well. */
export default function SignedInLayout() {
  const session = useSession();
  if (session.isPending) {
    return (
      <Screen width="narrow">
        <Loading label="Opening your workspace…" />
      </Screen>
    );
  }
  if (session.isError) {
    return (
      <Screen width="narrow" title="Lagline">
        <QueryError error={session.error} onRetry={() => void session.refetch()} title="Could not reach Lagline" />
      </Screen>
    );
  }
  if (!session.data.user) return <Redirect href="/" />;
  return (
    <AppShell teamName={session.data.team?.name} userName={session.data.user.name}>
      <Slot />
    </AppShell>
  );
}
