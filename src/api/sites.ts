import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { SitePatchInput } from '../../shared/schemas/sites';

import { api, shouldRetry, unwrap } from './client';
import { staleTimes } from './stale-times';
import type { Site, SiteDetail } from './types';

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
