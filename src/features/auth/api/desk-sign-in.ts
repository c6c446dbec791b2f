import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DeskSignIn, SessionInfo } from '@shared/schemas/auth';
import { apiPost, rememberSession } from '@/lib/api-client';
import { startSessionView } from './get-session';

export async function deskSignIn(input: DeskSignIn): Promise<SessionInfo> {
  return rememberSession(await apiPost<SessionInfo>('/auth/desk', input));
}

export function useDeskSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deskSignIn,
    onSuccess: (session) => startSessionView(queryClient, session),
  });
}
