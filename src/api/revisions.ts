import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type {
  ComparisonCounts,
  FieldChange,
  ItemChange,
  RevisionPurpose,
  RevisionScheme,
  RevisionSignature,
  RevisionStatus,
  RevisionTotals,
} from '../../shared/schemas/revisions';

import { api, shouldRetry, unwrap } from './client';
import type { UnitSystem } from './types';

export type { ComparisonCounts, FieldChange, ItemChange, RevisionPurpose, RevisionScheme, RevisionStatus, RevisionTotals };
export type Signature = RevisionSignature;

/** How long revision data counts as fresh: signatures come from other people, so not long. */
const revisionStaleTimes = { list: 15_000, detail: 15_000, readiness: 5_000, comparison: 30_000 } as const;

export interface Revision {
  id: number;
  siteId: number;
  number: string;
  purpose: RevisionPurpose;
  purposeLabel: string;
  description: string;
  status: RevisionStatus;
  snapshotHash: string;
  itemCount: number;
  totals: RevisionTotals;
  prepared: Signature;
  checked: Signature | null;
  approved: Signature | null;
  issuedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface RevisionDetail extends Revision {
  site: { id: number; name: string; description: string };
}

export type Blocker = { itemId: number; kind: 'line' | 'vessel'; tag: string; reason: 'unsized' | 'stale' | 'error'; message: string };

export interface Readiness {
  ready: boolean;
  itemCount: number;
  blockerCount: number;
  blockers: Blocker[];
  failingCount: number;
  failing: { itemId: number; kind: 'line' | 'vessel'; tag: string; purposes: string[] }[];
  inProgress: Revision | null;
  scheme: RevisionScheme;
  nextNumbers: Record<RevisionPurpose, string>;
}

export type ComparisonSide = { kind: 'draft' } | { kind: 'revision'; id: number; number: string; status: RevisionStatus; issuedAt: string | null };

export interface Comparison {
  from: ComparisonSide;
  to: ComparisonSide;
  units: UnitSystem;
  counts: ComparisonCounts;
  changes: ItemChange[];
}

/** A side of a comparison as the API names it: a revision id, or `draft`. */
export type Which = number | 'draft';

export const revisionKeys = {
  all: ['revisions'] as const,
  list: (siteId: string) => [...revisionKeys.all, 'list', siteId] as const,
  readiness: (siteId: string) => [...revisionKeys.all, 'readiness', siteId] as const,
  detail: (id: string) => [...revisionKeys.all, 'detail', id] as const,
  comparison: (siteId: string, from: string, to: string, units: UnitSystem) => [...revisionKeys.all, 'comparison', siteId, from, to, units] as const,
  scheme: (siteId: string) => [...revisionKeys.all, 'scheme', siteId] as const,
};

const sitePath = (siteId: string) => `/sites/${encodeURIComponent(siteId)}`;

export function useRevisions(siteId: string) {
  return useQuery({
    queryKey: revisionKeys.list(siteId),
    queryFn: async () => unwrap(await api.get<{ revisions: Revision[] }>(`${sitePath(siteId)}/revisions`)).revisions,
    staleTime: revisionStaleTimes.list,
    retry: shouldRetry,
    enabled: siteId !== '',
  });
}

export function useReadiness(siteId: string, enabled = true) {
  return useQuery({
    queryKey: revisionKeys.readiness(siteId),
    queryFn: async () => unwrap(await api.get<{ readiness: Readiness }>(`${sitePath(siteId)}/revisions/readiness`)).readiness,
    staleTime: revisionStaleTimes.readiness,
    retry: shouldRetry,
    enabled: enabled && siteId !== '',
  });
}

export function useRevision(id: string) {
  return useQuery({
    queryKey: revisionKeys.detail(id),
    queryFn: async () => unwrap(await api.get<{ revision: RevisionDetail }>(`/revisions/${encodeURIComponent(id)}`)).revision,
    staleTime: revisionStaleTimes.detail,
    retry: shouldRetry,
    enabled: id !== '',
  });
}

/** How a site numbers its revisions (trade letters and numbers, or the team's own prefix and counter). */
export function useRevisionScheme(siteId: string) {
  return useQuery({
    queryKey: revisionKeys.scheme(siteId),
    queryFn: async () => unwrap(await api.get<{ scheme: RevisionScheme }>(`${sitePath(siteId)}/revision-scheme`)).scheme,
    staleTime: revisionStaleTimes.list,
    retry: shouldRetry,
    enabled: siteId !== '',
  });
}

/** Sets the numbering of the site's next revisions; the numbers readiness offers follow it. */
export function useUpdateRevisionScheme(siteId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (scheme: RevisionScheme) => api.request<{ scheme: RevisionScheme }>('PUT', `${sitePath(siteId)}/revision-scheme`, scheme),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      queryClient.setQueryData(revisionKeys.scheme(siteId), result.data.scheme);
      void queryClient.invalidateQueries({ queryKey: revisionKeys.readiness(siteId) });
    },
  });
}

/** Query string of a comparison (the API's defaults apply to what is left out). */
export function comparisonQuery(from: Which | null, to: Which | null, units: UnitSystem): string {
  const q = new URLSearchParams();
  if (from !== null) q.set('from', String(from));
  if (to !== null) q.set('to', String(to));
  q.set('units', units);
  return q.toString();
}

export function useComparison(siteId: string, from: Which | null, to: Which | null, units: UnitSystem, enabled = true) {
  return useQuery({
    queryKey: revisionKeys.comparison(siteId, String(from), String(to), units),
    queryFn: async () => unwrap(await api.get<{ comparison: Comparison }>(`${sitePath(siteId)}/revisions/compare?${comparisonQuery(from, to, units)}`)).comparison,
    staleTime: revisionStaleTimes.comparison,
    retry: shouldRetry,
    enabled: enabled && siteId !== '',
  });
}

/** Anything a revision changes touches its site's list, readiness and comparisons. */
function useInvalidateRevisions() {
  const queryClient = useQueryClient();
  return () => queryClient.invalidateQueries({ queryKey: revisionKeys.all });
}

export function usePrepareRevision(siteId: string) {
  const invalidate = useInvalidateRevisions();
  return useMutation({
    mutationFn: (input: { purpose: RevisionPurpose; description?: string }) => api.post<{ revision: RevisionDetail }>(`${sitePath(siteId)}/revisions`, input),
    onSuccess: (result) => {
      if (result.kind === 'ok') void invalidate();
    },
  });
}

/** Checking or approving: the signer signs the snapshot they reviewed (its hash). */
export function useSignRevision(id: string) {
  const invalidate = useInvalidateRevisions();
  return useMutation({
    mutationFn: ({ as, snapshotHash }: { as: 'check' | 'approve'; snapshotHash: string }) =>
      api.post<{ revision: RevisionDetail }>(`/revisions/${encodeURIComponent(id)}/${as}`, { snapshotHash }),
    onSuccess: (result) => {
      if (result.kind === 'ok') void invalidate();
    },
  });
}

export function useWithdrawRevision() {
  const invalidate = useInvalidateRevisions();
  return useMutation({
    mutationFn: (id: number) => api.del<null>(`/revisions/${id}`),
    onSuccess: (result) => {
      if (result.kind === 'ok') void invalidate();
    },
  });
}
