import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { apiGet } from '@/lib/api-client';

export const getFleet = (signal?: AbortSignal) => apiGet<AirframeSummary[]>('/airframes', signal);

export const fleetQueryOptions = () =>
  queryOptions({ queryKey: ['airframes', 'pilot-list'] as const, queryFn: ({ signal }) => getFleet(signal) });

export const useFleet = () => useQuery({ ...fleetQueryOptions(), refetchInterval: 15_000 });
