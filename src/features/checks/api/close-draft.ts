import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CloseDraftInput } from '@shared/schemas/checks';
import { apiPost } from '@/lib/api-client';
import { openDraftsQueryOptions } from './get-open-drafts';

export const closeDraft = (draftId: string, input: CloseDraftInput) =>
  apiPost<unknown>(`/check-drafts/${encodeURIComponent(draftId)}/close`, input);

/** A closed draft no longer holds the airframe "in progress": the lists and the board change with it. */
export function useCloseDraft() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ draftId, input }: { draftId: string; input: CloseDraftInput }) =>
      closeDraft(draftId, input),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: openDraftsQueryOptions().queryKey });
      void queryClient.invalidateQueries({ queryKey: ['airframes'] });
      void queryClient.invalidateQueries({ queryKey: ['board'] });
    },
  });
}
