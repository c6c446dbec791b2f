import { keepPreviousData, queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { FullRecord, RecordPage, RecordSearchInput, TrailReport, Trends } from '@shared/schemas/records';

/** The same query string feeds the JSON search and the CSV export, so both see the same rows. */
export function searchParams(filters: RecordSearchInput): string {
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(filters)) {
    if (value !== undefined && value !== null && value !== '') params.set(key, String(value));
  }
  return params.toString();
}

export const recordsQueryOptions = (filters: RecordSearchInput) =>
  queryOptions({
    queryKey: ['records', 'search', searchParams(filters)] as const,
    queryFn: ({ signal }) => apiGet<RecordPage>(`/records?${searchParams(filters)}`, signal),
    placeholderData: keepPreviousData,
  });
export const useRecords = (filters: RecordSearchInput) => useQuery(recordsQueryOptions(filters));

export const csvHref = (filters: RecordSearchInput) => {
  const { page: _page, pageSize: _size, ...rest } = filters;
  return `/api/records.csv?${searchParams(rest)}`;
};

export const recordQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: ['records', 'check', checkId] as const,
    queryFn: ({ signal }) => apiGet<FullRecord>(`/records/${checkId}`, signal),
  });
export const useFullRecord = (checkId: string) => useQuery(recordQueryOptions(checkId));

export const trendsQueryOptions = (airframeId: number | null, days: number) =>
  queryOptions({
    queryKey: ['trends', airframeId, days] as const,
    queryFn: ({ signal }) => apiGet<Trends>(`/trends?airframeId=${airframeId}&days=${days}`, signal),
    enabled: airframeId !== null,
  });
export const useTrends = (airframeId: number | null, days: number) =>
  useQuery(trendsQueryOptions(airframeId, days));

export interface AuditEventRow {
  id: number;
  at: string;
  actor: string | null;
  action: string;
  entity: string;
  entityId: string;
  hash: string;
}
export const auditEventsQueryOptions = () =>
  queryOptions({
    queryKey: ['audit', 'events'] as const,
    queryFn: ({ signal }) => apiGet<AuditEventRow[]>('/audit/events?limit=50', signal),
  });
export const useAuditEvents = () => useQuery(auditEventsQueryOptions());

export const useVerifyTrail = () => useMutation({ mutationFn: () => apiGet<TrailReport>('/audit/verify') });

/** Airframes for the records and trends pickers; shift leads may not read the engineering fleet list. */
export interface AirframeOption {
  id: number;
  fleetNumber: string;
}
export const airframeOptionsQueryOptions = () =>
  queryOptions({
    queryKey: ['airframes', 'options'] as const,
    queryFn: async ({ signal }) =>
      (await apiGet<AirframeOption[]>('/airframes', signal))
        .map((a) => ({ id: a.id, fleetNumber: a.fleetNumber }))
        .sort((a, b) => a.fleetNumber.localeCompare(b.fleetNumber)),
  });
export const useAirframeOptions = () => useQuery(airframeOptionsQueryOptions());
