import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OpenDraft } from '@shared/schemas/checks';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getOpenDrafts = (signal?: AbortSignal) => apiGet<OpenDraft[]>('/check-drafts', signal);

export const openDraftsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.checks.drafts, queryFn: ({ signal }) => getOpenDrafts(signal) });

export const useOpenDrafts = () => useQuery({ ...openDraftsQueryOptions(), refetchInterval: 15_000 });
