import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CheckKind } from '@shared/schemas/limits';
import type { CheckCard } from '@shared/schemas/checks';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getCheckCard = (airframeId: number, kind: CheckKind, signal?: AbortSignal) =>
  apiGet<CheckCard>(`/airframes/${airframeId}/cards/${kind}`, signal);

export const checkCardQueryOptions = (airframeId: number, kind: CheckKind) =>
  queryOptions({
    queryKey: queryKeys.airframes.checkCard(airframeId, kind),
    queryFn: ({ signal }) => getCheckCard(airframeId, kind, signal),
    // The card is the limits the readings are judged against; only a 409 from the server replaces it mid-check.
    staleTime: Infinity,
  });

export const useCheckCard = (airframeId: number, kind: CheckKind) =>
  useQuery(checkCardQueryOptions(airframeId, kind));
