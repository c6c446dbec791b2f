import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '@shared/schemas/airframes';
import type { TypeSummary } from '@shared/schemas/engineering-types';
import type { Tool } from '@shared/schemas/tools';
import { boardQuery } from '@shared/schemas/board-address';
import { apiGet, apiGetRevalidated } from './api-client';
import { queryKeys } from './query-keys';

// Reads that several features show. A feature never imports another, so they live here, one cache entry each.

export const getAirframes = (
  boardToken: string | null = null,
  signal?: AbortSignal,
  bases: string | null = null,
) => apiGetRevalidated<AirframeSummary[]>(`/airframes${boardQuery(boardToken, bases)}`, signal);

/** `GET /api/airframes`: the kiosk's picker, the pilot's list, the board, the tech log and the record filters. */
export const airframesQueryOptions = (boardToken: string | null = null, bases: string | null = null) =>
  queryOptions({
    queryKey: queryKeys.airframes.list(boardToken, bases),
    queryFn: ({ signal }) => getAirframes(boardToken, signal, bases),
  });

/** A finding signed on another tablet changes what this one must show, so the list keeps itself fresh. */
export const useAirframes = () => useQuery({ ...airframesQueryOptions(), refetchInterval: 15_000 });

export const typesQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.types.all,
    queryFn: ({ signal }) => apiGet<TypeSummary[]>('/types', signal),
  });
export const useTypes = () => useQuery(typesQueryOptions());

/** `GET /api/tools`: engineering's register page and the kiosk's tool pickers. */
export const toolsQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.tools,
    queryFn: ({ signal }) => apiGet<Tool[]>('/tools', signal),
  });
export const useTools = () => useQuery(toolsQueryOptions());
