import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export const revokeKiosk = (id: number) =>
  apiPost<{ id: number; name: string; revokedAt: string }>(`/kiosks/${id}/revoke`);

export const useRevokeKiosk = () => useRefreshingMutation(revokeKiosk, queryKeys.kiosks);
