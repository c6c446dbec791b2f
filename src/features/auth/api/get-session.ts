import { queryKeys } from '@/lib/query-keys';
import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import type { SessionInfo } from '@shared/schemas/auth';
import { ApiRequestError, apiGet, rememberSession } from '@/lib/api-client';

export async function getSession(): Promise<SessionInfo> {
  try {
    return rememberSession(await apiGet<SessionInfo>('/session'));
  } catch (error) {
    // The server ends an idle session on the request that finds it idle, so the next ask gets the signed-out state.
    if (error instanceof ApiRequestError && error.status === 401)
      return rememberSession(await apiGet<SessionInfo>('/session'));
    throw error;
  }
}

export const sessionQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.session,
    queryFn: getSession,
    staleTime: 30_000,
  });

export const useSession = () => useQuery(sessionQueryOptions());

/** Whatever was cached belongs to the previous person's view: keep only the session, now this one. */
export function startSessionView(queryClient: QueryClient, session: SessionInfo): void {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== queryKeys.session[0] });
  queryClient.setQueryData(queryKeys.session, session);
}
