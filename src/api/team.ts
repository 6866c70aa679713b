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

function useTeamMutation<TInput, TData>(fn: (input: TInput) => ReturnType<typeof api.request<TData>>, alsoMail = false) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      void queryClient.invalidateQueries({ queryKey: teamKeys.all });
      if (alsoMail) void queryClient.invalidateQueries({ queryKey: teamKeys.devMail() });
    },
  });
}

export function useInviteMember() {
  return useTeamMutation((input: { email: string; role: Role }) => api.post<Invitation>('/team/invitations', input), true);
}

export function useRevokeInvitation() {
  return useTeamMutation((id: Invitation['id']) => api.del<null>(`/team/invitations/${encodeURIComponent(String(id))}`));
}

export function useChangeRole() {
  return useTeamMutation((input: { userId: Member['userId']; role: Role }) =>
    api.patch<Member>(`/team/members/${encodeURIComponent(String(input.userId))}`, { role: input.role }),
  );
}

export function useRemoveMember() {
  return useTeamMutation((userId: Member['userId']) => api.del<null>(`/team/members/${encodeURIComponent(String(userId))}`));
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
