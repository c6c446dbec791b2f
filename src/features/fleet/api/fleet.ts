import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';
import type { AirframeInput, FleetAirframe, TagSheetEntry } from '@shared/schemas/fleet';

export const fleetQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.fleet.airframes,
    queryFn: ({ signal }) => apiGet<FleetAirframe[]>('/fleet/airframes', signal),
  });
export const useFleet = () => useQuery(fleetQueryOptions());

export const basesQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.fleet.bases,
    queryFn: ({ signal }) => apiGet<{ id: number; code: string; name: string }[]>('/fleet/bases', signal),
    staleTime: 5 * 60_000,
  });
export const useBases = () => useQuery(basesQueryOptions());

export const tagSheetQueryOptions = (ids: number[] | null) =>
  queryOptions({
    queryKey: queryKeys.fleet.tagSheet(ids),
    queryFn: ({ signal }) =>
      apiGet<TagSheetEntry[]>(`/fleet/tag-sheet${ids ? `?ids=${ids.join(',')}` : ''}`, signal),
  });
export const useTagSheet = (ids: number[] | null) => useQuery(tagSheetQueryOptions(ids));

// An airframe added or a tag reissued also changes the list every other screen reads.
export const useSaveAirframe = () =>
  useRefreshingMutation(
    ({ id, input }: { id: number | null; input: AirframeInput }) =>
      apiPost<{ id: number }>(id === null ? '/fleet/airframes' : `/fleet/airframes/${id}`, input),
    queryKeys.fleet.all,
    queryKeys.airframes.all,
  );

export const useReissueTag = () =>
  useRefreshingMutation(
    (airframeId: number) =>
      apiPost<{ airframeId: number; tag: { shortCode: string }; revoked: number }>(
        `/fleet/airframes/${airframeId}/reissue-tag`,
      ),
    queryKeys.fleet.all,
    queryKeys.airframes.all,
  );
