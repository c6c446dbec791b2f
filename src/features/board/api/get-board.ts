import { useQuery } from '@tanstack/react-query';
import { ApiRequestError } from '@/lib/api-client';
import { airframesQueryOptions } from '@/lib/shared-queries';

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
    ...airframesQueryOptions(boardToken),
    staleTime: 0,
    retry: false,
    refetchInterval: (query) => (isDeadBoardLink(query.state.error) ? false : polling ? 5_000 : 15_000),
    refetchIntervalInBackground: true,
  });
