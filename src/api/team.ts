import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { api, shouldRetry, unwrap } from './client';
import { staleTimes } from './stale-times';
import type { CaughtMail, Invitation, Member, Role, TeamPayload } from './types';

export const teamKeys = {
  all: ['team'] as const,
  detail: () => [...teamKeys.all, 'detail'] as const,
  devMail: () => ['dev-mail'] as const,
};

export function useTeam(enabled = true) {
  return useQuery({
    queryKey: teamKeys.detail(),
    queryFn: async () => unwrap(await api.get<TeamPayload>('/team')),
    staleTime: staleTimes.team,
    retry: shouldRetry,
    enabled,
  });
}

function useTeamMutation<TInput, TData>(
  fn: (input: TInput) => ReturnType<typeof api.request<TData>>,
  alsoMail = false,
  /** Applies the confirmed change to the cached team at once, before the refetch lands. */
  apply?: (team: TeamPayload, input: TInput) => TeamPayload,
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (result, input) => {
      if (result.kind !== 'ok') return;
      if (apply) queryClient.setQueryData<TeamPayload>(teamKeys.detail(), (old) => (old ? apply(old, input) : old));
      void queryClient.invalidateQueries({ queryKey: teamKeys.all });
      if (alsoMail) void queryClient.invalidateQueries({ queryKey: teamKeys.devMail() });
    },
  });
}

export function useInviteMember() {
  return useTeamMutation((input: { email: string; role: Role }) => api.post<Invitation>('/team/invitations', input), true);
}

export function useRevokeInvitation() {
  return useTeamMutation(
    (id: Invitation['id']) => api.del<null>(`/team/invitations/${encodeURIComponent(String(id))}`),
    false,
    (team, id) => ({ ...team, invitations: team.invitations.filter((i) => String(i.id) !== String(id)) }),
  );
}

export function useChangeRole() {
  return useTeamMutation(
    (input: { userId: Member['userId']; role: Role }) =>
      api.patch<Member>(`/team/members/${encodeURIComponent(String(input.userId))}`, { role: input.role }),
    false,
    (team, input) => ({
      ...team,
      members: team.members.map((m) => (String(m.userId) === String(input.userId) ? { ...m, role: input.role } : m)),
    }),
  );
}

export function useRemoveMember() {
  return useTeamMutation(
    (userId: Member['userId']) => api.del<null>(`/team/members/${encodeURIComponent(String(userId))}`),
    false,
    (team, userId) => ({ ...team, members: team.members.filter((m) => String(m.userId) !== String(userId)) }),
  );
}

/** Mail caught by the local catcher (development only; owners only). */
export function useDevMail(enabled: boolean) {
  return useQuery({
    queryKey: teamKeys.devMail(),
    queryFn: async () => unwrap(await api.get<{ messages: CaughtMail[] }>('/dev/mail')),
    staleTime: staleTimes.devMail,
    retry: false,
    enabled,
  });
}
