import type { CreateBoardLinkInput } from '@shared/schemas/board-links';
import type { BoardLinkCreated } from '@shared/schemas/board-links';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export const createBoardLink = (input: CreateBoardLinkInput) =>
  apiPost<BoardLinkCreated>('/board-links', input);

export const useCreateBoardLink = () => useRefreshingMutation(createBoardLink, queryKeys.boardLinks);
