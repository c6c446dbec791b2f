import type { CloseDraftInput } from '@shared/schemas/checks';
import { queryKeys } from '@/lib/query-keys';
import { apiPost } from '@/lib/api-client';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export const closeDraft = (draftId: string, input: CloseDraftInput) =>
  apiPost<unknown>(`/check-drafts/${encodeURIComponent(draftId)}/close`, input);

/** A closed draft no longer holds the airframe "in progress": the lists and the board change with it. */
export const useCloseDraft = () =>
  useRefreshingMutation(
    ({ draftId, input }: { draftId: string; input: CloseDraftInput }) => closeDraft(draftId, input),
    queryKeys.checks.drafts,
    queryKeys.airframes.all,
  );
