import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';

export interface ResolvedTag {
  airframeId: number;
  fleetNumber: string;
}

export const getTag = (token: string, signal?: AbortSignal) =>
  apiGet<ResolvedTag>(`/tags/${encodeURIComponent(token)}`, signal);

export const tagQueryOptions = (token: string) =>
  queryOptions({
    queryKey: ['tags', token] as const,
    queryFn: ({ signal }) => getTag(token, signal),
    staleTime: 60_000,
  });

export const useTag = (token: string, enabled = true) => useQuery({ ...tagQueryOptions(token), enabled });
