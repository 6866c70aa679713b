import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';

import { api, shouldRetry, unwrap } from './client';
import { invalidateSiteItems } from './lines';
import type { Job } from './types';

/** How often a running job is asked for its progress [ms]. */
export const JOB_POLL_MS = 800;

export const jobKeys = {
  all: ['jobs'] as const,
  detail: (id: number | string) => [...jobKeys.all, 'detail', String(id)] as const,
  /** The sizing job this browser started (or was handed) for a site, if any. */
  forSite: (siteId: number | string) => [...jobKeys.all, 'site', String(siteId)] as const,
};

export const isFinished = (job: Pick<Job, 'status'> | null | undefined) => job?.status === 'done' || job?.status === 'failed';

/** Share of the job done, 0–1 (a job of no items is done at once). */
export function jobProgress(job: Pick<Job, 'done' | 'total' | 'status'>): number {
  if (job.status === 'done') return 1;
  if (!(job.total > 0)) return 0;
  return Math.min(1, Math.max(0, job.done / job.total));
}

function whenFinished(queryClient: QueryClient, job: Job, siteId: number | string) {
  if (isFinished(job)) invalidateSiteItems(queryClient, job.siteId ?? siteId);
}

/**
 * Progress of a job, asked again every {@link JOB_POLL_MS} while it is queued or running. When it
 * finishes, the site's lists, totals and items refresh.
 */
export function useJob(id: number | null, siteId: number | string) {
  const queryClient = useQueryClient();
  return useQuery({
    queryKey: jobKeys.detail(id ?? ''),
    queryFn: async () => {
      const job = unwrap(await api.get<{ job: Job }>(`/jobs/${encodeURIComponent(String(id))}`)).job;
      const before = queryClient.getQueryData<Job>(jobKeys.detail(id ?? ''));
      if (before && !isFinished(before)) whenFinished(queryClient, job, siteId);
      return job;
    },
    enabled: id !== null,
    retry: shouldRetry,
    staleTime: 0,
    refetchInterval: (query) => (query.state.data && isFinished(query.state.data) ? false : JOB_POLL_MS),
  });
}

/**
 * "Size all" for a site: starts the job (or is handed the one already queued or running) and follows
 * it. Nothing waits on it; screens show its progress and carry on.
 */
export function useSiteSizing(siteId: number | string) {
  const queryClient = useQueryClient();
  const active = useQuery({
    queryKey: jobKeys.forSite(siteId),
    queryFn: async () => queryClient.getQueryData<number | null>(jobKeys.forSite(siteId)) ?? null,
    staleTime: Infinity,
    gcTime: Infinity,
  });
  const jobId = active.data ?? null;
  const job = useJob(jobId, siteId);
  const start = useMutation({
    mutationFn: () => api.post<{ job: Job }>(`/sites/${encodeURIComponent(String(siteId))}/sizing`, {}),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      const j = result.data.job;
      queryClient.setQueryData(jobKeys.detail(j.id), j);
      queryClient.setQueryData(jobKeys.forSite(siteId), j.id);
      whenFinished(queryClient, j, siteId);
    },
  });
  const dismiss = () => queryClient.setQueryData(jobKeys.forSite(siteId), null);
  return { jobId, job: job.data ?? null, jobError: job.error, start, dismiss };
}
