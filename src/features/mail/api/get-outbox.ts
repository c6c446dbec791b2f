import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CaughtMailItem } from '@shared/schemas/mail';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getOutbox = (signal?: AbortSignal) => apiGet<CaughtMailItem[]>('/mail/outbox', signal);

export const outboxQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.mailOutbox, queryFn: ({ signal }) => getOutbox(signal) });

/** Mail is sent in the background after a change, so the page keeps looking for a while. */
export const useOutbox = () => useQuery({ ...outboxQueryOptions(), refetchInterval: 10_000 });
