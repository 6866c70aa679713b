import { useInfiniteQuery, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import type { RegisterVerdict } from '../../shared/calc/register';
import type {
  AssignInput,
  EntryCreateInput,
  EntryPatchInput,
  MadeSafeInput,
  ReasonInput,
  RegisterPerson,
  RegisterRow,
  RegisterStatus,
  RegisterTransition,
  VerifyInput,
} from '../../shared/schemas/register';
import { REGISTER_TRANSITIONS } from '../../shared/schemas/register';

import { api, shouldRetry, toProblem, unwrap, type ApiResult } from './client';
import { staleTimes } from './stale-times';

/** Shapes of the register's answers (docs/api.md, "Surface register"). */

export type { RegisterRow };
export type Person = RegisterPerson;

export interface RegisterPhoto {
  id: number;
  url: string;
  thumbnailUrl: string;
  width: number;
  height: number;
  bytes: number;
  takenAt: string | null;
  location: { latitude: number; longitude: number } | null;
  uploadedBy: Person | null;
  createdAt: string;
}

export interface RegisterHistoryItem {
  id: number;
  action: string;
  fromStatus: RegisterStatus | null;
  toStatus: RegisterStatus | null;
  changes: Record<string, { from: unknown; to: unknown }>;
  note: string;
  by: Person | null;
  at: string;
}

export interface RegisterEntry extends RegisterRow {
  id: number;
  status: RegisterStatus;
  version: number;
  verification: RegisterVerdict | null;
  photos: RegisterPhoto[];
  comments: { id: number; body: string; author: Person | null; createdAt: string }[];
  history: RegisterHistoryItem[];
  /** What the signed-in person may do now: workflow steps and `edit`, `addPhoto`, `removePhoto`, `comment`. */
  allowed: string[];
}

export type RegisterCounts = Record<'open' | 'actionAssigned' | 'madeSafe' | 'verified' | 'accepted' | 'overdue' | 'calculated' | 'fail', number>;

export interface RegisterPage {
  entries: RegisterRow[];
  nextCursor: string | null;
  counts: RegisterCounts;
}

/** List filters as the API takes them (every value text). */
export type RegisterFilters = {
  siteId?: string;
  status?: string;
  ownerId?: string;
  overdue?: 'true' | 'false';
  verdict?: 'fail' | 'caution' | 'pass';
  source?: 'measured' | 'calculated';
  q?: string;
};

export const registerKeys = {
  all: ['register'] as const,
  lists: () => [...registerKeys.all, 'list'] as const,
  list: (filters: RegisterFilters) => [...registerKeys.lists(), filters] as const,
  detail: (id: number | string) => [...registerKeys.all, 'detail', String(id)] as const,
  settings: () => [...registerKeys.all, 'settings'] as const,
};

/** The query string of a set of filters (empty values left out). */
export function filterQuery(filters: RegisterFilters, extra: Record<string, string> = {}): string {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries({ ...filters, ...extra })) if (v !== undefined && v !== '') params.set(k, v);
  const s = params.toString();
  return s ? `?${s}` : '';
}

/** Where the register downloads from, with the list's filters. */
export const exportUrl = (kind: 'csv' | 'pdf', filters: RegisterFilters) => `/api/v1/register/export.${kind}${filterQuery(filters)}`;

export const PAGE_SIZE = 100;

export function useRegister(filters: RegisterFilters, enabled = true) {
  return useInfiniteQuery({
    queryKey: registerKeys.list(filters),
    queryFn: async ({ pageParam }) =>
      unwrap(await api.get<RegisterPage>(`/register${filterQuery(filters, { limit: String(PAGE_SIZE), ...(pageParam ? { cursor: pageParam } : {}) })}`)),
    initialPageParam: null as string | null,
    getNextPageParam: (last) => last.nextCursor,
    staleTime: staleTimes.register,
    retry: shouldRetry,
    enabled,
  });
}

export function useRegisterEntry(id: number | string) {
  return useQuery({
    queryKey: registerKeys.detail(id),
    queryFn: async () => unwrap(await api.get<{ entry: RegisterEntry }>(`/register/entries/${encodeURIComponent(String(id))}`)).entry,
    staleTime: staleTimes.register,
    retry: shouldRetry,
    enabled: String(id) !== '',
  });
}

/**
 * A multipart request with the session's CSRF token (the JSON client cannot send files). Answers the same
 * result union as the client.
 */
export async function postForm<T>(path: string, form: FormData, doFetch: typeof fetch = globalThis.fetch): Promise<ApiResult<T>> {
  const send = async () => {
    const token = api.getCsrfToken();
    return doFetch(`/api/v1${path}`, {
      method: 'POST',
      headers: { Accept: 'application/json', ...(token ? { 'X-CSRF-Token': token } : {}) },
      credentials: 'same-origin',
      body: form,
    });
  };
  let response: Response;
  try {
    response = await send();
    if (response.status === 403) {
      const first = await response.clone().json().catch(() => null);
      if ((first as { errors?: { code?: string }[] } | null)?.errors?.[0]?.code === 'CSRF_FAILED') {
        // A fresh token for the session (it may have rotated), then once more.
        const session = await api.get<{ csrfToken?: string }>('/auth/session');
        if (session.kind === 'ok') response = await send();
      }
    }
  } catch {
    return { kind: 'network', code: 'NETWORK', message: 'We could not reach Lagline. Check your connection and try again.' };
  }
  let data: unknown = null;
  try {
    const text = await response.text();
    data = text ? JSON.parse(text) : null;
  } catch {
    data = null;
  }
  if (response.ok) return { kind: 'ok', data: data as T, status: response.status };
  return toProblem(response.status, data, response.headers);
}

/** A photo as the browser hands it over. */
export type PickedPhoto = { file: Blob; name: string };

function useRegisterMutation<I>(fn: (input: I) => Promise<ApiResult<{ entry: RegisterEntry }>>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      queryClient.setQueryData(registerKeys.detail(result.data.entry.id), result.data.entry);
      void queryClient.invalidateQueries({ queryKey: registerKeys.lists() });
    },
  });
}

/** Creates an entry, with its photos in the same request (all stored or none). */
export function useCreateEntry(siteId: number | string) {
  return useRegisterMutation(({ entry, photos }: { entry: EntryCreateInput; photos: PickedPhoto[] }) => {
    const path = `/sites/${encodeURIComponent(String(siteId))}/register`;
    if (photos.length === 0) return api.post<{ entry: RegisterEntry }>(path, entry);
    const form = new FormData();
    form.append('entry', JSON.stringify(entry));
    for (const p of photos) form.append('photos', p.file, p.name);
    return postForm<{ entry: RegisterEntry }>(path, form);
  });
}

export function useUpdateEntry(id: number) {
  return useRegisterMutation((patch: EntryPatchInput) => api.patch<{ entry: RegisterEntry }>(`/register/entries/${id}`, patch));
}

export type StepInput = { assign: AssignInput; madeSafe: MadeSafeInput; verify: VerifyInput; sendBack: ReasonInput; accept: ReasonInput; reopen: ReasonInput };

export function useRegisterStep(id: number) {
  return useRegisterMutation(({ name, body }: { name: RegisterTransition; body: StepInput[RegisterTransition] }) =>
    api.post<{ entry: RegisterEntry }>(`/register/entries/${id}/${REGISTER_TRANSITIONS[name].path}`, body),
  );
}

export function useAddComment(id: number) {
  return useRegisterMutation((body: string) => api.post<{ entry: RegisterEntry }>(`/register/entries/${id}/comments`, { body }));
}

export function useAddPhotos(id: number) {
  return useRegisterMutation((photos: PickedPhoto[]) => {
    const form = new FormData();
    for (const p of photos) form.append('photos', p.file, p.name);
    return postForm<{ entry: RegisterEntry }>(`/register/entries/${id}/photos`, form);
  });
}

export function useDeletePhoto(entryId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (photoId: number) => api.del<null>(`/register/photos/${photoId}`),
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      void queryClient.invalidateQueries({ queryKey: registerKeys.detail(entryId) });
      void queryClient.invalidateQueries({ queryKey: registerKeys.lists() });
    },
  });
}

export function useRegisterSettings(enabled = true) {
  return useQuery({
    queryKey: registerKeys.settings(),
    queryFn: async () => unwrap(await api.get<{ settings: { keepPhotoLocation: boolean } }>('/register/settings')).settings,
    staleTime: staleTimes.register,
    retry: shouldRetry,
    enabled,
  });
}
