import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CorrectiveActionInput } from '@shared/schemas/holds';
import type { CorrectiveActionRecord } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { holdsQueryOptions } from './get-holds';

export const recordCorrectiveAction = (holdId: number, input: CorrectiveActionInput) =>
  apiPost<CorrectiveActionRecord>(`/holds/${holdId}/corrective-action`, input);

export function useRecordCorrectiveAction(holdId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CorrectiveActionInput) => recordCorrectiveAction(holdId, input),
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: holdsQueryOptions().queryKey }),
  });
}
