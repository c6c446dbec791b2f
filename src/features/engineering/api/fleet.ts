import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import type { AirframeInput, FleetAirframe, TagSheetEntry } from '@shared/schemas/fleet';

export const fleetQueryOptions = () =>
  queryOptions({
    queryKey: ['fleet', 'airframes'] as const,
    queryFn: ({ signal }) => apiGet<FleetAirframe[]>('/fleet/airframes', signal),
  });
export const useFleet = () => useQuery(fleetQueryOptions());

export const basesQueryOptions = () =>
  queryOptions({
    queryKey: ['fleet', 'bases'] as const,
    queryFn: ({ signal }) => apiGet<{ id: number; code: string; name: string }[]>('/fleet/bases', signal),
    staleTime: 5 * 60_000,
  });
export const useBases = () => useQuery(basesQueryOptions());

export const tagSheetQueryOptions = (ids: number[] | null) =>
  queryOptions({
    queryKey: ['fleet', 'tag-sheet', ids?.join(',') ?? 'all'] as const,
    queryFn: ({ signal }) =>
      apiGet<TagSheetEntry[]>(`/fleet/tag-sheet${ids ? `?ids=${ids.join(',')}` : ''}`, signal),
  });
export const useTagSheet = (ids: number[] | null) => useQuery(tagSheetQueryOptions(ids));

export function useSaveAirframe() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number | null; input: AirframeInput }) =>
      apiPost<{ id: number }>(id === null ? '/fleet/airframes' : `/fleet/airframes/${id}`, input),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['fleet'] }),
  });
}

export function useReissueTag() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (airframeId: number) =>
      apiPost<{ airframeId: number; tag: { shortCode: string }; revoked: number }>(
        `/fleet/airframes/${airframeId}/reissue-tag`,
      ),
    onSuccess: () => void qc.invalidateQueries({ queryKey: ['fleet'] }),
  });
}
