import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { SitePatchInput } from '../../shared/schemas/sites';

import { api, shouldRetry, unwrap } from './client';
import { staleTimes } from './stale-times';
import type { Site, SiteDetail, SiteMember } from './types';

export const siteKeys = {
  all: ['sites'] as const,
  list: () => [...siteKeys.all, 'list'] as const,
  detail: (id: Site['id']) => [...siteKeys.all, 'detail', String(id)] as const,
};

const sitePath = (id: Site['id']) => `/sites/${encodeURIComponent(String(id))}`;

export function useSites() {
  return useQuery({
    queryKey: siteKeys.list(),
    queryFn: async () => unwrap(await api.get<{ sites: Site[] }>('/sites')).sites ?? [],
    staleTime: staleTimes.sites,
    retry: shouldRetry,
  });
}

export function useSite(id: Site['id']) {
  return useQuery({
    queryKey: siteKeys.detail(id),
    queryFn: async () => unwrap(await api.get<{ site: SiteDetail }>(sitePath(id))).site,
    staleTime: staleTimes.sites,
    retry: shouldRetry,
    enabled: String(id) !== '',
  });
}

export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string; description?: string }) => api.post<{ site: SiteDetail }>('/sites', input),
    onSuccess: (result) => {
      if (result.kind === 'ok') void queryClient.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}

export function useUpdateSite(id: Site['id']) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: SitePatchInput) => api.patch<{ site: SiteDetail }>(sitePath(id), patch),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      queryClient.setQueryData(siteKeys.detail(id), result.data.site);
      void queryClient.invalidateQueries({ queryKey: siteKeys.list() });
    },
  });
}

export function useDeleteSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: Site['id']) => api.del<null>(sitePath(id)),
    onSuccess: (result, id) => {
      if (result.kind !== 'ok') return;
      queryClient.removeQueries({ queryKey: siteKeys.detail(id) });
      void queryClient.invalidateQueries({ queryKey: siteKeys.list() });
    },
  });
}

const membersPath = (id: Site['id'], userId?: SiteMember['userId']) =>
  `${sitePath(id)}/members${userId === undefined ? '' : `/${encodeURIComponent(String(userId))}`}`;

/** Adds a team member (typically a contractor) to a site, so they can see it. */
export function useAddSiteMember(siteId: Site['id']) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: SiteMember['userId']) => api.post<{ members: SiteMember[] }>(membersPath(siteId), { userId: Number(userId) }),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      queryClient.setQueryData<SiteDetail>(siteKeys.detail(siteId), (old) => (old ? { ...old, members: result.data.members } : old));
      void queryClient.invalidateQueries({ queryKey: siteKeys.detail(siteId) });
    },
  });
}

/** Takes a person off a site; a contractor then no longer sees it. */
export function useRemoveSiteMember(siteId: Site['id']) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: SiteMember['userId']) => api.del<null>(membersPath(siteId, userId)),
    onSuccess: (result, userId) => {
      if (result.kind !== 'ok') return;
      queryClient.setQueryData<SiteDetail>(siteKeys.detail(siteId), (old) =>
        old ? { ...old, members: (old.members ?? []).filter((m) => String(m.userId) !== String(userId)) } : old,
      );
      void queryClient.invalidateQueries({ queryKey: siteKeys.detail(siteId) });
    },
  });
}
