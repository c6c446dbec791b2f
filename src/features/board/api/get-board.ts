import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '../../../../shared/schemas/api';
import { apiGet } from '../../../lib/api-client';

export const getBoard = (signal?: AbortSignal) => apiGet<AirframeSummary[]>('/airframes', signal);

export const boardQueryOptions = () =>
  queryOptions({ queryKey: ['board'] as const, queryFn: ({ signal }) => getBoard(signal), staleTime: 0, retry: false });

/** Polls only while the event stream is down; otherwise the stream says when to fetch. */
export const useBoard = (polling: boolean) => useQuery({ ...boardQueryOptions(), refetchInterval: polling ? 5_000 : false, refetchIntervalInBackground: true });
