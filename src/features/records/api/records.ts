import { keepPreviousData, queryOptions, useMutation, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { airframesQueryOptions } from '@/lib/shared-queries';
import type {
  FullRecord,
  RecordExportName,
  RecordPage,
  RecordSearchInput,
  TrailReport,
  Trends,
} from '@shared/schemas/records';

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
    queryKey: queryKeys.records.search(searchParams(filters)),
    queryFn: ({ signal }) => apiGet<RecordPage>(`/records?${searchParams(filters)}`, signal),
    placeholderData: keepPreviousData,
  });
export const useRecords = (filters: RecordSearchInput) => useQuery(recordsQueryOptions(filters));

/** The CSV of one export (a row per check, reading, fluid entry, hold or release) for the same search. */
export const csvHref = (filters: RecordSearchInput, name: RecordExportName = 'checks') => {
  const { page: _page, pageSize: _size, ...rest } = filters;
  return `/api/records/exports/${name}.csv?${searchParams(rest)}`;
};

/** The printable record (PDF) of one signed check, made on the server from its signed content. */
export const checkPdfHref = (checkId: string) => `/api/records/checks/${encodeURIComponent(checkId)}.pdf`;

export const recordQueryOptions = (checkId: string) =>
  queryOptions({
    queryKey: queryKeys.records.one(checkId),
    queryFn: ({ signal }) => apiGet<FullRecord>(`/records/${checkId}`, signal),
  });
export const useFullRecord = (checkId: string) => useQuery(recordQueryOptions(checkId));

export const trendsQueryOptions = (airframeId: number | null, days: number) =>
  queryOptions({
    queryKey: queryKeys.records.trends(airframeId, days),
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
    queryKey: queryKeys.records.auditEvents,
    queryFn: ({ signal }) => apiGet<AuditEventRow[]>('/audit/events?limit=50', signal),
  });
export const useAuditEvents = () => useQuery(auditEventsQueryOptions());

export const useVerifyTrail = () => useMutation({ mutationFn: () => apiGet<TrailReport>('/audit/verify') });

/** Airframes for the records and trends pickers; shift leads may not read the engineering fleet list. */
export interface AirframeOption {
  id: number;
  fleetNumber: string;
}
export const useAirframeOptions = () =>
  useQuery({
    ...airframesQueryOptions(),
    select: (airframes): AirframeOption[] =>
      airframes
        .map((a) => ({ id: a.id, fleetNumber: a.fleetNumber }))
        .sort((a, b) => a.fleetNumber.localeCompare(b.fleetNumber)),
  });
