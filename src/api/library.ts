import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';

import { sizingLibrary } from '../../shared/calc/sizing/library';
import type { SizingLibraryData } from '../../shared/calc/sizing/types';
import type { TeamFinishCreateInput, TeamFinishPatchInput, TeamMaterialCreateInput, TeamMaterialPatchInput } from '../../shared/schemas/lines';

import { api, shouldRetry, unwrap, type ApiResult } from './client';
import { lineKeys } from './lines';
import type { ConductivityFitView, LibraryPayload, TeamFinish, TeamMaterial } from './types';

/** The library changes rarely, and only through the team's own edits. */
export const libraryStaleTime = 5 * 60_000;

export const libraryKeys = {
  all: ['library'] as const,
  detail: () => [...libraryKeys.all, 'detail'] as const,
};

/** Built-in materials and finishes with their sources, and the team's own. */
export function useLibrary() {
  return useQuery({
    queryKey: libraryKeys.detail(),
    queryFn: async () => unwrap(await api.get<LibraryPayload>('/library')),
    staleTime: libraryStaleTime,
    retry: shouldRetry,
  });
}

/**
 * The library as sizing uses it (the same shapes the server's job builds): the built-in entries plus the
 * team's, whose k(T) data range is the span of their table points.
 */
export function sizingLibraryOf(payload: Pick<LibraryPayload, 'teamMaterials' | 'teamFinishes'>): SizingLibraryData {
  return sizingLibrary({
    materials: payload.teamMaterials.map((m) => {
      const temps = m.tablePoints.map((p) => p.meanTemperatureC);
      return {
        id: m.materialId,
        name: m.name,
        conductivity: m.conductivity,
        maxServiceTemperatureC: m.maxServiceTemperatureC,
        minServiceTemperatureC: m.minServiceTemperatureC,
        conductivityDataRangeC: [Math.min(...temps), Math.max(...temps)] as [number, number],
      };
    }),
    finishes: payload.teamFinishes.map((f) => ({ id: f.finishId, name: f.name, emissivity: f.emissivity, emissivityRange: f.emissivityRange, contactMaterial: f.contactMaterial })),
  });
}

/** A library edit can change the numbers of every site: the library and every line list refresh. */
function useLibraryMutation<I, T>(fn: (input: I) => Promise<ApiResult<T>>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (result) => {
      if (result.kind !== 'ok') return;
      void queryClient.invalidateQueries({ queryKey: libraryKeys.all });
      void queryClient.invalidateQueries({ queryKey: lineKeys.all });
    },
  });
}

type MaterialAnswer = { material: TeamMaterial; fit: ConductivityFitView };

export function useCreateTeamMaterial() {
  return useLibraryMutation((input: TeamMaterialCreateInput) => api.post<MaterialAnswer>('/library/materials', input));
}

export function useUpdateTeamMaterial() {
  return useLibraryMutation((input: { id: number; patch: TeamMaterialPatchInput }) => api.patch<MaterialAnswer>(`/library/materials/${input.id}`, input.patch));
}

export function useDeleteTeamMaterial() {
  return useLibraryMutation((id: number) => api.del<null>(`/library/materials/${id}`));
}

export function useCreateTeamFinish() {
  return useLibraryMutation((input: TeamFinishCreateInput) => api.post<{ finish: TeamFinish }>('/library/finishes', input));
}

export function useUpdateTeamFinish() {
  return useLibraryMutation((input: { id: number; patch: TeamFinishPatchInput }) => api.patch<{ finish: TeamFinish }>(`/library/finishes/${input.id}`, input.patch));
}

export function useDeleteTeamFinish() {
  return useLibraryMutation((id: number) => api.del<null>(`/library/finishes/${id}`));
}
