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

/** A new tablet, with the base it will stand at (a base code) or none. */
export const createKiosk = ({ name, base }: { name: string; base: string | null }) =>
  apiPost<KioskEnrolment>('/kiosks', base ? { name, base } : { name });

export const useCreateKiosk = () => useRefreshingMutation(createKiosk, queryKeys.kiosks);
