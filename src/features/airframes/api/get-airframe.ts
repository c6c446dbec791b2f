import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getAirframe = (id: number, signal?: AbortSignal) =>
  apiGet<AirframeSummary>(`/airframes/${id}`, signal);

export const airframeQueryOptions = (id: number) =>
  queryOptions({ queryKey: queryKeys.airframes.one(id), queryFn: ({ signal }) => getAirframe(id, signal) });

export const useAirframe = (id: number, enabled = true) =>
  useQuery({ ...airframeQueryOptions(id), enabled, staleTime: 0 });
