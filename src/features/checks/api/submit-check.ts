import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { SubmitCheck } from '@shared/schemas/checks';
import type { StoredCheck } from '@shared/schemas/checks';
import { apiPost } from '@/lib/api-client';
import { checkCardQueryOptions } from './get-check-card';
import { checkQueryOptions } from './get-check';

export const submitCheck = (input: SubmitCheck) => apiPost<StoredCheck>('/checks', input);

/** The server has the record: show it from the cache and refresh every airframe's state. */
export function rememberStoredCheck(queryClient: QueryClient, stored: StoredCheck): void {
  queryClient.setQueryData(checkQueryOptions(stored.id).queryKey, stored);
  // ['airframes'] covers the fleet list, this airframe and its cards: the state changed with this record.
  void queryClient.invalidateQueries({
    queryKey: checkCardQueryOptions(stored.airframe.id, stored.kind).queryKey.slice(0, 1),
  });
}

export function useSubmitCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: submitCheck,
    onSuccess: (stored) => rememberStoredCheck(queryClient, stored),
  });
}
