import { useSession } from '../../api/session';

import { AppShell } from './app-shell';

/**
 * For pages open to everyone: a signed-in member gets the app's navigation around the page, a
 * visitor sees the page alone (while the session is on its way the page shows without it).
 */
export function ShellWhenSignedIn({ children }: { children: React.ReactNode }) {
  const session = useSession();
  const user = session.data?.user ?? null;
  return (
    <AppShell navigation={user !== null} teamName={session.data?.team?.name} userName={user?.name}>
      {children}
    </AppShell>
  );
}
