import { keepPreviousData, useInfiniteQuery, useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';

import type { BulkEditInput, SizingSettingsInput } from '../../shared/schemas/lines';

import { api, shouldRetry, unwrap, type ApiResult } from './client';
import type { Item, ItemKind, ItemOf, ItemPage, ListFilters, SiteOverview, SizingSettingsPayload } from './types';

/** Rows fetched per page of a line list (the API allows up to 1000). */
export const LIST_PAGE_SIZE = 500;

/** How long line-list data counts as fresh [ms]. Sizing jobs and edits invalidate it directly. */
export const lineStaleTimes = {
  /** A page of a site's lines or vessels. */
  list: 30_000,
  /** One line or vessel with its stored result. */
  item: 30_000,
  /** A site's totals. */
  overview: 30_000,
  /** A site's thickness series and default build-ups. */
  settings: 60_000,
} as const;

const PLURAL: Record<ItemKind, 'lines' | 'vessels'> = { line: 'lines', vessel: 'vessels' };

/** Filters in one canonical form, so equal filters share a cache entry. */
export function normaliseFilters(f: ListFilters): ListFilters {
  const out: ListFilters = {};
  const q = f.q?.trim();
  if (q) out.q = q;
  if (f.purpose) out.purpose = f.purpose;
  if (f.location) out.location = f.location;
  if (f.status) out.status = f.status;
  if (f.sort && f.sort !== 'tag') out.sort = f.sort;
  if (f.descending) out.descending = true;
  return out;
}

export const lineKeys = {
  all: ['line-lists'] as const,
  site: (siteId: number | string) => [...lineKeys.all, 'site', String(siteId)] as const,
  lists: (siteId: number | string, kind: ItemKind) => [...lineKeys.site(siteId), kind, 'list'] as const,
  list: (siteId: number | string, kind: ItemKind, filters: ListFilters) => [...lineKeys.lists(siteId, kind), normaliseFilters(filters)] as const,
  overview: (siteId: number | string) => [...lineKeys.site(siteId), 'overview'] as const,
  settings: (siteId: number | string) => [...lineKeys.site(siteId), 'sizing-settings'] as const,
  items: () => [...lineKeys.all, 'item'] as const,
  item: (kind: ItemKind, id: number | string) => [...lineKeys.items(), kind, String(id)] as const,
};

const enc = (v: number | string) => encodeURIComponent(String(v));

/** The list request's path: filters, sort (a leading "-" descends), page size and cursor. */
export function listPath(siteId: number | string, kind: ItemKind, filters: ListFilters, cursor?: string | null, limit = LIST_PAGE_SIZE): string {
  const f = normaliseFilters(filters);
  const params = new URLSearchParams();
  params.set('limit', String(limit));
  if (cursor) params.set('cursor', cursor);
  if (f.q) params.set('q', f.q);
  if (f.purpose) params.set('purpose', f.purpose);
  if (f.location) params.set('location', f.location);
  if (f.status) params.set('status', f.status);
  if (f.sort || f.descending) params.set('sort', `${f.descending ? '-' : ''}${f.sort ?? 'tag'}`);
  return `/sites/${enc(siteId)}/${PLURAL[kind]}?${params.toString()}`;
}

export const itemPath = (kind: ItemKind, id: number | string) => `/${PLURAL[kind]}/${enc(id)}`;

/** A site's lines or vessels, paged with the API's cursor; `fetchNextPage` loads the next page. */
export function useItemList<K extends ItemKind>(siteId: number | string, kind: K, filters: ListFilters) {
  return useInfiniteQuery({
    queryKey: lineKeys.list(siteId, kind, filters),
    queryFn: async ({ pageParam }): Promise<ItemPage<K>> => {
      const body = unwrap(await api.get<Record<string, unknown>>(listPath(siteId, kind, filters, pageParam)));
      return { items: (body[PLURAL[kind]] as ItemOf<K>[]) ?? [], nextCursor: (body.nextCursor as string | null) ?? null };
    },
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    // A new search, filter or sort keeps the rows shown until its own arrive (no flash, focus stays put).
    placeholderData: keepPreviousData,
    staleTime: lineStaleTimes.list,
    retry: shouldRetry,
    enabled: String(siteId) !== '',
  });
}

/** One line or vessel with its whole stored sizing outcome. */
export function useItem<K extends ItemKind>(kind: K, id: number | string) {
  return useQuery({
    queryKey: lineKeys.item(kind, id),
    queryFn: async () => unwrap(await api.get<Record<string, ItemOf<K>>>(itemPath(kind, id)))[kind],
    staleTime: lineStaleTimes.item,
    retry: shouldRetry,
    enabled: String(id) !== '',
  });
}

/** After any change to a site's items: its lists, totals and every open item refresh. */
export function invalidateSiteItems(queryClient: QueryClient, siteId: number | string) {
  void queryClient.invalidateQueries({ queryKey: lineKeys.site(siteId) });
  void queryClient.invalidateQueries({ queryKey: lineKeys.items() });
}

/** The create body of a line or vessel (SI, shapes of shared/schemas/lines). */
export type ItemInput = Record<string, unknown>;

export function useCreateItem(siteId: number | string, kind: ItemKind) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ItemInput) => api.post<Record<string, Item>>(`/sites/${enc(siteId)}/${PLURAL[kind]}`, input),
    onSuccess: (result) => {
      if (result.kind === 'ok') invalidateSiteItems(queryClient, siteId);
    },
  });
}

/** Creates a line or vessel in a site picked at the time (quick sizing's "save to a site"). */
export function useCreateItemInSite() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ siteId, kind, input }: { siteId: number | string; kind: ItemKind; input: ItemInput }) =>
      api.post<Record<string, Item>>(`/sites/${enc(siteId)}/${PLURAL[kind]}`, input),
    onSuccess: (result, { siteId }) => {
      if (result.kind === 'ok') invalidateSiteItems(queryClient, siteId);
    },
  });
}

export function useUpdateItem(kind: ItemKind, id: number | string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: ItemInput) => api.patch<Record<string, Item>>(itemPath(kind, id), patch),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      const item = result.data[kind];
      if (item) invalidateSiteItems(queryClient, item.siteId);
    },
  });
}

export function useDeleteItem(kind: ItemKind, siteId: number | string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number | string) => api.del<null>(itemPath(kind, id)),
    onSuccess: (result, id) => {
      if (result.kind !== 'ok') return;
      queryClient.removeQueries({ queryKey: lineKeys.item(kind, id) });
      invalidateSiteItems(queryClient, siteId);
    },
  });
}

/** The same purposes and/or build-up for a selection (all or nothing). */
export function useBulkEdit(siteId: number | string, kind: ItemKind) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: BulkEditInput): Promise<ApiResult<{ updated: number; unchanged: number }>> =>
      api.post(`/sites/${enc(siteId)}/${PLURAL[kind]}/bulk`, input),
    onSuccess: (result) => {
      if (result.kind === 'ok') invalidateSiteItems(queryClient, siteId);
    },
  });
}

/** A site's totals: heat loss, energy, cost, CO₂, saving against bare, failing, stale and unsized counts. */
export function useSiteOverview(siteId: number | string) {
  return useQuery({
    queryKey: lineKeys.overview(siteId),
    queryFn: async () => unwrap(await api.get<{ overview: SiteOverview }>(`/sites/${enc(siteId)}/overview`)).overview,
    staleTime: lineStaleTimes.overview,
    retry: shouldRetry,
    enabled: String(siteId) !== '',
  });
}

export function useSizingSettings(siteId: number | string) {
  return useQuery({
    queryKey: lineKeys.settings(siteId),
    queryFn: async () => unwrap(await api.get<{ settings: SizingSettingsPayload }>(`/sites/${enc(siteId)}/sizing-settings`)).settings,
    staleTime: lineStaleTimes.settings,
    retry: shouldRetry,
    enabled: String(siteId) !== '',
  });
}

/** Changes a site's series, rules or default build-ups; the items whose numbers change turn stale. */
export function useUpdateSizingSettings(siteId: number | string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (patch: SizingSettingsInput) => api.patch<{ settings: SizingSettingsPayload }>(`/sites/${enc(siteId)}/sizing-settings`, patch),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      queryClient.setQueryData(lineKeys.settings(siteId), result.data.settings);
      invalidateSiteItems(queryClient, siteId);
    },
  });
}
