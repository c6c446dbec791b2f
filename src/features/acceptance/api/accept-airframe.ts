import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AcceptanceRecord } from '@shared/schemas/acceptance';
import { apiPost } from '@/lib/api-client';
import { acceptanceViewQueryOptions } from './get-acceptance-view';

export const acceptAirframe = (airframeId: number, pin: string) =>
  apiPost<AcceptanceRecord>(`/airframes/${airframeId}/accept`, { pin });

export function useAcceptAirframe(airframeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (pin: string) => acceptAirframe(airframeId, pin),
    onSettled: () =>
      void queryClient.invalidateQueries({ queryKey: acceptanceViewQueryOptions(airframeId).queryKey }),
  });
}
