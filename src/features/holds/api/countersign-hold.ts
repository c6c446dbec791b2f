import type { CountersignInput } from '@shared/schemas/holds';
import type { HoldDetail } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { useHoldAct } from './hold-act';

export const countersignHold = (holdId: number, input: CountersignInput) =>
  apiPost<HoldDetail>(`/holds/${holdId}/countersign`, input);

export const useCountersignHold = (holdId: number) =>
  useHoldAct(holdId, (input: CountersignInput) => countersignHold(holdId, input));
