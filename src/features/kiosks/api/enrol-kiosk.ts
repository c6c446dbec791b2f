import { useMutation, useQueryClient } from '@tanstack/react-query';
import { queryKeys } from '@/lib/query-keys';
import { apiPost } from '@/lib/api-client';

export const enrolKiosk = (code: string) =>
  apiPost<{ kiosk: { id: number; name: string } }>('/kiosks/enrol', { code });

export function useEnrolKiosk() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: enrolKiosk,
    // The session answer carries `kiosk`; it changes with the new device cookie.
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: queryKeys.session }),
  });
}
