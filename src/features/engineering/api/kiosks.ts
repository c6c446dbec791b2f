import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiGet, apiPost, ApiRequestError } from '../../../lib/api-client';

export interface KioskRow {
  id: number;
  name: string;
  state: 'enrolled' | 'awaiting_enrolment' | 'revoked';
  enrolledAt: string | null;
  lastSeenAt: string | null;
  revokedAt: string | null;
}

export interface BoardLinkRow {
  id: number;
  name: string;
  createdAt: string;
  createdBy: string;
  revokedAt: string | null;
  lastSeenAt: string | null;
}

export const deskKiosksQueryOptions = () =>
  queryOptions({
    queryKey: ['kiosks'] as const,
    queryFn: ({ signal }) => apiGet<KioskRow[]>('/kiosks', signal),
  });
export const useDeskKiosks = () => useQuery(deskKiosksQueryOptions());

/** Board links come from another feature's API; until it exists the page shows tablets only. */
export const boardLinksQueryOptions = () =>
  queryOptions({
    queryKey: ['board-links'] as const,
    queryFn: async ({ signal }) => {
      try {
        return await apiGet<BoardLinkRow[]>('/board-links', signal);
      } catch (err) {
        if (err instanceof ApiRequestError && err.status === 404) return null;
        throw err;
      }
    },
  });
export const useBoardLinks = () => useQuery(boardLinksQueryOptions());

export function useRenameKiosk() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, name }: { id: number; name: string }) =>
      apiPost<{ id: number; name: string }>(`/kiosks/${id}/rename`, { name }),
    onSuccess: () => void qc.invalidateQueries({ queryKey: deskKiosksQueryOptions().queryKey }),
  });
}

export function useRevokeDeskKiosk() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiPost(`/kiosks/${id}/revoke`),
    onSuccess: () => void qc.invalidateQueries({ queryKey: deskKiosksQueryOptions().queryKey }),
  });
}

export function useRevokeBoardLink() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiPost(`/board-links/${id}/revoke`),
    onSuccess: () => void qc.invalidateQueries({ queryKey: boardLinksQueryOptions().queryKey }),
  });
}
