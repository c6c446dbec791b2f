import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { ApiRequestError, apiGet } from '@/lib/api-client';

/** `?board=<token>` on a TV with nobody signed in; the server reads it as a read-only board link. */
export const boardQuery = (boardToken: string | null) =>
  boardToken ? `?board=${encodeURIComponent(boardToken)}` : '';

export const getBoard = (boardToken: string | null, signal?: AbortSignal) =>
  apiGet<AirframeSummary[]>(`/airframes${boardQuery(boardToken)}`, signal);

export const boardQueryOptions = (boardToken: string | null = null) =>
  queryOptions({
    queryKey: ['board', boardToken ?? 'session'] as const,
    queryFn: ({ signal }) => getBoard(boardToken, signal),
    staleTime: 0,
    retry: false,
  });

/** A revoked or unknown link will not start working again by asking; a TV asking forever only adds noise. */
export const isDeadBoardLink = (error: unknown) =>
  error instanceof ApiRequestError &&
  (error.code === 'board_link_revoked' || error.code === 'board_link_unknown');

/**
 * Polls every 5 s while the event stream is down; while it is up the stream says when to fetch, and a slow
 * poll still proves the server (and the board link) alive, so a quiet hangar is not shown as stale.
 */
export const useBoard = (polling: boolean, boardToken: string | null = null) =>
  useQuery({
    ...boardQueryOptions(boardToken),
    refetchInterval: (query) => (isDeadBoardLink(query.state.error) ? false : polling ? 5_000 : 15_000),
    refetchIntervalInBackground: true,
  });
