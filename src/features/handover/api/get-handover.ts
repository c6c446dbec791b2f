import { queryOptions, useQuery } from '@tanstack/react-query';
import type { HandoverSummary } from '@shared/schemas/handover';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export interface ShiftWindow {
  from: string;
  to: string;
}

export const getHandover = (window: ShiftWindow, signal?: AbortSignal) =>
  apiGet<HandoverSummary>(
    `/handover?${new URLSearchParams({ from: window.from, to: window.to }).toString()}`,
    signal,
  );

export const handoverQueryOptions = (window: ShiftWindow) =>
  queryOptions({
    queryKey: queryKeys.handover(window.from, window.to),
    queryFn: ({ signal }) => getHandover(window, signal),
  });

export const useHandover = (window: ShiftWindow) => useQuery(handoverQueryOptions(window));
