import type { InspectionInput } from '@shared/schemas/defects';
import type { HoldDetail } from '@shared/schemas/holds';
import { apiPost } from '@/lib/api-client';
import { useHoldAct } from './hold-act';

export const recordHoldInspection = (holdId: number, input: InspectionInput) =>
  apiPost<HoldDetail>(`/holds/${holdId}/inspection`, input);

export const useRecordHoldInspection = (holdId: number) =>
  useHoldAct(holdId, (input: InspectionInput) => recordHoldInspection(holdId, input));
