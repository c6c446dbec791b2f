import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AcceptanceView } from '@shared/schemas/acceptance';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getAcceptanceView = (airframeId: number, signal?: AbortSignal) =>
  apiGet<AcceptanceView>(`/airframes/${airframeId}/acceptance-view`, signal);

export const acceptanceViewQueryOptions = (airframeId: number) =>
  queryOptions({
    queryKey: queryKeys.airframes.acceptanceView(airframeId),
    queryFn: ({ signal }) => getAcceptanceView(airframeId, signal),
    staleTime: 0,
  });

/** A hold opened or a check expiring changes what the pilot may accept, so the view keeps itself fresh. */
export const useAcceptanceView = (airframeId: number) =>
  useQuery({ ...acceptanceViewQueryOptions(airframeId), refetchInterval: 15_000 });
