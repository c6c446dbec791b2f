import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HoldQueueItem } from '@shared/schemas/holds';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

/** Oldest first: the hold that has waited longest is the one to look at next. */
export const getHolds = async (signal?: AbortSignal) =>
  (await apiGet<HoldQueueItem[]>('/holds', signal)).sort((a, b) => a.openedAt.localeCompare(b.openedAt));

export const holdsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.holds.all, queryFn: ({ signal }) => getHolds(signal) });

export const useHolds = () => useQuery({ ...holdsQueryOptions(), refetchInterval: 15_000 });
