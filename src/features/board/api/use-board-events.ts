import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { queryKeys } from '@/lib/query-keys';
import { boardQuery } from '@shared/schemas/board-address';

/** Listens to /api/board/events and refetches the board on each change; reports whether the stream is up. */
export function useBoardEvents(enabled: boolean, boardToken: string | null = null): { streaming: boolean } {
  const queryClient = useQueryClient();
  const [streaming, setStreaming] = useState(false);
  useEffect(() => {
    if (!enabled || typeof EventSource === 'undefined') return;
    // EventSource cannot send headers, so a board link rides in the query string.
    const source = new EventSource(`/api/board/events${boardQuery(boardToken)}`, { withCredentials: true });
    const refetch = () =>
      void queryClient.invalidateQueries({ queryKey: queryKeys.airframes.list(boardToken) });
    const up = () => {
      setStreaming(true);
      // Anything may have changed while the stream was down.
      refetch();
    };
    source.addEventListener('hello', up);
    source.addEventListener('change', refetch);
    source.onerror = () => setStreaming(false);
    return () => {
      source.close();
      setStreaming(false);
    };
  }, [enabled, boardToken, queryClient]);
  return { streaming };
}
