import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HoldDetail } from '@shared/schemas/holds';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getHold = (id: number, signal?: AbortSignal) => apiGet<HoldDetail>(`/holds/${id}`, signal);

export const holdQueryOptions = (id: number) =>
  queryOptions({
    queryKey: queryKeys.holds.one(id),
    queryFn: ({ signal }) => getHold(id, signal),
  });

/** A re-check is signed on a kiosk elsewhere, so the readiness list refreshes by itself. */
export const useHold = (id: number) => useQuery({ ...holdQueryOptions(id), refetchInterval: 10_000 });
