import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export const renameKiosk = ({ id, name }: { id: number; name: string }) =>
  apiPost<{ id: number; name: string }>(`/kiosks/${id}/rename`, { name });

export const useRenameKiosk = () => useRefreshingMutation(renameKiosk, queryKeys.kiosks);
