import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BoardLinkInfo } from '@shared/schemas/board-links';
import { apiPost } from '@/lib/api-client';
import { boardLinksQueryOptions } from './get-board-links';

export const revokeBoardLink = (id: number) => apiPost<BoardLinkInfo>(`/board-links/${id}/revoke`);

export function useRevokeBoardLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeBoardLink,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: boardLinksQueryOptions().queryKey }),
  });
}
