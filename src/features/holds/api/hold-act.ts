import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoldDetail } from '@shared/schemas/holds';
import { queryKeys } from '@/lib/query-keys';

/** An act on a hold answers with the hold as it now stands: show that, and let the queue fetch again. */
export function useHoldAct<I>(holdId: number, act: (input: I) => Promise<HoldDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: act,
    onSuccess: (detail) => {
      queryClient.setQueryData(queryKeys.holds.one(holdId), detail);
      void queryClient.invalidateQueries({ queryKey: queryKeys.holds.all });
    },
  });
}
