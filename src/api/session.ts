import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';

import { api, shouldRetry, unwrap, type ApiResult } from './client';
import { staleTimes } from './stale-times';
import type { InvitationPreview, SessionPayload } from './types';

export const sessionKeys = {
  all: ['session'] as const,
  current: () => [...sessionKeys.all, 'current'] as const,
  invitation: (token: string) => ['invitation', token] as const,
};

export async function fetchSession(): Promise<ApiResult<SessionPayload>> {
  return api.get<SessionPayload>('/auth/session');
}

/** The signed-in user, team, role and settings (or nulls when signed out). */
export function useSession() {
  return useQuery({
    queryKey: sessionKeys.current(),
    queryFn: async () => unwrap(await fetchSession()),
    staleTime: staleTimes.session,
    retry: shouldRetry,
  });
}

/** Puts a fresh session payload in the cache; every team-scoped query belongs to the old session. */
function adoptSession(queryClient: QueryClient, payload: SessionPayload) {
  api.setCsrfToken(payload.csrfToken);
  queryClient.removeQueries({ predicate: (q) => q.queryKey[0] !== sessionKeys.all[0] });
  queryClient.setQueryData(sessionKeys.current(), payload);
}

/** A mutation whose success starts a new session: signing in, signing up, accepting an invitation. */
function useSessionStartingMutation<I>(mutationFn: (input: I) => Promise<ApiResult<SessionPayload>>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: (result: ApiResult<SessionPayload>) => {
      if (result.kind === 'ok') adoptSession(queryClient, result.data);
    },
  });
}

export interface SignInInput {
  email: string;
  password: string;
}

export function useSignIn() {
  return useSessionStartingMutation((input: SignInInput) => api.post<SessionPayload>('/auth/signin', input));
}

export interface SignUpInput {
  name: string;
  email: string;
  password: string;
  teamName: string;
}

export function useSignUp() {
  return useSessionStartingMutation((input: SignUpInput) => api.post<SessionPayload>('/auth/signup', input));
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<null>('/auth/signout'),
    onSettled: async () => {
      // Whatever the answer, forget everything this browser knew about the team.
      queryClient.clear();
      const fresh = await fetchSession();
      if (fresh.kind === 'ok') queryClient.setQueryData(sessionKeys.current(), fresh.data);
    },
  });
}

export function useRequestPasswordReset() {
  return useMutation({
    mutationFn: (input: { email: string }) => api.post<null>('/auth/password-reset', input),
  });
}

export function useConfirmPasswordReset() {
  return useMutation({
    mutationFn: (input: { token: string; password: string }) =>
      api.post<null>('/auth/password-reset/confirm', input),
  });
}

export function useInvitation(token: string | undefined) {
  return useQuery({
    queryKey: sessionKeys.invitation(token ?? ''),
    queryFn: async () => unwrap(await api.get<InvitationPreview>(`/invitations/${encodeURIComponent(token ?? '')}`)),
    enabled: Boolean(token),
    staleTime: staleTimes.invitation,
    retry: shouldRetry,
  });
}

export function useAcceptInvitation(token: string) {
  return useSessionStartingMutation((input: { name?: string; password?: string }) =>
    api.post<SessionPayload>(`/invitations/${encodeURIComponent(token)}/accept`, input),
  );
}
