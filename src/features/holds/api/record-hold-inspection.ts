import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InspectionInput } from '@shared/schemas/defects';
import type { HoldDetail } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { holdQueryOptions } from './get-hold';
import { holdsQueryOptions } from './get-holds';

export const recordHoldInspection = (holdId: number, input: InspectionInput) =>
  apiPost<HoldDetail>(`/holds/${holdId}/inspection`, input);

export function useRecordHoldInspection(holdId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: InspectionInput) => recordHoldInspection(holdId, input),
    onSuccess: (detail) => {
      queryClient.setQueryData(holdQueryOptions(holdId).queryKey, detail);
      void queryClient.invalidateQueries({ queryKey: holdsQueryOptions().queryKey });
    },
  });
}
