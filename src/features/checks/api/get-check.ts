import { queryOptions, useQuery } from '@tanstack/react-query';
import type { StoredCheck } from '@shared/schemas/checks';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getCheck = (id: string, signal?: AbortSignal) => apiGet<StoredCheck>(`/checks/${id}`, signal);

export const checkQueryOptions = (id: string) =>
  queryOptions({
    queryKey: queryKeys.checks.one(id),
    queryFn: ({ signal }) => getCheck(id, signal),
    staleTime: Infinity,
  });

export const useCheck = (id: string) => useQuery(checkQueryOptions(id));
