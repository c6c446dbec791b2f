import type { CountersignInput } from '@shared/schemas/holds';
import type { HoldDetail } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { useSignOnce } from '@/lib/sign-once';
import { useHoldAct } from './hold-act';

export const countersignHold = (holdId: number, input: CountersignInput) =>
  apiPost<HoldDetail>(`/holds/${holdId}/countersign`, input);

export function useCountersignHold(holdId: number) {
  const sign = useSignOnce((input: CountersignInput, requestId) =>
    countersignHold(holdId, { ...input, requestId }),
  );
  return useHoldAct(holdId, sign);
}
