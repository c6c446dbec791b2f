import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CountersignInput } from '@shared/schemas/holds';
import type { HoldDetail } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { holdQueryOptions } from './get-hold';
import { holdsQueryOptions } from './get-holds';

export const countersignHold = (holdId: number, input: CountersignInput) =>
  apiPost<HoldDetail>(`/holds/${holdId}/countersign`, input);

export function useCountersignHold(holdId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CountersignInput) => countersignHold(holdId, input),
    onSuccess: (detail) => {
      queryClient.setQueryData(holdQueryOptions(holdId).queryKey, detail);
      void queryClient.invalidateQueries({ queryKey: holdsQueryOptions().queryKey });
    },
  });
}
