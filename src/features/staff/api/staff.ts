import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet, apiPost } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { useRefreshingMutation } from '@/lib/refreshing-mutation';
import type { BadgeCard, StaffEdit, StaffInput, StaffMember, TemporaryPin } from '@shared/schemas/staff';

export const staffQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.staff.all,
    queryFn: ({ signal }) => apiGet<StaffMember[]>('/staff', signal),
  });
export const useStaff = () => useQuery(staffQueryOptions());

export const badgeCardsQueryOptions = (ids: number[] | null) =>
  queryOptions({
    queryKey: queryKeys.staff.badgeCards(ids),
    queryFn: ({ signal }) =>
      apiGet<BadgeCard[]>(`/staff/badge-cards${ids ? `?ids=${ids.join(',')}` : ''}`, signal),
  });
export const useBadgeCards = (ids: number[] | null) => useQuery(badgeCardsQueryOptions(ids));

const useStaffMutation = <I, O>(fn: (input: I) => Promise<O>) =>
  useRefreshingMutation(fn, queryKeys.staff.all);

export const useCreateStaff = () =>
  useStaffMutation((input: StaffInput) => apiPost<TemporaryPin>('/staff', input));
export const useEditStaff = () =>
  useStaffMutation(({ id, input }: { id: number; input: StaffEdit }) =>
    apiPost<StaffMember>(`/staff/${id}`, input),
  );
export const useResetPin = () =>
  useStaffMutation((id: number) => apiPost<TemporaryPin>(`/staff/${id}/reset-pin`));
export const useDeactivateStaff = () =>
  useStaffMutation((id: number) => apiPost<StaffMember>(`/staff/${id}/deactivate`));
/** Lifts a badge's lock before its time runs out; the server records who did it in the audit trail. */
export const useUnlockStaff = () =>
  useStaffMutation((id: number) => apiPost<StaffMember>(`/staff/${id}/unlock`));
