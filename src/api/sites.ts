import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { api, shouldRetry, unwrap } from './client';
import { staleTimes } from './stale-times';
import type { Site } from './types';

export const siteKeys = {
  all: ['sites'] as const,
  list: () => [...siteKeys.all, 'list'] as const,
  detail: (id: Site['id']) => [...siteKeys.all, 'detail', String(id)] as const,
};

export function useSites() {
  return useQuery({
    queryKey: siteKeys.list(),
    queryFn: async () => unwrap(await api.get<{ sites: Site[] }>('/sites')).sites ?? [],
    staleTime: staleTimes.sites,
    retry: shouldRetry,
  });
}

export function useCreateSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string; description?: string }) => api.post<Site>('/sites', input),
    onSuccess: (result) => {
      if (result.kind === 'ok') void queryClient.invalidateQueries({ queryKey: siteKeys.all });
    },
  });
}
