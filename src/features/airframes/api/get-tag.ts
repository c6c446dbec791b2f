import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export interface ResolvedTag {
  airframeId: number;
  fleetNumber: string;
}

export const getTag = (token: string, signal?: AbortSignal) =>
  apiGet<ResolvedTag>(`/tags/${encodeURIComponent(token)}`, signal);

export const tagQueryOptions = (token: string) =>
  queryOptions({
    queryKey: queryKeys.tags(token),
    queryFn: ({ signal }) => getTag(token, signal),
    staleTime: 60_000,
  });

export const useTag = (token: string, enabled = true) => useQuery({ ...tagQueryOptions(token), enabled });
