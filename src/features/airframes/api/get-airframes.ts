import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { apiGet } from '@/lib/api-client';

export const getAirframes = (signal?: AbortSignal) => apiGet<AirframeSummary[]>('/airframes', signal);

export const airframesQueryOptions = () =>
  queryOptions({ queryKey: ['airframes', 'list'] as const, queryFn: ({ signal }) => getAirframes(signal) });

/** A finding signed on another tablet changes what this one must show, so the list keeps itself fresh. */
export const useAirframes = () => useQuery({ ...airframesQueryOptions(), refetchInterval: 15_000 });
