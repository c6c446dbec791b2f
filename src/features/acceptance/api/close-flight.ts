import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CloseFlightInput, UsageEntry } from '@shared/schemas/usage';
import { apiPost } from '@/lib/api-client';
import { acceptanceViewQueryOptions } from './get-acceptance-view';

export const closeFlight = (airframeId: number, input: CloseFlightInput) =>
  apiPost<UsageEntry>(`/airframes/${airframeId}/flight-close`, input);

export function useCloseFlight(airframeId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CloseFlightInput) => closeFlight(airframeId, input),
    onSettled: () =>
      void queryClient.invalidateQueries({ queryKey: acceptanceViewQueryOptions(airframeId).queryKey }),
  });
}
