import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { SubmitCheck } from '@shared/schemas/checks';
import type { StoredCheck } from '@shared/schemas/checks';
import { queryKeys } from '@/lib/query-keys';
import { apiPost } from '@/lib/api-client';
import { checkQueryOptions } from './get-check';

export const submitCheck = (input: SubmitCheck) => apiPost<StoredCheck>('/checks', input);

/** The server has the record: show it from the cache and refresh every airframe's state. */
export function rememberStoredCheck(queryClient: QueryClient, stored: StoredCheck): void {
  queryClient.setQueryData(checkQueryOptions(stored.id).queryKey, stored);
  // Every airframe query (the fleet list, the board, this airframe and its cards): the state changed with this record.
  void queryClient.invalidateQueries({ queryKey: queryKeys.airframes.all });
}

export function useSubmitCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: submitCheck,
    onSuccess: (stored) => rememberStoredCheck(queryClient, stored),
  });
}
