import type { BoardLinkInfo } from '@shared/schemas/board-links';
import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export const revokeBoardLink = (id: number) => apiPost<BoardLinkInfo>(`/board-links/${id}/revoke`);

export const useRevokeBoardLink = () => useRefreshingMutation(revokeBoardLink, queryKeys.boardLinks);
