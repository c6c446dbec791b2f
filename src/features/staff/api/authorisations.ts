import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';
import type { AuthorisationView, GrantAuthorisationInput } from '@shared/schemas/staff';

export const authorisationsQueryOptions = (staffId: number) =>
  queryOptions({
    queryKey: queryKeys.staff.authorisations(staffId),
    queryFn: ({ signal }) => apiGet<AuthorisationView[]>(`/staff/${staffId}/authorisations`, signal),
  });
export const useAuthorisations = (staffId: number) => useQuery(authorisationsQueryOptions(staffId));

export const useGrantAuthorisation = (staffId: number) =>
  useRefreshingMutation(
    (input: GrantAuthorisationInput) => apiPost<AuthorisationView>(`/staff/${staffId}/authorisations`, input),
    queryKeys.staff.authorisations(staffId),
  );
export const useRevokeAuthorisation = (staffId: number) =>
  useRefreshingMutation(
    (authorisationId: number) =>
      apiPost<AuthorisationView>(`/staff/${staffId}/authorisations/${authorisationId}/revoke`),
    queryKeys.staff.authorisations(staffId),
  );
