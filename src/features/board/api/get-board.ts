import { useEffect, useState } from 'react';
import { useQuery } from '@tanstack/react-query';
import type { AirframeSummary } from '@shared/schemas/airframes';
import { ApiRequestError } from '@/lib/api-client';
import { airframesQueryOptions } from '@/lib/shared-queries';

/** A revoked or unknown link will not start working again by asking; a TV asking forever only adds noise. */
export const isDeadBoardLink = (error: unknown) =>
  error instanceof ApiRequestError &&
  (error.code === 'board_link_revoked' || error.code === 'board_link_unknown');

interface KeptBoard {
  at: number;
  airframes: AirframeSummary[];
}

const keptKey = (boardToken: string | null, bases: string | null) =>
  `gw.board.last.${boardToken ?? 'signed-in'}${bases ? `.${bases}` : ''}`;

/** The last board this screen showed, so a reload while the server is down still shows it, marked stale. */
function keptBoard(boardToken: string | null, bases: string | null): KeptBoard | undefined {
  try {
    const kept = JSON.parse(localStorage.getItem(keptKey(boardToken, bases)) ?? 'null') as KeptBoard | null;
    return kept && Array.isArray(kept.airframes) && typeof kept.at === 'number' ? kept : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Polls every 5 s while the event stream is down; while it is up the stream says when to fetch, and a slow
 * poll still proves the server (and the board link) alive, so a quiet hangar is not shown as stale.
 */
export function useBoard(polling: boolean, boardToken: string | null = null, bases: string | null = null) {
  // Read once per board: the board re-renders every few seconds and the copy can hold hundreds of airframes.
  const [kept] = useState(() => keptBoard(boardToken, bases));
  const board = useQuery({
    ...airframesQueryOptions(boardToken, bases),
    staleTime: 0,
    retry: false,
    refetchInterval: (query) => (isDeadBoardLink(query.state.error) ? false : polling ? 5_000 : 15_000),
    refetchIntervalInBackground: true,
    initialData: kept?.airframes,
    initialDataUpdatedAt: kept?.at,
  });
  const { data, dataUpdatedAt, error } = board;
  useEffect(() => {
    try {
      // A link that stopped working forgets what it showed: a revoked TV must not go on showing the fleet.
      if (isDeadBoardLink(error)) localStorage.removeItem(keptKey(boardToken, bases));
      else if (data && dataUpdatedAt > (kept?.at ?? 0))
        localStorage.setItem(
          keptKey(boardToken, bases),
          JSON.stringify({ at: dataUpdatedAt, airframes: data }),
        );
    } catch {
      // A full or blocked storage only loses the copy for the next reload.
    }
  }, [data, dataUpdatedAt, error, boardToken, bases, kept?.at]);
  return board;
}
