import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SessionInfo } from '@shared/schemas/auth';
import { apiPost, rememberSession } from '@/lib/api-client';
import { getSession, sessionQueryOptions } from './get-session';

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
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== 'session' });
      if (session) queryClient.setQueryData(sessionQueryOptions().queryKey, session);
      else void queryClient.invalidateQueries({ queryKey: sessionQueryOptions().queryKey });
    },
  });
}
