import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateBoardLinkInput } from '@shared/schemas/board-links';
import type { BoardLinkCreated } from '@shared/schemas/board-links';
import { apiPost } from '@/lib/api-client';
import { boardLinksQueryOptions } from './get-board-links';

export const createBoardLink = (input: CreateBoardLinkInput) =>
  apiPost<BoardLinkCreated>('/board-links', input);

export function useCreateBoardLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBoardLink,
    onSuccess: () => void queryClient.invalidateQueries({ queryKey: boardLinksQueryOptions().queryKey }),
  });
}
