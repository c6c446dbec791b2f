import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import { kiosksQueryOptions } from './get-kiosks';

export const renameKiosk = ({ id, name }: { id: number; name: string }) =>
  apiPost<{ id: number; name: string }>(`/kiosks/${id}/rename`, { name });

export function useRenameKiosk() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: renameKiosk,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: kiosksQueryOptions().queryKey }),
  });
}
