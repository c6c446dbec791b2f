import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import type { AuthorisationView, GrantAuthorisationInput } from '@shared/schemas/staff';
import { staffQueryOptions } from './staff';

export const authorisationsQueryOptions = (staffId: number) =>
  queryOptions({
    queryKey: [...staffQueryOptions().queryKey, staffId, 'authorisations'] as const,
    queryFn: ({ signal }) => apiGet<AuthorisationView[]>(`/staff/${staffId}/authorisations`, signal),
  });
export const useAuthorisations = (staffId: number) => useQuery(authorisationsQueryOptions(staffId));

function useAuthorisationMutation<I, O>(staffId: number, fn: (input: I) => Promise<O>) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () => void qc.invalidateQueries({ queryKey: authorisationsQueryOptions(staffId).queryKey }),
  });
}

export const useGrantAuthorisation = (staffId: number) =>
  useAuthorisationMutation(staffId, (input: GrantAuthorisationInput) =>
    apiPost<AuthorisationView>(`/staff/${staffId}/authorisations`, input),
  );
export const useRevokeAuthorisation = (staffId: number) =>
  useAuthorisationMutation(staffId, (authorisationId: number) =>
    apiPost<AuthorisationView>(`/staff/${staffId}/authorisations/${authorisationId}/revoke`),
  );
