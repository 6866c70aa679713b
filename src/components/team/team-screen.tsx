import { StyleSheet, useWindowDimensions, View } from 'react-native';

import { useQueryClient } from '@tanstack/react-query';

import { sessionKeys, useSession } from '../../api/session';
import { useTeam } from '../../api/team';
import { breakpoints, spacing } from '../../theme';
import { Loading, QueryError } from '../common/query-state';
import { Screen } from '../ui';

import { CaughtMailPanel } from './caught-mail-panel';
import { InvitationList } from './invitation-list';
import { InviteForm } from './invite-form';
import { MemberList } from './member-list';

export function TeamScreen({ bottomInset = 0 }: { bottomInset?: number }) {
  const session = useSession();
  const team = useTeam();
  const queryClient = useQueryClient();
  const { width } = useWindowDimensions();
  const isOwner = session.data?.role === 'owner';
  const twoColumns = width >= breakpoints.large;

  return (
    <Screen title={team.data?.team.name ?? session.data?.team?.name ?? 'Team'} intro="Who is on the team and what each person may do." bottomInset={bottomInset}>
      {team.isPending ? (
        <Loading label="Loading the team…" />
      ) : team.isError ? (
        <QueryError error={team.error} onRetry={() => void team.refetch()} title="Could not load the team" />
      ) : (
        <View style={[styles.columns, twoColumns && styles.columnsWide]}>
          <View style={[styles.column, twoColumns && styles.main]}>
            <MemberList
              members={team.data.members}
              canManage={isOwner}
              selfId={session.data?.user?.id}
              // Leaving the team ends this session's access; the fresh session sends the browser to sign-in.
              onRemoved={(self) => (self ? void queryClient.invalidateQueries({ queryKey: sessionKeys.all }) : undefined)}
            />
            <InvitationList invitations={team.data.invitations} canManage={isOwner} />
          </View>
          {isOwner ? (
            <View style={[styles.column, twoColumns && styles.side]}>
              <InviteForm />
              <CaughtMailPanel />
            </View>
          ) : null}
        </View>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  columns: { gap: spacing.lg },
  columnsWide: { flexDirection: 'row', alignItems: 'flex-start' },
  column: { gap: spacing.lg },
  main: { flex: 3 },
  side: { flex: 2 },
});
