import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DefectView } from '@shared/schemas/defects';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getAirframeDefects = (airframeId: number, signal?: AbortSignal) =>
  apiGet<DefectView[]>(`/airframes/${airframeId}/defects`, signal);

export const airframeDefectsQueryOptions = (airframeId: number) =>
  queryOptions({
    queryKey: queryKeys.airframes.defects(airframeId),
    queryFn: ({ signal }) => getAirframeDefects(airframeId, signal),
  });

/** Newest first: the defect just raised or acted on is at the top. */
export const useAirframeDefects = (airframeId: number) =>
  useQuery({
    ...airframeDefectsQueryOptions(airframeId),
    select: (defects) => [...defects].sort((a, b) => b.number - a.number),
    refetchInterval: 15_000,
  });
