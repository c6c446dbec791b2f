import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { KioskSignIn, SessionInfo } from '@shared/schemas/auth';
import { apiPost, rememberSession } from '@/lib/api-client';
import { sessionQueryOptions } from './get-session';

export async function kioskSignIn(input: KioskSignIn): Promise<SessionInfo> {
  return rememberSession(await apiPost<SessionInfo>('/auth/kiosk', input));
}

export function useKioskSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: kioskSignIn,
    onSuccess: (session) => {
      // Whatever was cached belongs to the previous person's view.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== 'session' });
      queryClient.setQueryData(sessionQueryOptions().queryKey, session);
    },
  });
}
