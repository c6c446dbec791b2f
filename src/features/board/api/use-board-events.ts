import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { boardQueryOptions } from './get-board';

/** Listens to /api/board/events and refetches the board on each change; reports whether the stream is up. */
export function useBoardEvents(enabled: boolean): { streaming: boolean } {
  const queryClient = useQueryClient();
  const [streaming, setStreaming] = useState(false);
  useEffect(() => {
    if (!enabled || typeof EventSource === 'undefined') return;
    const source = new EventSource('/api/board/events', { withCredentials: true });
    const refetch = () => void queryClient.invalidateQueries({ queryKey: boardQueryOptions().queryKey });
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
  }, [enabled, queryClient]);
  return { streaming };
}
