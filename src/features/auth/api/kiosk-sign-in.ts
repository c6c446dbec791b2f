import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { KioskSignIn, SessionInfo } from '@shared/schemas/auth';
import { apiPost, rememberSession } from '@/lib/api-client';
import { startSessionView } from './get-session';

export async function kioskSignIn(input: KioskSignIn): Promise<SessionInfo> {
  return rememberSession(await apiPost<SessionInfo>('/auth/kiosk', input));
}

export function useKioskSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: kioskSignIn,
    onSuccess: (session) => startSessionView(queryClient, session),
  });
}
