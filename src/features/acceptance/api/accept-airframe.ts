import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptanceRecord } from '@shared/schemas/acceptance';
import { apiPost } from '@/lib/api-client';
import { useSignOnce } from '@/lib/sign-once';
import { acceptanceViewQueryOptions } from './get-acceptance-view';

export const acceptAirframe = (airframeId: number, pin: string, requestId?: string) =>
  apiPost<AcceptanceRecord>(`/airframes/${airframeId}/accept`, { pin, requestId });

export function useAcceptAirframe(airframeId: number) {
  const queryClient = useQueryClient();
  const sign = useSignOnce((pin: string, requestId) => acceptAirframe(airframeId, pin, requestId));
  return useMutation({
    mutationFn: sign,
    onSettled: () =>
      void queryClient.invalidateQueries({ queryKey: acceptanceViewQueryOptions(airframeId).queryKey }),
  });
}
