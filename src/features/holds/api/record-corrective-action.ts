import type { CorrectiveActionInput } from '@shared/schemas/holds';
import type { CorrectiveActionRecord } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export const recordCorrectiveAction = (holdId: number, input: CorrectiveActionInput) =>
  apiPost<CorrectiveActionRecord>(`/holds/${holdId}/corrective-action`, input);

export const useRecordCorrectiveAction = (holdId: number) =>
  useRefreshingMutation(
    (input: CorrectiveActionInput) => recordCorrectiveAction(holdId, input),
    queryKeys.holds.all,
  );
