import { useMutation, useQueryClient } from '@tanstack/react-query';
import i18next from 'i18next';
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
    onSuccess: async (session) => {
      // The badge's own language before its first screen, so that screen does not flash in the tablet's.
      const preferred = session.user?.preferredLanguage;
      if (preferred) await i18next.changeLanguage(preferred);
      startSessionView(queryClient, session);
    },
  });
}
