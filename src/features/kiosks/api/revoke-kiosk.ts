import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import { kiosksQueryOptions } from './get-kiosks';

export const revokeKiosk = (id: number) =>
  apiPost<{ id: number; name: string; revokedAt: string }>(`/kiosks/${id}/revoke`);

export function useRevokeKiosk() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeKiosk,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: kiosksQueryOptions().queryKey }),
  });
}
