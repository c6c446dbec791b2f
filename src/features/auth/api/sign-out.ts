import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionInfo } from '@shared/schemas/auth';
import { apiPost, rememberSession } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { getSession, startSessionView } from './get-session';

export async function signOut(): Promise<SessionInfo> {
  try {
    return rememberSession(await apiPost<SessionInfo>('/auth/sign-out'));
  } catch {
    // Already signed out on the server (idle) or unreachable: the screen still locks; ask for the real state.
    return getSession();
  }
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSettled: (session) => {
      if (session) startSessionView(queryClient, session);
      else {
        queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== queryKeys.session[0] });
        void queryClient.invalidateQueries({ queryKey: queryKeys.session });
      }
    },
  });
}
