import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BoardLinkInfo } from '@shared/schemas/board-links';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export const getBoardLinks = (signal?: AbortSignal) => apiGet<BoardLinkInfo[]>('/board-links', signal);

export const boardLinksQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.boardLinks, queryFn: ({ signal }) => getBoardLinks(signal) });

export const useBoardLinks = () => useQuery(boardLinksQueryOptions());
