import { apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';

export interface KioskEnrolment {
  id: number;
  name: string;
  code: string;
  enrolPath: string;
  expiresAt: string;
}

export const createKiosk = (name: string) => apiPost<KioskEnrolment>('/kiosks', { name });

export const useCreateKiosk = () => useRefreshingMutation(createKiosk, queryKeys.kiosks);
