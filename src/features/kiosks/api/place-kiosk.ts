import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

/** Moves a tablet to a base (a base code), or off any base with null. */
export const placeKiosk = ({ id, base }: { id: number; base: string | null }) =>
  apiPost<{ id: number; name: string }>(`/kiosks/${id}/base`, { base });

export const usePlaceKiosk = () => useRefreshingMutation(placeKiosk, queryKeys.kiosks);
