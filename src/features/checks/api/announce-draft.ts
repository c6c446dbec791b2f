import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import type { CheckKind } from '@shared/schemas/limits';
import { queryKeys } from '@/lib/query-keys';
import { apiPost } from '@/lib/api-client';

export const announceDraft = (input: { id: string; airframeId: number; kind: CheckKind }) =>
  apiPost<{ id: string; created: boolean; signed: boolean }>('/check-drafts', input);

// The server forgets a draft untouched for 30 minutes; once a minute keeps "in progress" true without chatter.
const announceEveryMs = 60_000;

/** Tells the hangar board this check is open: once when it starts, then at most once a minute while it stays open. */
export function useDraftAnnouncement(
  draft: { id: string; airframeId: number; kind: CheckKind } | null,
): void {
  const id = draft?.id;
  const airframeId = draft?.airframeId;
  const kind = draft?.kind;
  const queryClient = useQueryClient();
  useEffect(() => {
    if (id === undefined || airframeId === undefined || kind === undefined) return;
    // A dropped network must not stop the check; the next announcement catches up.
    const announce = () =>
      void announceDraft({ id, airframeId, kind })
        .then((answer) => {
          // The airframe now shows "in progress" here too, not only on the board.
          if (answer.created)
            void queryClient.invalidateQueries({ queryKey: queryKeys.airframes.one(airframeId) });
        })
        .catch(() => undefined);
    announce();
    const timer = window.setInterval(announce, announceEveryMs);
    return () => window.clearInterval(timer);
  }, [id, airframeId, kind, queryClient]);
}
