import { queryOptions, useQuery } from '@tanstack/react-query';
import { queryKeys } from '@/lib/query-keys';
import { apiGet } from '@/lib/api-client';

export interface KioskTablet {
  id: number;
  name: string;
  /** The base the tablet stands at: its airframe list shows that base first. */
  base: { code: string; name: string } | null;
  state: 'enrolled' | 'awaiting_enrolment' | 'link_expired' | 'revoked';
  enrolledAt: string | null;
  lastSeenAt: string | null;
  revokedAt: string | null;
  enrolExpiresAt: string | null;
}

export const getKiosks = (signal?: AbortSignal) => apiGet<KioskTablet[]>('/kiosks', signal);

export const kiosksQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.kiosks, queryFn: ({ signal }) => getKiosks(signal) });

export const useKiosks = () => useQuery(kiosksQueryOptions());
